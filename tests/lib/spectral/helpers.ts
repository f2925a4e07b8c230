/** Small builders shared by the spectral tests (not a test file itself). */
import type { Complex, SpectralNetwork } from '@/lib/spectral';

export type EdgeRow = [source: string, target: string, weight: number];

/** A network from edge rows; nodes in order of first appearance unless given. */
export function net(rows: EdgeRow[], nodes?: string[]): SpectralNetwork {
  const names = nodes ?? [...new Set(rows.flatMap(([s, t]) => [s, t]))];
  return { nodes: names, edges: rows.map(([source, target, weight]) => ({ source, target, weight })) };
}

export function edgeIndex(network: SpectralNetwork, source: string, target: string): number {
  const i = network.edges.findIndex((e) => e.source === source && e.target === target);
  if (i < 0) throw new Error(`no edge ${source} → ${target}`);
  return i;
}

/**
 * Greedy matching of two eigenvalue lists; returns the largest distance between matched pairs.
 * (Order-free comparison of spectra.)
 */
export function spectrumDistance(a: Complex[], b: Complex[]): number {
  if (a.length !== b.length) return Infinity;
  const left = [...b];
  let worst = 0;
  for (const x of a) {
    let best = 0;
    for (let j = 1; j < left.length; j++) {
      if (Math.hypot(left[j].re - x.re, left[j].im - x.im) < Math.hypot(left[best].re - x.re, left[best].im - x.im)) best = j;
    }
    worst = Math.max(worst, Math.hypot(left[best].re - x.re, left[best].im - x.im));
    left.splice(best, 1);
  }
  return worst;
}

export function relErr(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

/** Rank of a small dense matrix (row-major, n×n) by Gaussian elimination with partial pivoting. */
export function rank(flat: number[], n: number, tol = 1e-9): number {
  const a = Array.from({ length: n }, (_, i) => flat.slice(i * n, i * n + n));
  let r = 0;
  for (let c = 0; c < n && r < n; c++) {
    let p = r;
    for (let i = r + 1; i < n; i++) if (Math.abs(a[i][c]) > Math.abs(a[p][c])) p = i;
    if (Math.abs(a[p][c]) <= tol) continue;
    [a[r], a[p]] = [a[p], a[r]];
    for (let i = r + 1; i < n; i++) {
      const f = a[i][c] / a[r][c];
      for (let j = c; j < n; j++) a[i][j] -= f * a[r][j];
    }
    r += 1;
  }
  return r;
}

/** L − μI as a new flat array. */
export function shifted(flat: number[], n: number, mu: number): number[] {
  return flat.map((v, k) => (Math.floor(k / n) === k % n ? v - mu : v));
}
