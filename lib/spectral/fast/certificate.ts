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
 *
 * A grouped block B (nearly defective eigenvalues) contributes bᵀ(B − z)⁻¹a, bounded through
 * ‖(B − z)⁻¹‖ ≤ Σ_{k<n} ν^k/δ^{k+1} (δ the distance from z to B's eigenvalues, ν its departure from
 * normality; the Neumann series of a Schur form Λ + N, e.g. G. H. Golub & C. F. Van Loan, Matrix
 * Computations, 4th ed., 2013, §7.2 — cited from memory), and its derivative by the square of that.
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
interface BlockBound {
  item: number;
  /** ‖a‖·‖b‖. */
  ab: number;
  nu: number;
  size: number;
  values: number[];
}

/** Σ_{k<n} ν^k/δ^{k+1} — the resolvent bound at distance δ. */
function resolventBound(nu: number, size: number, delta: number): number {
  let term = 1 / delta;
  let sum = term;
  for (let k = 1; k < size; k++) {
    term *= nu / delta;
    sum += term;
  }
  return sum;
}

function blockDistance(values: number[], zr: number, y0: number, y1: number): number {
  let d = Infinity;
  for (let j = 0; j < values.length; j += 2) {
    const re = values[j];
    const im = values[j + 1];
    const dy = im < y0 ? y0 - im : im > y1 ? im - y1 : 0;
    d = Math.min(d, Math.sqrt((re - zr) * (re - zr) + dy * dy));
  }
  return d;
}

export function certifyHalfPlane(ctx: FastContext, cpl: EdgeCoupling, eps: number, s: number, skip: Uint8Array): Certificate {
  const ae = Math.abs(eps);
  const blocks: BlockBound[] = [];
  for (let i = 0; i < ctx.blocks.length; i++) {
    const k = ctx.blocks[i];
    if (skip[k]) continue;
    const st = ctx.start[k];
    const n = ctx.size[k];
    let an = 0;
    let bn = 0;
    for (let j = 0; j < n; j++) {
      an += cpl.a[st + j] ** 2;
      bn += cpl.b[st + j] ** 2;
    }
    const values = ctx.data.items[k].values;
    for (let j = 0; j < values.length; j += 2) if (!(values[j] > s)) return { ok: false, culprit: k, evaluations: 0 };
    blocks.push({ item: k, ab: Math.sqrt(an * bn), nu: ctx.departure[k], size: n, values });
  }
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
  for (const b of blocks) {
    let d = Infinity;
    for (let j = 0; j < b.values.length; j += 2) d = Math.min(d, b.values[j] - s);
    crude += b.ab * resolventBound(b.nu, b.size, d);
  }
  if (ae * crude < CERTIFY_LEVEL) return { ok: true, evaluations: 0 };
  const ps = poles(ctx, cpl, skip);
  let total = 0;
  let maxIm = 0;
  for (const p of ps) {
    total += p.weight;
    maxIm = Math.max(maxIm, Math.abs(p.im));
  }
  for (const b of blocks) {
    // Beyond Y every block is at distance ≥ 4|ε|·Σ(weights), so its bound is below its share too.
    let d = Infinity;
    for (let j = 0; j < b.values.length; j += 2) {
      d = Math.min(d, b.values[j] - s);
      maxIm = Math.max(maxIm, Math.abs(b.values[j + 1]));
    }
    total += b.ab * d * resolventBound(b.nu, b.size, d);
  }
  const Y = maxIm + 4 * ae * total + 1;
  const stack: [number, number][] = [[0, Y]];
  let evaluations = 0;
  while (stack.length) {
    const [y0, y1] = stack.pop() as [number, number];
    const ym = 0.5 * (y0 + y1);
    const r = 0.5 * (y1 - y0);
    if (++evaluations > CERTIFY_BUDGET) return { ok: false, culprit: culpritAt(ps, blocks, eps, s, ym), evaluations };
    const [hr, hi] = outsideResolvent(ctx, cpl, s, ym, skip);
    const mid = ae * hyp(hr, hi);
    if (!(mid < CERTIFY_LEVEL)) return { ok: false, culprit: culpritAt(ps, blocks, eps, s, ym), evaluations };
    let slope = 0;
    for (const p of ps) {
      const dy = p.im < y0 ? y0 - p.im : p.im > y1 ? p.im - y1 : 0;
      const d2 = (p.re - s) * (p.re - s) + dy * dy;
      slope += p.weight / d2;
    }
    for (const b of blocks) slope += b.ab * resolventBound(b.nu, b.size, blockDistance(b.values, s, y0, y1)) ** 2;
    if (mid + ae * r * slope < CERTIFY_LEVEL) continue;
    stack.push([y0, ym], [ym, y1]);
  }
  return { ok: true, evaluations };
}

function culpritAt(ps: Pole[], blocks: BlockBound[], eps: number, s: number, y: number): number {
  let best = -1;
  let bestW = 0;
  for (const p of ps) {
    const w = (Math.abs(eps) * p.weight) / hyp(p.re - s, p.im - y);
    if (w > bestW) {
      bestW = w;
      best = p.item;
    }
  }
  for (const b of blocks) {
    const w = Math.abs(eps) * b.ab * resolventBound(b.nu, b.size, blockDistance(b.values, s, y, y));
    if (w > bestW) {
      bestW = w;
      best = b.item;
    }
  }
  return best;
}
