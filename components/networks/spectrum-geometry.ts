import type { VersionSummary } from '@/lib/schemas/network';

export interface SpectrumPoint {
  re: number;
  im: number;
  index: number;
  role: 'zero' | 'cluster' | 'other';
}

/**
 * Marks the eigenvalues for drawing: the one nearest 0 (the consensus mode)
 * and the `cluster.size` nearest λ2's centre. Pure, so it is tested alone.
 */
export function markSpectrum(summary: Pick<VersionSummary, 'spectrum' | 'lambda2' | 'cluster' | 'rooted'>): SpectrumPoint[] {
  const pts: SpectrumPoint[] = summary.spectrum.map((z, index) => ({ ...z, index, role: 'other' }));
  if (pts.length === 0) return pts;
  const zero = pts.reduce((best, p) => (Math.hypot(p.re, p.im) < Math.hypot(best.re, best.im) ? p : best));
  zero.role = 'zero';
  const c = summary.lambda2;
  const rest = pts.filter((p) => p !== zero).sort((a, b) => Math.hypot(a.re - c.re, a.im - c.im) - Math.hypot(b.re - c.re, b.im - c.im));
  for (const p of rest.slice(0, Math.max(1, summary.cluster.size))) p.role = 'cluster';
  return pts;
}

/** Round tick positions covering [lo, hi] (about `count` of them). */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step) out.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return out;
}
