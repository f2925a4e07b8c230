/**
 * The core in partial fractions, when it can be: if the core block A is diagonalisable with well
 * conditioned eigenvectors (A = Σ_j x_j λ_j y_jᵀ, y_jᵀx_j = 1), then pᵀ(A − z)⁻¹q = Σ_j β_j/(λ_j − z)
 * with β_j = (pᵀx_j)(y_jᵀq), and every eigenvalue of the perturbed Laplacian is a root of the
 * scalar secular function F(z) = 1 + ε·(Σ_core β_j/(λ_j − z) + h(z)) — found by Newton's method
 * from the first-order positions, with no small eigen-solves at all. Defective or nearly defective
 * cores (rounding-split clusters) keep the matrix form of reduced.ts.
 *
 * Eigenvectors by one step of inverse iteration at a shift just off each eigenvalue (e.g.
 * G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013, §7.6.1 — cited from memory).
 */
import type { FastContext } from './context';
import type { EdgeCoupling } from './resolvent';
import { outsideResolvent } from './resolvent';
import { complexEigenvalues } from './small-eig';
import { solveComplexSmall } from './complex-solve';
import { hyp, U } from './dense';
import { dampedNewton, type ValueAndSlope } from './damped-newton';
import { rootsWithAlpha } from './root-alpha';

export interface CorePoles {
  m: number;
  /** Eigenvalues of the core block. */
  lamRe: Float64Array;
  lamIm: Float64Array;
  /** Right (x) and left (y) eigenvectors, row j = vector j, complex split; y_jᵀx_j = 1. */
  xRe: Float64Array;
  xIm: Float64Array;
  yRe: Float64Array;
  yIm: Float64Array;
}

/** Largest eigenvector condition ‖x‖‖y‖/|yᵀx| accepted for the partial-fraction form. */
export const CORE_POLE_CONDITION = 1e4;

function nullVector(a: ArrayLike<number>, m: number, lr: number, li: number, transpose: boolean, scale: number): { re: Float64Array; im: Float64Array } | null {
  const mr = new Float64Array(m * m);
  const mi = new Float64Array(m * m);
  const shift = 1e3 * U * scale;
  for (let r = 0; r < m; r++) for (let c = 0; c < m; c++) mr[r * m + c] = transpose ? a[c * m + r] : a[r * m + c];
  for (let i = 0; i < m; i++) {
    mr[i * m + i] -= lr + shift;
    mi[i * m + i] -= li;
  }
  let xr = new Float64Array(m).map((_, i) => 1 + 0.1 * Math.sin(3.7 * i + 1));
  let xi = new Float64Array(m);
  for (let it = 0; it < 2; it++) {
    const x = solveComplexSmall(mr, mi, xr, xi, m);
    if (!x) return null;
    let norm = 0;
    for (let i = 0; i < m; i++) norm += x.re[i] * x.re[i] + x.im[i] * x.im[i];
    norm = Math.sqrt(norm);
    if (!(norm > 0) || !Number.isFinite(norm)) return null;
    xr = x.re.map((v) => v / norm);
    xi = x.im.map((v) => v / norm);
  }
  return { re: xr, im: xi };
}

