/**
 * Timing of the brute-force spectral audit (both signs, every edge, budgets confirmed) on seeded
 * random networks with about five edges per node.
 *
 *   npm run bench:engine                 # N = 25, 50, 100
 *   npm run bench:engine -- --sizes 25,50 --seed 7
 *
 * Figures are printed as each size finishes; progress goes to stderr. Speed targets are not tests.
 */
import { analyseBaseline, auditNetwork, randomNetwork, type ResponseClass } from '@/lib/spectral';

function option(name: string): string | undefined {
  const argv = process.argv.slice(2);
  const i = argv.findIndex((a) => a === name || a.startsWith(`${name}=`));
  if (i < 0) return undefined;
  return argv[i].includes('=') ? argv[i].slice(argv[i].indexOf('=') + 1) : argv[i + 1];
}

const sizes = (option('--sizes') ?? '25,50,100').split(',').map((s) => Number(s.trim()));
const seed = Number(option('--seed') ?? 1);
if (sizes.some((n) => !Number.isInteger(n) || n < 2) || !Number.isFinite(seed)) {
  process.stderr.write('usage: npm run bench:engine -- [--sizes 25,50,100] [--seed 1]\n');
  process.exit(2);
}

console.log(`spectral engine bench — seed ${seed}, ~5 edges per node, default ladder (11 points per sign)`);
for (const n of sizes) {
  const network = randomNetwork({ nodes: n, seed, edgesPerNode: 5 });
  const t0 = performance.now();
  const baseline = analyseBaseline(network);
  const tBase = performance.now() - t0;
  let lastShown = 0;
  const t1 = performance.now();
  const result = auditNetwork(network, {}, {
    onProgress(done, total) {
      const pct = Math.floor((100 * done) / total);
      if (pct >= lastShown + 10 || done === total) {
        lastShown = pct;
        process.stderr.write(`  N=${n}: ${done}/${total} edges, ${((performance.now() - t1) / 1000).toFixed(1)} s\n`);
      }
    },
  });
  const tAudit = performance.now() - t1;
  const classes = new Map<ResponseClass, number>();
  let checks = 0;
  for (const e of result.edges) {
    checks += e.budget.checks;
    for (const side of [e.plus, e.minus]) if (side) classes.set(side.class, (classes.get(side.class) ?? 0) + 1);
  }
  console.log(
    [
      `N=${n}`,
      `edges=${network.edges.length}`,
      `baseline=${tBase.toFixed(0)} ms`,
      `audit=${(tAudit / 1000).toFixed(1)} s`,
      `per edge=${(tAudit / network.edges.length).toFixed(1)} ms`,
      `floor=${baseline.transposeFloor ? 'transpose' : 'condition'}`,
      `budget checks=${checks}`,
      `classes: ${[...classes].map(([c, k]) => `${c} ${k}`).join(', ')}`,
    ].join('  '),
  );
}
