/**
 * α(z) = ε / (1 + ε·h(z)), the factor that folds everything outside the reduced items R into the
 * rank-one term of the reduced problem (derivation in reduced.ts). Both root finders — the matrix
 * form (reduced.ts) and the partial-fraction form (core-poles.ts) — report α at their roots for the
 * noise-floor model of fast-edge.ts, which may take either; one definition keeps them interchangeable.
 */
import type { FastContext } from './context';
import { outsideResolvent, type EdgeCoupling } from './resolvent';

/** α at z as [re, im], h taken over the items not flagged in `skip`; may be non-finite at a pole of h. */
export function alphaAt(ctx: FastContext, cpl: EdgeCoupling, eps: number, zr: number, zi: number, skip: Uint8Array): [number, number] {
  const [hr, hi] = outsideResolvent(ctx, cpl, zr, zi, skip);
  const dr = 1 + eps * hr;
  const di = eps * hi;
  const dd = dr * dr + di * di;
  return [(eps * dr) / dd, (-eps * di) / dd];
}

export interface RootsWithAlpha {
  ok: true;
  re: Float64Array;
  im: Float64Array;
  alphaRe: Float64Array;
  alphaIm: Float64Array;
}

/**
 * The finished roots with α at each. At a real root α is set real: h is real on the real axis, so
 * any Im α computed there is rounding, and a real α keeps the floor model's matrix A + α·q·pᵀ real.
 */
export function rootsWithAlpha(ctx: FastContext, cpl: EdgeCoupling, eps: number, roots: { re: number; im: number }[], skip: Uint8Array): RootsWithAlpha {
  const n = roots.length;
  const out: RootsWithAlpha = {
    ok: true,
    re: new Float64Array(n),
    im: new Float64Array(n),
    alphaRe: new Float64Array(n),
    alphaIm: new Float64Array(n),
  };
  roots.forEach((z, i) => {
    const [ar, ai] = alphaAt(ctx, cpl, eps, z.re, z.im, skip);
    out.re[i] = z.re;
    out.im[i] = z.im;
    out.alphaRe[i] = ar;
    out.alphaIm[i] = z.im === 0 ? 0 : ai;
  });
  return out;
}