/** Partial-fraction data of the core, or null when its eigenvectors are ill conditioned. */
export function corePoles(ctx: FastContext): CorePoles | null {
  const m = ctx.size[0];
  const a = ctx.data.items[0].block;
  let scale = 0;
  for (const v of a) scale = Math.max(scale, Math.abs(v));
  const ev = complexEigenvalues(a, new Float64Array(m * m), m);
  // Distinct eigenvalues only (a repeated one is either defective or needs the matrix form).
  for (let i = 0; i < m; i++) for (let j = i + 1; j < m; j++) if (hyp(ev.re[i] - ev.re[j], ev.im[i] - ev.im[j]) <= 1e-6 * scale) return null;
  const out: CorePoles = {
    m,
    lamRe: ev.re,
    lamIm: ev.im,
    xRe: new Float64Array(m * m),
    xIm: new Float64Array(m * m),
    yRe: new Float64Array(m * m),
    yIm: new Float64Array(m * m),
  };
  for (let j = 0; j < m; j++) {
    const x = nullVector(a, m, ev.re[j], ev.im[j], false, scale);
    const y = nullVector(a, m, ev.re[j], ev.im[j], true, scale);
    if (!x || !y) return null;
    // yᵀx (bilinear) and the normalisation y ← y / (yᵀx).
    let dr = 0;
    let di = 0;
    for (let i = 0; i < m; i++) {
      dr += y.re[i] * x.re[i] - y.im[i] * x.im[i];
      di += y.re[i] * x.im[i] + y.im[i] * x.re[i];
    }
    const dd = dr * dr + di * di;
    if (!(dd > 0)) return null;
    if (1 / Math.sqrt(dd) > CORE_POLE_CONDITION) return null;
    for (let i = 0; i < m; i++) {
      out.xRe[j * m + i] = x.re[i];
      out.xIm[j * m + i] = x.im[i];
      out.yRe[j * m + i] = (y.re[i] * dr + y.im[i] * di) / dd;
      out.yIm[j * m + i] = (y.im[i] * dr - y.re[i] * di) / dd;
    }
  }
  return out;
}

export interface ScalarRoots {
  ok: boolean;
  /** Where the search went wrong (on failure): the caller takes the outside eigenvalue interacting most there into R. */
  stuckRe?: number;
  stuckIm?: number;
  re: Float64Array;
  im: Float64Array;
  alphaRe: Float64Array;
  alphaIm: Float64Array;
}

/**
 * The roots at ε that continue the core's eigenvalues and those of the `extra` items (movers: single
 * real eigenvalues or conjugate pairs), by Newton's method on the full secular function
 * F(z) = 1 + ε·(Σ_core β_j/(λ_j − z) + h(z)), h over every item outside the core. Each root starts
 * at its eigenvalue's first-order position λ + ε·β/(1 + ε·r(λ)), r the rest of the sum. Null when
 * the result is not a clean conjugate-symmetric set of the right size (the caller then uses the
 * matrix form), or when an extra item is a grouped block.
 */
