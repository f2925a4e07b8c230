/**
 * Leading Puiseux term of λ2's response from the reduced problem of a rounding-split (defective)
 * cluster of size k.
 *
 * Inside the core the cluster comes first, A_c = λ0·I + N with N nilpotent up to rounding (λ0 the
 * centre, trace/k). With p_c, q_c the cluster's couplings, the cluster part of the characteristic
 * polynomial is, to leading order in ε (by hand, from the matrix determinant lemma and
 * adj(μI − N) = Σ_{i<k} μ^{k−1−i} N^i for nilpotent N):
 *   μ^k − ε·Σ_j ψ_j μ^j,   ψ_j = p_cᵀ N^{k−1−j} q_c,   μ = z − λ0.
 * If j0 is the first j with ψ_j ≠ 0, then j0 branches stay at λ0 and k − j0 branches move as
 * μ ≈ (ε·ψ_{j0})^{1/(k−j0)} (Newton-polygon reasoning; for the exponents see J. Moro, J. V. Burke &
 * M. L. Overton, SIAM J. Matrix Anal. Appl. 18, 1997). The predicted Re λ2 change is c·|ε|^{1/(k−j0)}
 * with c the least real part over the moving roots (and 0 if some branch stays).
 */
import type { FastContext } from './context';
import type { EdgeCoupling } from './resolvent';

export interface PuiseuxTerm {
  /** 1/(k − j0). */
  exponent: number;
  /** c in Δ ≈ c·|ε|^exponent. */
  coefficient: number;
}

/** Relative size below which a ψ_j counts as zero. */
const ZERO = 1e-7;

export function leadingPuiseux(ctx: FastContext, cpl: EdgeCoupling, sign: 1 | -1): PuiseuxTerm | null {
  const core = ctx.data.core;
  const k = core.clusterSize;
  if (k < 2) return null;
  const m = core.size;
  const st = ctx.start[0];
  const block = ctx.data.items[0].block;
  const p = new Float64Array(k);
  const q = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    p[i] = cpl.b[st + i];
    q[i] = cpl.a[st + i];
  }
  if (m > k) {
    const r1 = core.clusterCoupling;
    if (!r1) return null;
    const ko = m - k;
    for (let i = 0; i < k; i++) for (let j = 0; j < ko; j++) q[i] -= r1[i * ko + j] * cpl.a[st + k + j];
  }
  let lambda0 = 0;
  for (let i = 0; i < k; i++) lambda0 += block[i * m + i];
  lambda0 /= k;
  const nil = new Float64Array(k * k);
  let nNorm = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      nil[i * k + j] = block[i * m + j] - (i === j ? lambda0 : 0);
      nNorm += nil[i * k + j] ** 2;
    }
  }
  nNorm = Math.sqrt(nNorm);
  let pn = 0;
  let qn = 0;
  for (let i = 0; i < k; i++) {
    pn += p[i] * p[i];
    qn += q[i] * q[i];
  }
  const scale = Math.sqrt(pn * qn);
  if (!(scale > 0)) return null;
  // ψ_{k−1−i} = pᵀ Nⁱ q for i = 0 … k−1.
  const psi = new Float64Array(k);
  let w = Float64Array.from(q);
  for (let i = 0; i < k; i++) {
    let s = 0;
    for (let j = 0; j < k; j++) s += p[j] * w[j];
    psi[k - 1 - i] = s;
    const next = new Float64Array(k);
    for (let r = 0; r < k; r++) for (let c = 0; c < k; c++) next[r] += nil[r * k + c] * w[c];
    w = next;
  }
  let j0 = -1;
  for (let j = 0; j < k; j++) {
    const tol = ZERO * scale * Math.pow(Math.max(nNorm, Number.MIN_VALUE), k - 1 - j);
    if (Math.abs(psi[j]) > tol) {
      j0 = j;
      break;
    }
  }
  if (j0 < 0) return null;
  const d = k - j0;
  const x = sign * psi[j0];
  const mag = Math.pow(Math.abs(x), 1 / d);
  const arg = x >= 0 ? 0 : Math.PI;
  let c = Infinity;
  for (let l = 0; l < d; l++) c = Math.min(c, mag * Math.cos((arg + 2 * Math.PI * l) / d));
  if (j0 > 0) c = Math.min(c, 0);
  // cos(π/2) is 6e-17, not 0: a purely imaginary leading pair predicts no real-part change.
  if (Math.abs(c) <= 1e-12 * mag) c = 0;
  return { exponent: 1 / d, coefficient: c };
}
