/**
 * A relay grid on the island of Korrin for tests and the load script: `nodes`
 * relays, each heard by the relays 1, 5, 11, 23, 37 and 61 steps round the
 * ring (the first `links` of them), weights seeded so every run sweeps the
 * same network. Over 80 nodes a sweep stores one edge per task, so progress
 * moves one edge at a time.
 */
export function korrinGrid(nodes = 90, links = 6, seed = 20261202): string {
  const rows = ['source,target,weight'];
  let s = seed >>> 0;
  const next = () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
  for (let i = 0; i < nodes; i++) {
    for (const step of [1, 5, 11, 23, 37, 61].slice(0, links)) rows.push(`korrin-${i},korrin-${(i + step) % nodes},${(0.5 + next()).toFixed(4)}`);
  }
  return rows.join('\n');
}