export function scalarRoots(ctx: FastContext, cpl: EdgeCoupling, cp: CorePoles, eps: number, extra: number[]): ScalarRoots | null {
  let stuck: [number, number] = [NaN, NaN];
  const m = cp.m;
  const st = ctx.start[0];
  const none = noSkip(ctx);
  // Poles whose continuations we want: the core's, then the extra items'.
  const lamRe: number[] = [];
  const lamIm: number[] = [];
  const betaRe: number[] = [];
  const betaIm: number[] = [];
  for (let j = 0; j < m; j++) {
    let pxr = 0;
    let pxi = 0;
    let yqr = 0;
    let yqi = 0;
    for (let i = 0; i < m; i++) {
      const p = cpl.b[st + i];
      const q = cpl.a[st + i];
      pxr += p * cp.xRe[j * m + i];
      pxi += p * cp.xIm[j * m + i];
      yqr += q * cp.yRe[j * m + i];
      yqi += q * cp.yIm[j * m + i];
    }
    lamRe.push(cp.lamRe[j]);
    lamIm.push(cp.lamIm[j]);
    betaRe.push(pxr * yqr - pxi * yqi);
    betaIm.push(pxr * yqi + pxi * yqr);
  }
  const coreBr = Float64Array.from(betaRe);
  const coreBi = Float64Array.from(betaIm);
  let count = m;
  for (const k of extra) {
    if (ctx.kind[k] === 1) {
      const i = ctx.realIndex[k];
      lamRe.push(cpl.realLambda[i]);
      lamIm.push(0);
      betaRe.push(cpl.realBeta[i]);
      betaIm.push(0);
      count += 1;
    } else if (ctx.kind[k] === 2) {
      const i = ctx.pairIndex[k];
      lamRe.push(cpl.pairMuRe[i], cpl.pairMuRe[i]);
      lamIm.push(cpl.pairMuIm[i], -cpl.pairMuIm[i]);
      betaRe.push(cpl.pairBetaRe[i], cpl.pairBetaRe[i]);
      betaIm.push(cpl.pairBetaIm[i], -cpl.pairBetaIm[i]);
      count += 2;
    } else {
      return null;
    }
  }
  let scale = 0;
  for (let j = 0; j < lamRe.length; j++) scale = Math.max(scale, hyp(lamRe[j], lamIm[j]));
  const ae = Math.abs(eps);
  const tol = 64 * U * (scale + ae);
  /** F and F′ at z (h over all outside items, the core through its residues). */
  const F: ValueAndSlope = (zr, zi) => {
    const [hr, hi, hdr, hdi] = outsideResolvent(ctx, cpl, zr, zi, none);
    let fr = hr;
    let fi = hi;
    let gr = hdr;
    let gi = hdi;
    for (let j = 0; j < m; j++) {
      const wr = cp.lamRe[j] - zr;
      const wi = cp.lamIm[j] - zi;
      const dd = wr * wr + wi * wi;
      const qr = (coreBr[j] * wr + coreBi[j] * wi) / dd;
      const qi = (coreBi[j] * wr - coreBr[j] * wi) / dd;
      fr += qr;
      fi += qi;
      gr += (qr * wr + qi * wi) / dd;
      gi += (qi * wr - qr * wi) / dd;
    }
    return [1 + eps * fr, eps * fi, eps * gr, eps * gi];
  };
  const newton = (zr: number, zi: number, real: boolean, limit: number): [number, number] | null => dampedNewton(F, zr, zi, real, limit, tol);
  /** Newton on 1 + t·ε·S(z) (t = 1: F itself). */
  const newtonAt = (t: number, zr: number, zi: number, real: boolean, limit: number): [number, number] | null => {
    // F = 1 + εS  ⇒  1 + tεS = 1 + t(F − 1), derivative t·F′.
    const scaled: ValueAndSlope = (wr, wi) => {
      const [fr, fi, gr, gi] = F(wr, wi);
      return [1 + t * (fr - 1), t * fi, t * gr, t * gi];
    };
    return dampedNewton(scaled, zr, zi, real, limit, tol);
  };
  /** Distance from pole j to the nearest other pole of the sum (core and outside). */
  const poleGap = (j: number): number => {
    let d = Infinity;
    for (let i = 0; i < lamRe.length; i++) if (i !== j) d = Math.min(d, hyp(lamRe[i] - lamRe[j], lamIm[i] - lamIm[j]));
    for (let i = 0; i < ctx.reals.length; i++) {
      if (cpl.realBeta[i] === 0) continue;
      const dd = hyp(cpl.realLambda[i] - lamRe[j], lamIm[j]);
      if (dd > 0) d = Math.min(d, dd);
    }
    for (let i = 0; i < ctx.pairs.length; i++) {
      const dd = Math.min(hyp(cpl.pairMuRe[i] - lamRe[j], cpl.pairMuIm[i] - lamIm[j]), hyp(cpl.pairMuRe[i] - lamRe[j], cpl.pairMuIm[i] + lamIm[j]));
      if (dd > 0) d = Math.min(d, dd);
    }
    return d;
  };
  const direct = (j: number): [number, number] | null => {
    const real = lamIm[j] === 0;
    const shift = hyp(eps * betaRe[j], eps * betaIm[j]);
    // First-order start corrected by the rest of the sum: λ + εβ/(1 + ε·r(λ)).
    const [hr, hi] = restAt(ctx, cpl, cp, coreBr, coreBi, lamRe[j], lamIm[j]);
    const dr = 1 + eps * hr;
    const di = eps * hi;
    const dd = dr * dr + di * di;
    const sr = eps * betaRe[j];
    const si = eps * betaIm[j];
    const zr = lamRe[j] + (sr * dr + si * di) / dd;
    const zi = real ? 0 : lamIm[j] + (si * dr - sr * di) / dd;
    // Steps are limited to keep Newton on this branch, but not below a tenth of the distance to
    // the nearest other pole (a collision can move a root much farther than first order says).
    const limit = Math.max(0.5 * shift, 0.1 * poleGap(j)) + tol;
    let z = newton(zr, zi, real, limit);
    // Two real roots that meet leave the axis as a pair: retry just above it.
    if (!z && real) z = newton(zr, 0.1 * shift, false, limit);
    return z;
  };
  /**
   * Continuation in ε: follow the root from t·ε with t small (first order is exact enough there)
   * to t = 1 in steps that halve when Newton does not settle, stepping off the real axis when a
   * real root meets another.
   */
  const continued = (j: number): [number, number] | null => {
    let zr = lamRe[j];
    let zi = lamIm[j];
    let real = zi === 0;
    const shift = hyp(eps * betaRe[j], eps * betaIm[j]);
    let t = 1 / 64;
    zr += t * eps * betaRe[j];
    if (!real) zi += t * eps * betaIm[j];
    let dt = 1 / 32;
    const gap = poleGap(j);
    while (t < 1) {
      const t1 = Math.min(1, t + dt);
      const limit = Math.max(2 * shift * (t1 - t), 0.05 * gap) + tol;
      let z = newtonAt(t1, zr, zi, real, limit);
      if (!z && real) {
        z = newtonAt(t1, zr, 0.05 * shift * dt, false, limit);
        if (z && Math.abs(z[1]) > 16 * tol) real = false;
      }
      if (z) {
        [zr, zi] = z;
        t = t1;
        dt = Math.min(0.25, dt * 2);
      } else {
        dt /= 2;
        if (dt < 1 / 16384) return null;
      }
    }
    return [zr, zi];
  };
  /**
   * The second real root of a conjugate pair that met on the real axis at r1. On the real axis F is
   * real and continuous between real poles, and F(z)/(z − r1) changes sign at the partner root:
   * scan both sides of r1 up to `reach` for the nearest sign change not caused by a pole, then
   * close in by regula falsi (Illinois variant).
   */
  const realPoles = lamRe.filter((_, j) => lamIm[j] === 0);
  for (let i = 0; i < ctx.reals.length; i++) if (cpl.realBeta[i] !== 0) realPoles.push(cpl.realLambda[i]);
  const partner = (r1: number, reach: number): number | null => {
    const g = (z: number) => F(z, 0)[0] / (z - r1);
    let best: number | null = null;
    for (const side of [1, -1]) {
      const grid = 48;
      let x0 = r1 + side * 1e-9 * reach;
      let g0 = g(x0);
      for (let k = 1; k <= grid; k++) {
        const x1 = r1 + (side * reach * k) / grid;
        const g1 = g(x1);
        const lo = Math.min(x0, x1);
        const hi = Math.max(x0, x1);
        const pole = realPoles.some((p) => p > lo && p < hi);
        if (!pole && Number.isFinite(g0) && Number.isFinite(g1) && Math.sign(g0) !== Math.sign(g1)) {
          let a = x0;
          let fa = g0;
          let c = x1;
          let fc = g1;
          let side2 = 0;
          for (let it = 0; it < 100 && Math.abs(c - a) > tol; it++) {
            const m = (a * fc - c * fa) / (fc - fa);
            const fm = g(m);
            if (Math.sign(fm) === Math.sign(fa)) {
              a = m;
              fa = fm;
              if (side2 === -1) fc /= 2;
              side2 = -1;
            } else {
              c = m;
              fc = fm;
              if (side2 === 1) fa /= 2;
              side2 = 1;
            }
          }
          const root = 0.5 * (a + c);
          if (best === null || Math.abs(root - r1) < Math.abs(best - r1)) best = root;
          break;
        }
        x0 = x1;
        g0 = g1;
      }
    }
    return best;
  };
  const assemble = (): { re: number; im: number }[] | null => {
    const found: { re: number; im: number }[] = [];
    const seen = (z: [number, number]) => found.some((w) => hyp(w.re - z[0], w.im - Math.abs(z[1])) <= 1e3 * tol);
    for (let j = 0; j < lamRe.length; j++) {
      if (lamIm[j] < 0) continue;
      // An eigenvalue the change does not couple to stays where it is.
      const shift = hyp(eps * betaRe[j], eps * betaIm[j]);
      if (shift <= tol) {
        found.push({ re: lamRe[j], im: lamIm[j] });
        continue;
      }
      // Newton from the first-order start; on failure, or if it jumped onto a root already
      // found (another branch's), follow the branch by continuation in ε instead.
      const real = lamIm[j] === 0;
      let z = direct(j);
      const jumped = (w: [number, number] | null) => !w || (seen(w) && !(real && Math.abs(w[1]) > 16 * tol));
      if (jumped(z)) z = continued(j);
      if (!z || jumped(z)) {
        stuck = [lamRe[j], lamIm[j]];
        return null;
      }
      const im = Math.abs(z[1]) <= 16 * tol ? 0 : Math.abs(z[1]);
      found.push({ re: z[0], im });
      if (!real && im === 0) {
        // The pair reached the real axis: its two members are now two real roots.
        const r2 = partner(z[0], 4 * (lamIm[j] + shift));
        if (r2 === null) {
          stuck = [z[0], 0];
          return null;
        }
        found.push({ re: r2, im: 0 });
      }
    }
    // Conjugate-symmetric and distinct, `count` in all.
    const list: { re: number; im: number }[] = [];
    for (const z of found) {
      if (list.some((w) => hyp(w.re - z.re, w.im - z.im) <= 1e3 * tol)) {
        // Two real branches that met as a pair: the second stands for the conjugate.
        if (z.im === 0) {
          stuck = [z.re, z.im];
          return null;
        }
        continue;
      }
      list.push(z);
      if (z.im !== 0) list.push({ re: z.re, im: -z.im });
    }
    if (list.length !== count) {
      const odd = found.find((z) => z.im !== 0) ?? found[0];
      stuck = [odd.re, odd.im];
      return null;
    }
    return list;
  };
  const list = assemble();
  if (!list) return { ok: false, stuckRe: stuck[0], stuckIm: stuck[1], re: new Float64Array(0), im: new Float64Array(0), alphaRe: new Float64Array(0), alphaIm: new Float64Array(0) };
  const skipR = new Uint8Array(ctx.data.items.length);
  for (const k of extra) skipR[k] = 1;
  // α at the root with h over the items outside R (as the matrix form defines it).
  return rootsWithAlpha(ctx, cpl, eps, list, skipR);
}

