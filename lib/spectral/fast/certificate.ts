/**
 * Exclusion certificate for eigenvalues outside the reduced problem.
 *
 * With R the items taken in exactly and h the resolvent of the rest, the secular function splits
 * as F(z) = 1 + ε·vᵀ(L − z)⁻¹u = G(z)·K(z) with G = 1 + ε·h and K = 1 + α(z)·pᵀ(A_R − z)⁻¹q,
 * α = ε/G (by hand, reduced.ts). In the half-plane H = {Re z ≤ s}: if h has no pole there (every
 * other eigenvalue has Re > s) and |ε·h| < 1 on the line Re z = s, then |ε·h| < 1 on all of H
 * (h is analytic on H and vanishes at infinity, so |h| takes its maximum on the boundary — the
 * maximum modulus principle), G has no zero in H, and every eigenvalue of the perturbed
 * Laplacian in H is a root of K: a root of the reduced problem. No other eigenvalue can have
 * overtaken the least real part found, however large ε is.
 *
 * The bound on the line is established by adaptive bisection of y ∈ [0, Y] (h(s − iy) is the
 * conjugate of h(s + iy) for a real matrix): on a segment with midpoint value h_m and half-length
 * r, |h| ≤ |h_m| + r·Σ_k |β_k|/dist(λ_k, segment)², since |h'(z)| ≤ Σ|β_k|/|λ_k − z|². Beyond Y,
 * every |λ_k − z| ≥ 4|ε|·Σ|β_k| and the bound 1/4 holds outright.
 *
 * A cheaper sufficient test comes first: Σ_k |ε β_k|/(Re λ_k − s) < 1 (no cancellation assumed);
 * at the ladder's small ε it nearly always settles the question without sampling.
 */
import type { FastContext } from './context';
import type { EdgeCoupling } from './resolvent';
import { outsideResolvent } from './resolvent';
import { hyp } from './dense';

/** |ε·h| must stay below this on the line (a margin under 1 for rounding). */
export const CERTIFY_LEVEL = 0.9;
/** Most h evaluations one certificate may spend. */
export const CERTIFY_BUDGET = 600;

export type Certificate =
  | { ok: true; evaluations: number }
  /** The item to take into the reduced problem (largest |εβ|/|λ − z| at the failing place), or −1. */
  | { ok: false; culprit: number; evaluations: number };

interface Pole {
  re: number;
  im: number;
  /** |β| (for a pair: each conjugate carries |β|). */
  weight: number;
  item: number;
}

function poles(ctx: FastContext, cpl: EdgeCoupling, skip: Uint8Array): Pole[] {
  const out: Pole[] = [];
  for (let i = 0; i < ctx.reals.length; i++) {
    const k = ctx.reals[i];
    if (skip[k] || cpl.realBeta[i] === 0) continue;
    out.push({ re: cpl.realLambda[i], im: 0, weight: Math.abs(cpl.realBeta[i]), item: k });
  }
  for (let i = 0; i < ctx.pairs.length; i++) {
    const k = ctx.pairs[i];
    if (skip[k]) continue;
    const w = hyp(cpl.pairBetaRe[i], cpl.pairBetaIm[i]);
    if (w === 0) continue;
    out.push({ re: cpl.pairMuRe[i], im: cpl.pairMuIm[i], weight: w, item: k });
    out.push({ re: cpl.pairMuRe[i], im: -cpl.pairMuIm[i], weight: w, item: k });
  }
  return out;
}

/**
 * Certify that 1 + ε·h has no zero in {Re z ≤ s}, h over the items not flagged in `skip`.
 * Grouped blocks outside R make the certificate fail with the block as culprit (they are taken in).
 */
export function certifyHalfPlane(ctx: FastContext, cpl: EdgeCoupling, eps: number, s: number, skip: Uint8Array): Certificate {
  for (let i = 0; i < ctx.blocks.length; i++) if (!skip[ctx.blocks[i]]) return { ok: false, culprit: ctx.blocks[i], evaluations: 0 };
  const ae = Math.abs(eps);
  // First pass without allocation: poles in the half-plane, and the sum without cancellation.
  let crude = 0;
  for (let i = 0; i < ctx.reals.length; i++) {
    const k = ctx.reals[i];
    const w = cpl.realBeta[i];
    if (skip[k] || w === 0) continue;
    const d = cpl.realLambda[i] - s;
    if (!(d > 0)) return { ok: false, culprit: k, evaluations: 0 };
    crude += Math.abs(w) / d;
  }
  for (let i = 0; i < ctx.pairs.length; i++) {
    const k = ctx.pairs[i];
    if (skip[k]) continue;
    const d = cpl.pairMuRe[i] - s;
    if (!(d > 0)) return { ok: false, culprit: k, evaluations: 0 };
    crude += (2 * hyp(cpl.pairBetaRe[i], cpl.pairBetaIm[i])) / d;
  }
  if (ae * crude < CERTIFY_LEVEL) return { ok: true, evaluations: 0 };
  const ps = poles(ctx, cpl, skip);
  let total = 0;
  let maxIm = 0;
  for (const p of ps) {
    total += p.weight;
    maxIm = Math.max(maxIm, Math.abs(p.im));
  }
  const Y = maxIm + 4 * ae * total + 1;
  const stack: [number, number][] = [[0, Y]];
  let evaluations = 0;
  while (stack.length) {
    const [y0, y1] = stack.pop() as [number, number];
    const ym = 0.5 * (y0 + y1);
    const r = 0.5 * (y1 - y0);
    if (++evaluations > CERTIFY_BUDGET) return { ok: false, culprit: culpritAt(ps, eps, s, ym), evaluations };
    const [hr, hi] = outsideResolvent(ctx, cpl, s, ym, skip);
    const mid = ae * hyp(hr, hi);
    if (!(mid < CERTIFY_LEVEL)) return { ok: false, culprit: culpritAt(ps, eps, s, ym), evaluations };
    let slope = 0;
    for (const p of ps) {
      const dy = p.im < y0 ? y0 - p.im : p.im > y1 ? p.im - y1 : 0;
      const d2 = (p.re - s) * (p.re - s) + dy * dy;
      slope += p.weight / d2;
    }
    if (mid + ae * r * slope < CERTIFY_LEVEL) continue;
    stack.push([y0, ym], [ym, y1]);
  }
  return { ok: true, evaluations };
}

function culpritAt(ps: Pole[], eps: number, s: number, y: number): number {
  let best = -1;
  let bestW = 0;
  for (const p of ps) {
    const w = (Math.abs(eps) * p.weight) / hyp(p.re - s, p.im - y);
    if (w > bestW) {
      bestW = w;
      best = p.item;
    }
  }
  return best;
}
