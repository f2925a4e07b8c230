/**
 * The λ2 cluster and the baseline value of Re λ2.
 *
 * A defective eigenvalue λ of Jordan size k is ill-posed for any finite-precision solver: a
 * backward error of size η splits it into k computed values spread over a circle of radius about
 * (η·γ)^(1/k), where γ ~ ‖L‖^(k−1) measures the Jordan chain. With η ≈ u‖L‖ the computed least
 * real part can be off by ~‖L‖·u^(1/k) — 1e-8 for k = 2, 5e-6 for k = 3 — while the centre of the k
 * values is the (well-conditioned) trace of the block divided by k and is accurate to ~u‖L‖. So when
 * λ2 sits in such a rounding-split cluster, the engine measures every Δ from the mean of the
 * cluster's real parts, not from the computed λ2 itself.
 *
 * Deciding "split only by rounding" uses two facts:
 *  - distance: the k-th nearest eigenvalue to λ2 lies within twice the rounding radius
 *    ρ_k = s·(C·u)^(1/k) (s the largest weighted degree, C a generous constant);
 *  - reproducibility: rounding splits depend on the exact sequence of floating-point operations,
 *    so solving Lᵀ (same eigenvalues) scatters them differently, whereas genuinely distinct
 *    eigenvalues come back at the same places. Members reproduced by the transposed solve and
 *    farther than the plain tolerance are dropped; if everything left is reproduced, the cluster
 *    is "resolved" and λ2 is used as computed.
 */
import type { ClusterInfo, Complex } from './types';
import { foldedDistance, type EigenvalueList } from './spectrum';

export const UNIT_ROUNDOFF = 2 ** -53;
/** Jordan blocks larger than this are not looked for by the rounding rule. */
export const MAX_ROUNDING_CLUSTER = 4;
const ROUNDING_CONSTANT = 1e3;

/** Radius within which k eigenvalues of a single defective eigenvalue may be scattered by rounding. */
export function roundingRadius(k: number, scale: number): number {
  return scale * Math.pow(ROUNDING_CONSTANT * UNIT_ROUNDOFF, 1 / k);
}

export interface ClusterFinding extends ClusterInfo {
  mean: Complex;
}

export interface ClusterInput {
  values: EigenvalueList;
  zeroIndex: number;
  lambda2Index: number;
  /** Absolute radius that always counts as "nearly degenerate". */
  plainRadius: number;
  /** Matrix scale s for the rounding radius. */
  scale: number;
  /** Eigenvalues of Lᵀ, if computed: enables the reproducibility test. */
  transposed?: EigenvalueList;
}

function dist(values: EigenvalueList, i: number, re: number, im: number): number {
  return Math.hypot(values.re[i] - re, values.im[i] - im);
}

function spreadOf(values: EigenvalueList, members: number[]): number {
  let s = 0;
  for (let a = 0; a < members.length; a++) {
    for (let b = a + 1; b < members.length; b++) {
      s = Math.max(s, dist(values, members[a], values.re[members[b]], values.im[members[b]]));
    }
  }
  return s;
}

export function findCluster(input: ClusterInput): ClusterFinding {
  const { values, zeroIndex, lambda2Index: l, plainRadius, scale, transposed } = input;
  const cRe = values.re[l];
  const cIm = values.im[l];
  const others: { index: number; d: number }[] = [];
  for (let j = 0; j < values.re.length; j++) {
    if (j === zeroIndex || j === l) continue;
    others.push({ index: j, d: dist(values, j, cRe, cIm) });
  }
  others.sort((a, b) => a.d - b.d);

  let roundingCount = 1;
  for (let k = 2; k <= Math.min(MAX_ROUNDING_CLUSTER, others.length + 1); k++) {
    if (others[k - 2].d <= 2 * roundingRadius(k, scale)) roundingCount = k;
  }
  const candidate = new Set<number>([l]);
  others.forEach(({ index, d }, pos) => {
    if (d <= plainRadius || pos < roundingCount - 1) candidate.add(index);
  });

  let members = [...candidate];
  let resolved = members.length === 1;
  if (transposed && members.length > 1) {
    const eta = Math.max(1e-3 * spreadOf(values, members), ROUNDING_CONSTANT * UNIT_ROUNDOFF * scale);
    const reproduced = (i: number): boolean => {
      for (let j = 0; j < transposed.re.length; j++) {
        if (Math.hypot(transposed.re[j] - values.re[i], transposed.im[j] - values.im[i]) <= eta) return true;
      }
      return false;
    };
    members = members.filter((i) => i === l || !reproduced(i) || dist(values, i, cRe, cIm) <= plainRadius);
    resolved = members.every(reproduced);
  }
  let mRe = 0;
  let mIm = 0;
  for (const i of members) {
    mRe += values.re[i];
    mIm += values.im[i];
  }
  mRe /= members.length;
  mIm /= members.length;
  const spread = spreadOf(values, members);
  // A real defective eigenvalue splits into conjugate pairs: its centre is real.
  if (Math.abs(mIm) <= spread) mIm = 0;
  return {
    size: members.length,
    spread,
    members: members.sort((a, b) => a - b),
    resolved,
    mean: { re: mRe, im: mIm },
  };
}

/**
 * Baseline indices that count as branches of λ2 when following it under perturbation: the cluster
 * members, their conjugates, and any eigenvalue whose real part ties with the cluster's (then the
 * least real part is shared and either may carry it).
 */
export function branchIndices(values: EigenvalueList, zeroIndex: number, members: number[], reTie: number, spread: number): number[] {
  const out: number[] = [];
  const minRe = Math.min(...members.map((i) => values.re[i]));
  const maxRe = Math.max(...members.map((i) => values.re[i]));
  for (let j = 0; j < values.re.length; j++) {
    if (j === zeroIndex) continue;
    let near = false;
    for (const i of members) {
      if (foldedDistance(values.re[j], values.im[j], values.re[i], values.im[i]) <= spread + reTie) {
        near = true;
        break;
      }
    }
    if (near || (values.re[j] >= minRe - reTie && values.re[j] <= maxRe + reTie)) out.push(j);
  }
  return out;
}
