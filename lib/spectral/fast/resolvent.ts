/**
 * How one weight change couples to each item of the block-diagonal form, and the outside part of
 * the resolvent.
 *
 * A change of the weights on one listening row r is ε·u·vᵀ with u = e_r and v = Σ s_t(e_r − e_{c_t})
 * (one term per edge into r). In the block-diagonal basis item k sees a_k = (V⁻¹)_k·u (rows of
 * V⁻¹, i.e. column r of its left basis) and b_k = V_kᵀ·v. For a single eigenvalue λ_k with right and
 * left eigenvectors x, y (yᵀx = 1) that is the rank-one residue β_k = (yᵀu)(vᵀx), the first-order
 * shift of λ_k per unit ε.
 *
 * With (L − zI)⁻¹ = Σ_k V_k (B_k − z)⁻¹ (V⁻¹)_k, the outside resolvent of the issue is
 *   h(z) = vᵀ R_out(z) u = Σ_{k ∉ R} b_kᵀ (B_k − z)⁻¹ a_k,
 * i.e. Σ β_k/(λ_k − z) over single eigenvalues (partial fractions, exact, O(n) per evaluation), plus
 * small solves for grouped blocks.
 */
import type { FastContext } from './context';
import { solveComplexSmall } from './complex-solve';

export interface EdgeCoupling {
  /** a_k and b_k for every item, laid out by item start (length n each). */
  a: Float64Array;
  b: Float64Array;
  /** Real items: eigenvalue and residue. */
  realLambda: Float64Array;
  realBeta: Float64Array;
  /** Pair items (upper eigenvalue μ, residue β; the conjugate pair carries conj values). */
  pairMuRe: Float64Array;
  pairMuIm: Float64Array;
  pairBetaRe: Float64Array;
  pairBetaIm: Float64Array;
}

/** Returns null unless every term writes into the same row (rank one). */
export function edgeCoupling(ctx: FastContext, terms: { row: number; col: number; scale: number }[]): EdgeCoupling | null {
  const { n, v, wt } = ctx;
  const row = terms[0].row;
  if (terms.some((t) => t.row !== row)) return null;
  const a = new Float64Array(n);
  const b = new Float64Array(n);
  const rr = row * n;
  for (let k = 0; k < n; k++) a[k] = wt[rr + k];
  for (const { col, scale } of terms) {
    if (col === row) continue;
    const cr = col * n;
    for (let k = 0; k < n; k++) b[k] += scale * (v[rr + k] - v[cr + k]);
  }
  const items = ctx.data.items;
  const reals = ctx.reals;
  const realLambda = new Float64Array(reals.length);
  const realBeta = new Float64Array(reals.length);
  for (let i = 0; i < reals.length; i++) {
    const k = reals[i];
    const s = ctx.start[k];
    realLambda[i] = items[k].values[0];
    // The zero eigenvalue's right eigenvector is constant and v sums to zero, so its residue is
    // exactly 0 (what is computed is rounding): it never moves and is no pole of h.
    realBeta[i] = k === ctx.data.zeroItem ? 0 : a[s] * b[s];
  }
  const pairs = ctx.pairs;
  const pairMuRe = new Float64Array(pairs.length);
  const pairMuIm = new Float64Array(pairs.length);
  const pairBetaRe = new Float64Array(pairs.length);
  const pairBetaIm = new Float64Array(pairs.length);
  for (let i = 0; i < pairs.length; i++) {
    const k = pairs[i];
    const it = items[k];
    const s = ctx.start[k];
    const { e, f } = it.pairVectors as { e: number[]; f: number[] };
    // β = (fᵀa)(bᵀe)
    const faR = f[0] * a[s] + f[2] * a[s + 1];
    const faI = f[1] * a[s] + f[3] * a[s + 1];
    const beR = e[0] * b[s] + e[2] * b[s + 1];
    const beI = e[1] * b[s] + e[3] * b[s + 1];
    pairMuRe[i] = it.values[0];
    pairMuIm[i] = it.values[1];
    pairBetaRe[i] = faR * beR - faI * beI;
    pairBetaIm[i] = faR * beI + faI * beR;
  }
  return { a, b, realLambda, realBeta, pairMuRe, pairMuIm, pairBetaRe, pairBetaIm };
}

