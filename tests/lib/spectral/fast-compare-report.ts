/**
 * One network's line of the JSON document that fast-compare-run.ts prints and fast-compare.test.ts
 * reads back from the child process. The document crosses a process boundary untyped, so both
 * sides name this one shape: a field renamed on one side then fails to compile instead of reading
 * as undefined in the test.
 */
export interface FastCompareReport {
  name: string;
  nodes: number;
  edges: number;
  compared: number;
  defective: boolean;
  clusterSize: number;
  coreSize: number;
  projectorDefect: number;
  issues: string[];
  maxDiff: number;
  maxUsedDiff: number;
  maxCleanDiff: number;
  maxBudgetRelDiff: number;
  fallbacksCompared: number;
  /** Whole-network fast audit. */
  fallbacks: number;
  points: number;
  fastSeconds: number;
  exactSeconds: number;
}
