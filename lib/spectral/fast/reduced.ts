/**
 * The reduced problem of issue 7: for a weight change ε·u·vᵀ, the eigenvalues of L + ε·u·vᵀ that
 * belong to the items R (the λ2 cluster plus any "movers") are the solutions z of
 *   z ∈ eig(A_R + α(z)·q·pᵀ),  α(z) = ε / (1 + ε·h(z)),
 * with A_R = diag(B_k, k ∈ R), q = (a_k), p = (b_k) and h the outside resolvent (resolvent.ts).
 * Derivation (by hand, matrix determinant lemma): det(L − z + εuvᵀ) = det(L − z)(1 + ε vᵀ(L − z)⁻¹u),
 * and vᵀ(L − z)⁻¹u = pᵀ(A_R − z)⁻¹q + h(z), so 1 + ε(pᵀ(A_R − z)⁻¹q + h) = (1 + εh)(1 + α pᵀ(A_R − z)⁻¹q),
 * whose second factor vanishes exactly when det(A_R − z + α q pᵀ) = 0. Eigenvalues that do not move
 * (q or p orthogonal to them) stay roots of the determinant although the secular function misses
 * them — hence the matrix form rather than a scalar equation.
 *
 * Each branch is found by the fixed-point iteration z ← (eigenvalue of A_R + α(z)qpᵀ nearest z),
 * and by Newton's method on the secular function where that iteration does not settle. The matrix
 * is real for real z (real Schur gives exact conjugate pairs), complex otherwise; roots come in
 * conjugate pairs.
 */
import type { FastContext } from './context';
import { outsideResolvent, type EdgeCoupling } from './resolvent';
import { realSchur, blockLayout, eig2 } from './schur';
import { complexEigenvalues } from './small-eig';
import { solveComplexSmall } from './complex-solve';
import { hyp } from './dense';
import { alphaAt, rootsWithAlpha } from './root-alpha';

export interface ReducedProblem {
  /** Item indices taken in exactly (core first). */
  items: number[];
  /** Size M of A_R. */
  size: number;
  a: Float64Array;
  q: Float64Array;
  p: Float64Array;
  /** Outside items excluded from h (the movers): skip[k] = 1. */
  skip: Uint8Array;
  /** Scale of A_R (for tolerances). */
  scale: number;
}

export interface ReducedRoots {
  ok: boolean;
  reason?: string;
  re: Float64Array;
  im: Float64Array;
  /** α(z) at each root. */
  alphaRe: Float64Array;
  alphaIm: Float64Array;
  /** Where the root search got stuck (on failure). */
  stuckRe?: number;
  stuckIm?: number;
}

const FIXED_POINT_STEPS = 8;

const NEWTON_STEPS = 40;

export function reducedProblem(ctx: FastContext, cpl: EdgeCoupling, items: number[]): ReducedProblem {
  let size = 0;
  for (const k of items) size += ctx.size[k];
  const a = new Float64Array(size * size);
  const q = new Float64Array(size);
  const p = new Float64Array(size);
  const skip = new Uint8Array(ctx.data.items.length);
  let off = 0;
  let scale = 0;
  for (const k of items) {
    if (k !== 0) skip[k] = 1;
    const s = ctx.size[k];
    const st = ctx.start[k];
    const block = ctx.data.items[k].block;
    for (let r = 0; r < s; r++) {
      for (let c = 0; c < s; c++) {
        a[(off + r) * size + off + c] = block[r * s + c];
        scale = Math.max(scale, Math.abs(block[r * s + c]));
      }
      q[off + r] = cpl.a[st + r];
      p[off + r] = cpl.b[st + r];
    }
    off += s;
  }
  return { items, size, a, q, p, skip, scale: Math.max(scale, Number.MIN_VALUE) };
}