/**
 * h(z) and h'(z) over every item outside the core except those flagged in `skip` (the movers, which
 * the reduced problem takes in exactly). Returns [hRe, hIm, dhRe, dhIm].
 */
export function outsideResolvent(ctx: FastContext, cpl: EdgeCoupling, zr: number, zi: number, skip: Uint8Array): [number, number, number, number] {
  let hr = 0;
  let hi = 0;
  let dr = 0;
  let di = 0;
  const reals = ctx.reals;
  for (let i = 0; i < reals.length; i++) {
    if (skip[reals[i]]) continue;
    const beta = cpl.realBeta[i];
    if (beta === 0) continue;
    // β/(λ − z)
    const wr = cpl.realLambda[i] - zr;
    const wi = -zi;
    const den = wr * wr + wi * wi;
    const qr = (beta * wr) / den;
    const qi = (-beta * wi) / den;
    hr += qr;
    hi += qi;
    // derivative: β/(λ − z)² = q·conj(w)/|w|²
    dr += (qr * wr + qi * wi) / den;
    di += (qi * wr - qr * wi) / den;
  }
  const pairs = ctx.pairs;
  for (let i = 0; i < pairs.length; i++) {
    if (skip[pairs[i]]) continue;
    const br = cpl.pairBetaRe[i];
    const bi = cpl.pairBetaIm[i];
    const mr = cpl.pairMuRe[i];
    const mi = cpl.pairMuIm[i];
    // β/(μ − z) + conj(β)/(conj(μ) − z)
    for (let side = 0; side < 2; side++) {
      const betaI = side === 0 ? bi : -bi;
      const wr = mr - zr;
      const wi = (side === 0 ? mi : -mi) - zi;
      const den = wr * wr + wi * wi;
      const qr = (br * wr + betaI * wi) / den;
      const qi = (betaI * wr - br * wi) / den;
      hr += qr;
      hi += qi;
      dr += (qr * wr + qi * wi) / den;
      di += (qi * wr - qr * wi) / den;
    }
  }
  const blocks = ctx.blocks;
  for (let i = 0; i < blocks.length; i++) {
    const k = blocks[i];
    if (skip[k]) continue;
    const [r1, r2, r3, r4] = blockTerm(ctx, cpl, k, zr, zi);
    hr += r1;
    hi += r2;
    dr += r3;
    di += r4;
  }
  return [hr, hi, dr, di];
}

/** bᵀ(B − z)⁻¹a and its derivative bᵀ(B − z)⁻²a for a grouped block. */
function blockTerm(ctx: FastContext, cpl: EdgeCoupling, k: number, zr: number, zi: number): [number, number, number, number] {
  const s = ctx.size[k];
  const st = ctx.start[k];
  const block = ctx.data.items[k].block;
  const mr = new Float64Array(s * s);
  const mi = new Float64Array(s * s);
  for (let i = 0; i < s * s; i++) mr[i] = block[i];
  for (let i = 0; i < s; i++) {
    mr[i * s + i] -= zr;
    mi[i * s + i] -= zi;
  }
  const ar = new Float64Array(s);
  const ai = new Float64Array(s);
  for (let i = 0; i < s; i++) ar[i] = cpl.a[st + i];
  const x = solveComplexSmall(mr, mi, ar, ai, s);
  if (!x) return [NaN, NaN, NaN, NaN];
  const y = solveComplexSmall(mr, mi, x.re, x.im, s);
  let hr = 0;
  let hi = 0;
  let dr = 0;
  let di = 0;
  for (let i = 0; i < s; i++) {
    const bb = cpl.b[st + i];
    hr += bb * x.re[i];
    hi += bb * x.im[i];
    if (y) {
      dr += bb * y.re[i];
      di += bb * y.im[i];
    }
  }
  return [hr, hi, dr, di];
}
