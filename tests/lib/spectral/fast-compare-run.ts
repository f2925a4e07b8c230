/**
 * Fast path against exact path on networks nothing in the engine was tuned on (fresh seeds of the
 * seeded generators): random networks with N = 50 … 200 and ~5 edges per node, and Jordan-2 and
 * Jordan-3 cores (chain and cycle shapes) embedded in 100-node networks. Prints one JSON document.
 *
 * Run by fast-compare.test.ts in a child process (tsx): the exact path's eigen-solves run several
 * times slower inside jest's module sandbox. Every exact solve is expensive at N = 200 (~0.14 s, 22+
 * per edge), so each network compares a spread of edges — all the core's edges for the Jordan
 * cores — while the fast path also audits every edge of every network, to count its fallbacks.
 */
import { analyseBaseline, auditEdge, jordanCoreNetwork, randomNetwork, type SpectralNetwork } from '@/lib/spectral';
import { compareEdges } from './compare';
import type { FastCompareReport as Report } from './fast-compare-report';

function spread(count: number, total: number): number[] {
  return Array.from({ length: count }, (_, i) => Math.floor(((i + 0.5) * total) / count));
}

function run(name: string, network: SpectralNetwork, edges: number[]): Report {
  const fastBase = analyseBaseline(network);
  const exactBase = analyseBaseline(network, { method: 'exact' });
  const defective = exactBase.cluster.size > 1 && !exactBase.cluster.resolved;
  const report: Report = {
    name,
    nodes: network.nodes.length,
    edges: network.edges.length,
    compared: edges.length,
    defective,
    clusterSize: exactBase.cluster.size,
    coreSize: fastBase.fast?.ok ? fastBase.fast.core.size : 0,
    projectorDefect: fastBase.fast?.ok ? fastBase.fast.core.projectorDefect : NaN,
    issues: [],
    maxDiff: 0,
    maxUsedDiff: 0,
    maxCleanDiff: 0,
    maxBudgetRelDiff: 0,
    fallbacksCompared: 0,
    fallbacks: 0,
    points: 0,
    fastSeconds: 0,
    exactSeconds: 0,
  };
  for (const i of edges) {
    const fast = auditEdge(network, fastBase, i);
    const t0 = performance.now();
    const exact = auditEdge(network, exactBase, i);
    report.exactSeconds += (performance.now() - t0) / 1000;
    const c = compareEdges(fast, exact, defective, !exactBase.transposeFloor);
    report.issues.push(...c.issues.map((m) => `${network.edges[i].source}→${network.edges[i].target}: ${m}`));
    report.maxDiff = Math.max(report.maxDiff, c.maxDiff);
    report.maxUsedDiff = Math.max(report.maxUsedDiff, c.maxUsedDiff);
    report.maxCleanDiff = Math.max(report.maxCleanDiff, c.maxCleanDiff);
    report.maxBudgetRelDiff = Math.max(report.maxBudgetRelDiff, c.budgetRelDiff);
    report.fallbacksCompared += fast.fallbacks ?? 0;
  }
  const t1 = performance.now();
  for (let i = 0; i < network.edges.length; i++) {
    const e = auditEdge(network, fastBase, i);
    report.fallbacks += e.fallbacks ?? 0;
    report.points += (e.plus?.points.length ?? 0) + (e.minus?.points.length ?? 0) + 2 * e.budget.checks;
  }
  report.fastSeconds = (performance.now() - t1) / 1000;
  return report;
}

const reports: Report[] = [];
for (const [nodes, seed, count] of [
  [50, 7001, 10],
  [100, 7002, 6],
  [150, 7003, 3],
  [200, 7004, 2],
] as const) {
  const network = randomNetwork({ nodes, seed, edgesPerNode: 5 });
  reports.push(run(`random N = ${nodes} (seed ${seed})`, network, spread(count, network.edges.length)));
}
for (const [block, shape, seed] of [
  [2, 'chain', 7101],
  [2, 'cycle', 7102],
  [3, 'chain', 7103],
  [3, 'cycle', 7104],
] as const) {
  const network = jordanCoreNetwork({ nodes: 100, block, seed, shape });
  const core = network.edges.flatMap((e, i) => (e.target.startsWith('c') ? [i] : []));
  const fromCore = network.edges.findIndex((e) => e.source.startsWith('c') && e.target.startsWith('d'));
  const downstream = network.edges.findIndex((e) => e.source.startsWith('d') && e.target.startsWith('d'));
  reports.push(run(`Jordan-${block} ${shape} core in N = 100 (seed ${seed})`, network, [...core, fromCore, downstream]));
}
process.stdout.write(`${JSON.stringify(reports)}\n`);
