/**
 * First-order data of a simple λ2 (right eigenvector x, vector z with Lᵀz = λ2·z, their pairing and
 * the condition number) read from the block-diagonal form instead of two extra full
 * eigen-decompositions: x = V_core·e and z = (V⁻¹)_coreᵀ·f with e, f the right and left eigenvectors
 * of the core block A for λ2 (so zᵀx = fᵀe, since V⁻¹V = I).
 */
import type { FastSpectralData, FirstOrderData } from '../types';
import { solveComplexSmall } from './complex-solve';
import { U } from './dense';

function eigenvector(a: number[], m: number, lr: number, li: number, transpose: boolean): { re: Float64Array; im: Float64Array } | null {
  if (m === 1) return { re: Float64Array.of(1), im: Float64Array.of(0) };
  let scale = 0;
  for (const v of a) scale = Math.max(scale, Math.abs(v));
  const mr = new Float64Array(m * m);
  const mi = new Float64Array(m * m);
  for (let r = 0; r < m; r++) for (let c = 0; c < m; c++) mr[r * m + c] = transpose ? a[c * m + r] : a[r * m + c];
  for (let i = 0; i < m; i++) {
    mr[i * m + i] -= lr + 1e3 * U * Math.max(scale, Number.MIN_VALUE);
    mi[i * m + i] -= li;
  }
  let xr = new Float64Array(m).map((_, i) => 1 + 0.1 * Math.sin(2.3 * i + 0.4));
  let xi = new Float64Array(m);
  for (let it = 0; it < 2; it++) {
    const x = solveComplexSmall(mr, mi, xr, xi, m);
    if (!x) return null;
    let norm = 0;
    for (let i = 0; i < m; i++) norm += x.re[i] ** 2 + x.im[i] ** 2;
    norm = Math.sqrt(norm);
    if (!(norm > 0) || !Number.isFinite(norm)) return null;
    xr = x.re.map((v) => v / norm);
    xi = x.im.map((v) => v / norm);
  }
  return { re: xr, im: xi };
}

/** Null when λ2 is not a single eigenvalue of the core that the block form resolves. */
export function firstOrderFromFast(data: FastSpectralData, lambda2Index: number): FirstOrderData | null {
  if (!data.ok) return null;
  const core = data.items[0];
  const slot = core.spectrumIndex.indexOf(lambda2Index);
  if (slot < 0) return null;
  const m = core.size;
  const n = data.n;
  let lr = core.values[2 * slot];
  let li = core.values[2 * slot + 1];
  // λ2 is the member with im ≥ 0 of a pair.
  if (li < 0) li = -li;
  const e = eigenvector(core.block, m, lr, li, false);
  const f = eigenvector(core.block, m, lr, li, true);
  if (!e || !f) return null;
  const right = { re: new Array<number>(n).fill(0), im: new Array<number>(n).fill(0) };
  const left = { re: new Array<number>(n).fill(0), im: new Array<number>(n).fill(0) };
  for (let r = 0; r < n; r++) {
    for (let j = 0; j < m; j++) {
      const v = data.v[r * n + core.start + j];
      const w = data.wt[r * n + core.start + j];
      right.re[r] += v * e.re[j];
      right.im[r] += v * e.im[j];
      left.re[r] += w * f.re[j];
      left.im[r] += w * f.im[j];
    }
  }
  let pr = 0;
  let pi = 0;
  let xn = 0;
  let zn = 0;
  for (let r = 0; r < n; r++) {
    pr += left.re[r] * right.re[r] - left.im[r] * right.im[r];
    pi += left.re[r] * right.im[r] + left.im[r] * right.re[r];
    xn += right.re[r] ** 2 + right.im[r] ** 2;
    zn += left.re[r] ** 2 + left.im[r] ** 2;
  }
  const p = Math.hypot(pr, pi);
  if (!(p > 0)) return null;
  lr += 0;
  const clean = (a: number[]) => a.map((v) => v + 0);
  return {
    right: { re: clean(right.re), im: clean(right.im) },
    left: { re: clean(left.re), im: clean(left.im) },
    pairing: { re: pr + 0, im: pi + 0 },
    condition: Math.sqrt(xn * zn) / p,
  };
}
