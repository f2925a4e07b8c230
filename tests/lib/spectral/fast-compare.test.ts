/**
 * Issue 7 acceptance: the fast path agrees with the exact path on networks the code has not seen —
 * random N = 50 … 200 and Jordan-2/Jordan-3 cores embedded in 100-node networks: identical classes
 * and flags, the same points following λ2, λ2(ε) within 1e-9 (simple λ2) or 1e-7 (defective
 * cluster; see compare.ts for how the exact path's own noise enters), budgets alike. Run in a child
 * process (fast-compare-run.ts) for speed; the figures are printed for the record.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { REPO } from './cli-run';
import type { FastCompareReport as Report } from './fast-compare-report';

let reports: Report[] = [];

beforeAll(() => {
  const tsx = path.join(REPO, 'node_modules', '.bin', 'tsx');
  const run = spawnSync(tsx, [path.join(__dirname, 'fast-compare-run.ts')], {
    cwd: REPO,
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
    timeout: 600_000,
  });
  expect(run.stderr).toBe('');
  expect(run.status).toBe(0);
  reports = JSON.parse(run.stdout) as Report[];
  // For the record (bench figures live in tests/bench).
  process.stdout.write(
    reports
      .map(
        (r) =>
          `${r.name}: ${r.compared} edges compared, max |Δ diff| ${r.maxUsedDiff.toExponential(1)} (clean ${r.maxCleanDiff.toExponential(1)}), ` +
          `budget rel ${r.maxBudgetRelDiff.toExponential(1)}, core ${r.coreSize}, ‖P²−P‖ ${r.projectorDefect.toExponential(1)}, ` +
          `fallbacks ${r.fallbacks}/${r.points} points over ${r.edges} edges, fast ${r.fastSeconds.toFixed(2)} s, exact ${r.exactSeconds.toFixed(1)} s for ${r.compared} edges\n`,
      )
      .join(''),
  );
}, 600_000);

describe('fast path against exact path on unseen networks', () => {
  it('covers random N = 50 … 200 and Jordan-2 and Jordan-3 cores in 100-node networks', () => {
    expect(reports.map((r) => r.name)).toEqual([
      'random N = 50 (seed 7001)',
      'random N = 100 (seed 7002)',
      'random N = 150 (seed 7003)',
      'random N = 200 (seed 7004)',
      'Jordan-2 chain core in N = 100 (seed 7101)',
      'Jordan-2 cycle core in N = 100 (seed 7102)',
      'Jordan-3 chain core in N = 100 (seed 7103)',
      'Jordan-3 cycle core in N = 100 (seed 7104)',
    ]);
    const cores = reports.filter((r) => r.name.startsWith('Jordan'));
    expect(cores.map((r) => [r.defective, r.clusterSize])).toEqual([
      [true, 2],
      [true, 2],
      [true, 3],
      [true, 3],
    ]);
  });

  it('identical classes, flags and tracked points; λ2(ε) and budgets within tolerance', () => {
    expect(reports.flatMap((r) => r.issues.map((m) => `${r.name} ${m}`))).toEqual([]);
    for (const r of reports) {
      if (r.defective) expect(r.maxCleanDiff).toBeLessThanOrEqual(1e-7);
      else expect(r.maxUsedDiff).toBeLessThanOrEqual(1e-9);
    }
  });

  it('the spectral projector of the λ2 cluster is idempotent to rounding', () => {
    for (const r of reports) expect(r.projectorDefect).toBeLessThan(1e-12);
  });

  it('fallbacks are counted and rare (under 1 % of all points)', () => {
    for (const r of reports) {
      expect(Number.isInteger(r.fallbacks)).toBe(true);
      expect(r.fallbacks).toBeLessThan(0.01 * r.points);
    }
  });
});