const noSkips = new WeakMap<FastContext, Uint8Array>();
function noSkip(ctx: FastContext): Uint8Array {
  let s = noSkips.get(ctx);
  if (!s) {
    s = new Uint8Array(ctx.data.items.length);
    noSkips.set(ctx, s);
  }
  return s;
}

/** The secular sum at z = λ without the term whose pole is λ itself (used for starting values only; grouped blocks left out). */
function restAt(ctx: FastContext, cpl: EdgeCoupling, cp: CorePoles, br: Float64Array, bi: Float64Array, zr: number, zi: number): [number, number] {
  let hr = 0;
  let hi = 0;
  for (let i = 0; i < ctx.reals.length; i++) {
    const beta = cpl.realBeta[i];
    const wr = cpl.realLambda[i] - zr;
    const dd = wr * wr + zi * zi;
    if (beta === 0 || dd === 0) continue;
    hr += (beta * wr) / dd;
    hi += (beta * zi) / dd;
  }
  for (let i = 0; i < ctx.pairs.length; i++) {
    for (let side = 1; side >= -1; side -= 2) {
      const br2 = cpl.pairBetaRe[i];
      const bi2 = side * cpl.pairBetaIm[i];
      const wr = cpl.pairMuRe[i] - zr;
      const wi = side * cpl.pairMuIm[i] - zi;
      const dd = wr * wr + wi * wi;
      if (dd === 0) continue;
      hr += (br2 * wr + bi2 * wi) / dd;
      hi += (bi2 * wr - br2 * wi) / dd;
    }
  }
  for (let j = 0; j < cp.m; j++) {
    const wr = cp.lamRe[j] - zr;
    const wi = cp.lamIm[j] - zi;
    const dd = wr * wr + wi * wi;
    if (dd === 0) continue;
    hr += (br[j] * wr + bi[j] * wi) / dd;
    hi += (bi[j] * wr - br[j] * wi) / dd;
  }
  return [hr, hi];
}