function realEigenvalues(m: Float64Array, n: number): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  if (n === 1) {
    re[0] = m[0];
    return { re, im };
  }
  const { t } = realSchur(m, n);
  let i = 0;
  for (const blk of blockLayout(t, n)) {
    if (blk.size === 1) {
      re[i] = t[blk.start * n + blk.start];
      i += 1;
    } else {
      const s = blk.start;
      const e = eig2(t[s * n + s], t[s * n + s + 1], t[(s + 1) * n + s], t[(s + 1) * n + s + 1]);
      re[i] = e.re1;
      im[i] = e.im;
      re[i + 1] = e.re2;
      im[i + 1] = -e.im;
      i += 2;
    }
  }
  return { re, im };
}

/** Eigenvalues of A + α q pᵀ (α = ar + i·ai). */
export function perturbedEigenvalues(rp: ReducedProblem, ar: number, ai: number): { re: Float64Array; im: Float64Array } {
  const n = rp.size;
  const mr = Float64Array.from(rp.a);
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) mr[r * n + c] += ar * rp.q[r] * rp.p[c];
  if (ai === 0) return realEigenvalues(mr, n);
  const mi = new Float64Array(n * n);
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) mi[r * n + c] = ai * rp.q[r] * rp.p[c];
  return complexEigenvalues(mr, mi, n);
}

function nearest(list: { re: Float64Array; im: Float64Array }, zr: number, zi: number): [number, number] {
  let best = 0;
  let bd = Infinity;
  for (let i = 0; i < list.re.length; i++) {
    const d = hyp(list.re[i] - zr, list.im[i] - zi);
    if (d < bd) {
      bd = d;
      best = i;
    }
  }
  return [list.re[best], list.im[best]];
}

/** pᵀ(A − z)⁻¹q and pᵀ(A − z)⁻²q. */
export function corePart(rp: ReducedProblem, zr: number, zi: number): [number, number, number, number] | null {
  const n = rp.size;
  const mr = Float64Array.from(rp.a);
  const mi = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    mr[i * n + i] -= zr;
    mi[i * n + i] -= zi;
  }
  const x = solveComplexSmall(mr, mi, rp.q, new Float64Array(n), n);
  if (!x) return null;
  const y = solveComplexSmall(mr, mi, x.re, x.im, n);
  if (!y) return null;
  let cr = 0;
  let ci = 0;
  let dr = 0;
  let di = 0;
  for (let i = 0; i < n; i++) {
    cr += rp.p[i] * x.re[i];
    ci += rp.p[i] * x.im[i];
    dr += rp.p[i] * y.re[i];
    di += rp.p[i] * y.im[i];
  }
  return [cr, ci, dr, di];
}

interface Root {
  re: number;
  im: number;
}

/**
 * One root from a starting value: the fixed-point iteration first (it also finds eigenvalues that
 * do not move at all, which the scalar secular function cannot see), then Newton's method on
 * F(z) = 1 + ε·(h(z) + pᵀ(A − z)⁻¹q) when the iteration does not settle (large ε, where α(z) varies
 * quickly). Null when neither converges.
 */
function findRoot(ctx: FastContext, cpl: EdgeCoupling, rp: ReducedProblem, eps: number, z0r: number, z0i: number, tol: number): Root | null {
  let zr = z0r;
  let zi = z0i;
  let bestR = zr;
  let bestI = zi;
  let bestStep = Infinity;
  let prevAr = NaN;
  let prevAi = NaN;
  for (let it = 0; it < FIXED_POINT_STEPS; it++) {
    const alpha = alphaAt(ctx, cpl, eps, zr, zi, rp.skip);
    if (!Number.isFinite(alpha[0]) || !Number.isFinite(alpha[1])) break;
    const ar = alpha[0];
    // A real branch keeps a real α (h is real on the real axis).
    const ai = zi === 0 ? 0 : alpha[1];
    const [nr, ni] = nearest(perturbedEigenvalues(rp, ar, ai), zr, zi);
    const step = hyp(nr - zr, ni - zi);
    if (step <= tol) return { re: nr, im: ni };
    // What iterates is α: once it stands still the root is settled, even if a nearly multiple
    // eigenvalue of A + α·q·pᵀ jitters at √u from one solve to the next.
    if (hyp(ar - prevAr, ai - prevAi) <= 8 * 2 ** -53 * hyp(ar, ai)) return { re: nr, im: ni };
    prevAr = ar;
    prevAi = ai;
    if (step < bestStep) {
      bestStep = step;
      bestR = nr;
      bestI = ni;
    }
    zr = nr;
    zi = ni;
  }
  zr = bestR;
  zi = bestI;
  for (let it = 0; it < NEWTON_STEPS; it++) {
    const [hr, hi, hdr, hdi] = outsideResolvent(ctx, cpl, zr, zi, rp.skip);
    const c = corePart(rp, zr, zi);
    if (!c) return null;
    const fr = 1 + eps * (hr + c[0]);
    const fi = eps * (hi + c[1]);
    const gr = eps * (hdr + c[2]);
    const gi = eps * (hdi + c[3]);
    const gg = gr * gr + gi * gi;
    if (!(gg > 0) || !Number.isFinite(gg)) return null;
    // step = F / F'
    let sr = (fr * gr + fi * gi) / gg;
    let si = (fi * gr - fr * gi) / gg;
    if (zi === 0) si = 0;
    const size = hyp(sr, si);
    // Damp long steps: never jump farther than a quarter of the scale of the reduced problem.
    const limit = 0.25 * (rp.scale + Math.abs(eps) * normProduct(rp));
    if (size > limit) {
      sr *= limit / size;
      si *= limit / size;
    }
    zr -= sr;
    zi -= si;
    if (size <= tol) return { re: zr, im: zi };
  }
  return null;
}

