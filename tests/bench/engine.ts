/**
 * Timing of the full two-sign spectral audit (every edge, budgets confirmed) on seeded random
 * networks with about five edges per node: the fast path (rank-one reduction, the default) and the
 * exact path (a full eigen-solve per point), and their ratio where both ran.
 *
 *   npm run bench:engine                              # fast at N = 100, 200, 400; exact at 50, 100
 *   npm run bench:engine -- --fast 100,200 --exact 50 --seed 7
 *   npm run bench:engine -- --exact none              # skip the slow exact runs
 *   npm run bench:engine -- --sizes 25,50             # both paths at the same sizes
 *
 * Figures are printed as each run finishes; progress goes to stderr. Speed targets are not tests.
 */
import { analyseBaseline, auditNetwork, randomNetwork, type ResponseClass, type SweepMethod } from '@/lib/spectral';

function option(name: string): string | undefined {
  const argv = process.argv.slice(2);
  const i = argv.findIndex((a) => a === name || a.startsWith(`${name}=`));
  if (i < 0) return undefined;
  return argv[i].includes('=') ? argv[i].slice(argv[i].indexOf('=') + 1) : argv[i + 1];
}

function sizeList(value: string | undefined, fallback: string): number[] {
  const text = value ?? fallback;
  if (text === 'none') return [];
  return text.split(',').map((s) => Number(s.trim()));
}

const both = option('--sizes');
const fastSizes = sizeList(option('--fast') ?? both, '100,200,400');
const exactSizes = sizeList(option('--exact') ?? both, '50,100');
const seed = Number(option('--seed') ?? 1);
if ([...fastSizes, ...exactSizes].some((n) => !Number.isInteger(n) || n < 2) || !Number.isFinite(seed)) {
  process.stderr.write('usage: npm run bench:engine -- [--fast 100,200,400|none] [--exact 50,100|none] [--sizes N,…] [--seed 1]\n');
  process.exit(2);
}

interface Run {
  seconds: number;
  edges: number;
}

function run(n: number, method: SweepMethod): Run {
  const network = randomNetwork({ nodes: n, seed, edgesPerNode: 5 });
  const t0 = performance.now();
  const baseline = analyseBaseline(network, { method });
  const tBase = performance.now() - t0;
  let lastShown = 0;
  const result = auditNetwork(network, { method }, {
    onProgress(done, total) {
      const pct = Math.floor((100 * done) / total);
      if (pct >= lastShown + 10 || done === total) {
        lastShown = pct;
        process.stderr.write(`  ${method} N=${n}: ${done}/${total} edges, ${((performance.now() - t0) / 1000).toFixed(1)} s\n`);
      }
    },
  });
  // auditNetwork builds its own baseline: the audit time below includes it, as a caller sees it.
  const total = performance.now() - t0 - tBase;
  const classes = new Map<ResponseClass, number>();
  let checks = 0;
  for (const e of result.edges) {
    checks += e.budget.checks;
    for (const side of [e.plus, e.minus]) if (side) classes.set(side.class, (classes.get(side.class) ?? 0) + 1);
  }
  const fast = baseline.fast;
  console.log(
    [
      `${method.padEnd(5)} N=${n}`,
      `edges=${network.edges.length}`,
      `audit=${(total / 1000).toFixed(2)} s`,
      `(baseline ${(tBase / 1000).toFixed(2)} s)`,
      `per edge=${(total / network.edges.length).toFixed(2)} ms`,
      method === 'fast' ? `fallbacks=${result.fallbacks}` : '',
      method === 'fast' && fast?.ok ? `core=${fast.core.size} ‖P²−P‖=${fast.core.projectorDefect.toExponential(1)}` : '',
      method === 'fast' && fast && !fast.ok ? `fast path off: ${fast.reason}` : '',
      `budget checks=${checks}`,
      `classes: ${[...classes].map(([c, k]) => `${c} ${k}`).join(', ')}`,
    ]
      .filter(Boolean)
      .join('  '),
  );
  return { seconds: total / 1000, edges: network.edges.length };
}

console.log(`spectral engine bench — seed ${seed}, ~5 edges per node, default ladder (11 points per sign), both signs`);
const fastRuns = new Map<number, Run>();
const exactRuns = new Map<number, Run>();
for (const n of fastSizes) fastRuns.set(n, run(n, 'fast'));
for (const n of exactSizes) exactRuns.set(n, run(n, 'exact'));
for (const [n, exact] of exactRuns) {
  const fast = fastRuns.get(n) ?? run(n, 'fast');
  console.log(`ratio N=${n}: exact ${exact.seconds.toFixed(2)} s / fast ${fast.seconds.toFixed(2)} s = ${(exact.seconds / fast.seconds).toFixed(0)}×`);
}