/**
 * All M roots of the reduced problem at ε (conjugate pairs complete). Roots are searched from the
 * eigenvalues of A + ε·q·pᵀ in the upper half plane (and, if the set does not close up, from the
 * lower half too); the results are made conjugate-symmetric and must number M.
 */
export function solveReduced(ctx: FastContext, cpl: EdgeCoupling, rp: ReducedProblem, eps: number): ReducedRoots {
  const n = rp.size;
  const fail = (reason: string): ReducedRoots => ({
    ok: false,
    reason,
    re: new Float64Array(n),
    im: new Float64Array(n),
    alphaRe: new Float64Array(n),
    alphaIm: new Float64Array(n),
  });
  const start = perturbedEigenvalues(rp, eps, 0);
  const tol = 64 * 2 ** -53 * (rp.scale + Math.abs(eps) * normProduct(rp));
  const found: Root[] = [];
  let settled = true;
  for (const lower of [false, true]) {
    for (let s = 0; s < n && settled; s++) {
      if (lower ? start.im[s] >= 0 : start.im[s] < 0) continue;
      const root = findRoot(ctx, cpl, rp, eps, start.re[s], start.im[s], tol);
      if (!root) settled = false;
      else found.push(root);
    }
    if (!settled) break;
    const closed = closeUp(found, n, tol);
    if (closed) return rootsWithAlpha(ctx, cpl, eps, closed, rp.skip);
  }
  // Some branch did not settle, or jumped onto another's root (typically near a collision at this ε): follow every
  // branch from t = 0 to 1 along α_t(z) = ε/(1 + t·ε·h(z)) instead, by Newton's method on
  //   Φ_t(z) = (1 + t·ε·h(z))/ε + pᵀ(A − z)⁻¹q
  // in steps of t that shrink when a step does not settle close by. At t = 0 the roots are the
  // eigenvalues of A + ε·q·pᵀ; zeros only enter or leave a region through its boundary as t moves,
  // so these continuations are the roots that belong to R. Eigenvalues of A that do not couple
  // (Φ_0 does not vanish at them) stay where they are.
  const tracked: Root[] = [];
  let odd: Root | null = null;
  for (let s = 0; s < n; s++) {
    if (start.im[s] < 0) continue;
    const z = newtonHomotopy(ctx, cpl, rp, eps, start.re[s], start.im[s], tol);
    if (!z) return { ...fail('branches merged'), stuckRe: start.re[s], stuckIm: start.im[s] };
    // A real branch that ended complex met another real root; if that root is not in R, the pair
    // is incomplete and the eigenvalue it met must be taken in (reported as where we got stuck).
    if (start.im[s] === 0 && z.im !== 0 && !odd) odd = z;
    tracked.push(z);
  }
  const closed = closeUp(tracked, n, tol);
  if (closed) return rootsWithAlpha(ctx, cpl, eps, closed, rp.skip);
  const at = odd ?? tracked[0];
  return { ...fail('branches merged'), stuckRe: at.re, stuckIm: at.im };
}

/**
 * One branch followed along t ∈ [0, 1] (see above); null if a step cannot be made to settle.
 * A real branch stays on the real axis (Φ_t is real there) until two real roots meet and leave as
 * a conjugate pair; a step that fails on the axis is therefore retried just above it.
 */
function newtonHomotopy(ctx: FastContext, cpl: EdgeCoupling, rp: ReducedProblem, eps: number, z0r: number, z0i: number, tol: number): Root | null {
  const phi = (zr: number, zi: number, t: number): [number, number, number, number] | null => {
    const c = corePart(rp, zr, zi);
    if (!c) return null;
    const [hr, hi, hdr, hdi] = outsideResolvent(ctx, cpl, zr, zi, rp.skip);
    return [(1 + t * eps * hr) / eps + c[0], (t * eps * hi) / eps + c[1], t * hdr + c[2], t * hdi + c[3]];
  };
  const at0 = phi(z0r, z0i, 0);
  const scale = rp.scale + Math.abs(eps) * normProduct(rp);
  // A start where Φ_0 does not vanish is an eigenvalue of A that does not couple: it stays.
  if (!at0 || Math.abs(eps) * hyp(at0[0], at0[1]) > 1e-6) return { re: z0r, im: z0i };
  const solve = (zr: number, zi: number, t: number): [number, number, number] | null => {
    for (let it = 0; it < 16; it++) {
      const f = phi(zr, zi, t);
      if (!f) return null;
      const gg = f[2] * f[2] + f[3] * f[3];
      if (!(gg > 0) || !Number.isFinite(gg)) return null;
      const sr = (f[0] * f[2] + f[1] * f[3]) / gg;
      const si = zi === 0 && f[1] === 0 && f[3] === 0 ? 0 : (f[1] * f[2] - f[0] * f[3]) / gg;
      zr -= sr;
      zi -= si;
      if (hyp(sr, si) <= tol) return [zr, zi, it];
    }
    return null;
  };
  let zr = z0r;
  let zi = z0i;
  let t = 0;
  let dt = 0.125;
  while (t < 1) {
    const t1 = Math.min(1, t + dt);
    let next = solve(zr, zi, t1);
    if (!next && zi === 0) next = solve(zr, 1e-3 * scale * dt, t1);
    if (next) {
      [zr, zi] = next;
      if (Math.abs(zi) <= 16 * tol) zi = 0;
      t = t1;
      dt = next[2] <= 4 ? Math.min(0.25, dt * 2) : dt;
    } else {
      dt /= 2;
      if (dt < 1 / 8192) return null;
    }
  }
  return { re: zr, im: Math.abs(zi) };
}

/**
 * Turn the roots found into a conjugate-symmetric list of exactly n: roots within `tol`·100 of the
 * real axis are real; upper roots and conjugates of lower roots are merged when closer than that.
 */
function closeUp(found: Root[], n: number, tol: number): Root[] | null {
  const eps = 100 * tol;
  const reals: number[] = [];
  const uppers: Root[] = [];
  for (const z of found) {
    if (Math.abs(z.im) <= eps) {
      reals.push(z.re);
      continue;
    }
    const u = { re: z.re, im: Math.abs(z.im) };
    if (!uppers.some((w) => hyp(w.re - u.re, w.im - u.im) <= eps)) uppers.push(u);
  }
  if (reals.length + 2 * uppers.length !== n) return null;
  const out: Root[] = reals.map((re) => ({ re, im: 0 }));
  for (const u of uppers) out.push(u, { re: u.re, im: -u.im });
  return out;
}

function normProduct(rp: ReducedProblem): number {
  let qn = 0;
  let pn = 0;
  for (let i = 0; i < rp.size; i++) {
    qn += rp.q[i] * rp.q[i];
    pn += rp.p[i] * rp.p[i];
  }
  return Math.sqrt(qn * pn);
}
