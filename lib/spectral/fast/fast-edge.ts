/**
 * One edge (or one listening row) on the fast path: every ladder point and budget check from the
 * reduced problem, with the guards of issue 7.
 *
 *  - The reduced problem starts with the λ2 cluster (the core item); its roots are exact
 *    eigenvalues of the perturbed Laplacian (reduced.ts).
 *  - Every other eigenvalue is kept out of the way by the half-plane certificate (certificate.ts):
 *    none of them can lie at or left of the least real part found. Its cheap first-order form —
 *    Σ|ε·β_k|/(Re λ_k − s) < 1, the first-order shifts ε·β_k of the other eigenvalues measured
 *    against their distance — settles nearly every ladder point; larger ε sample the line. An
 *    eigenvalue that breaks it (or one sitting within the matching radius of the cluster) is taken
 *    into the reduced problem and computed exactly as well ("mover").
 *  - If a mover then holds the least real part on a ladder point (another eigenvalue overtook λ2's
 *    branches: an identity change), the point is confirmed by a full eigen-solve, as is any point
 *    whose root search fails or whose reduced problem grows past MAX_REDUCED. Each counts as a
 *    fallback. A budget check needs only Re λ2, which the certified reduced problem gives exactly.
 *  - Noise floors: where the exact path uses the condition-number floor, so does this one (the
 *    same number); where it compares the solves of M and Mᵀ, this path perturbs the reduced matrix
 *    by two fixed patterns sized so that, at ε = 0, they reproduce the rounding seen in the
 *    baseline, and takes the spread of λ2 — the same question (how far rounding moves λ2 here)
 *    asked of the small problem.
 */
import type { SpectralBaseline } from '../types';
import type { FastContext } from './context';
import { edgeCoupling, type EdgeCoupling } from './resolvent';
import { reducedProblem, solveReduced, type ReducedProblem, type ReducedRoots } from './reduced';
import { scalarRoots } from './core-poles';
import { certifyHalfPlane } from './certificate';
import { complexEigenvalues } from './small-eig';
import { U, hyp } from './dense';
import { solveComplexSmall } from './complex-solve';

export interface PointEvaluation {
  re: number;
  tracked: boolean;
  raw: number;
}

export type FloorKind = 'none' | 'transpose' | 'condition';

/** Largest reduced problem (eigenvalues) before a point is handed to a full solve. */
export const MAX_REDUCED = 40;
/** Rounds of taking eigenvalues into the reduced problem before a point is handed to a full solve. */
export const MAX_ROUNDS = 16;


function folded(ar: number, ai: number, br: number, bi: number): number {
  return hyp(ar - br, Math.abs(ai) - Math.abs(bi));
}

interface Solution {
  rp: ReducedProblem;
  roots: ReducedRoots;
  /** Matched baseline spectrum index per root. */
  matched: Int32Array;
  minRe: number;
  lambda2Root: number;
}

/** Diagnostics: told why each fallback happened (reason, and whether on a ladder point or a budget check). */
export type FallbackObserver = (reason: string, where: 'ladder' | 'check') => void;
let observer: FallbackObserver | null = null;
export function observeFallbacks(fn: FallbackObserver | null): void {
  observer = fn;
}

const patterns = new Map<number, Float64Array[]>();

/** Perturbation patterns used by the floor model. */
export const FLOOR_PATTERNS = 4;

/** FLOOR_PATTERNS fixed pseudo-random unit-Frobenius patterns of size m×m (deterministic). */
function floorPatterns(m: number): Float64Array[] {
  let cached = patterns.get(m);
  if (cached) return cached;
  const make = (seed: number) => {
    let state = seed >>> 0;
    const e = new Float64Array(m * m);
    let s = 0;
    for (let i = 0; i < m * m; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      e[i] = state / 4294967296 - 0.5;
      s += e[i] * e[i];
    }
    const inv = 1 / Math.sqrt(s);
    for (let i = 0; i < m * m; i++) e[i] *= inv;
    return e;
  };
  cached = Array.from({ length: FLOOR_PATTERNS }, (_, k) => make(0x5eed + 7919 * k + m));
  patterns.set(m, cached);
  return cached;
}

export class FastEdge {
  /** Points handed to the full solve. */
  fallbacks = 0;
  readonly coupling: EdgeCoupling;
  private readonly tie: number;

  private constructor(
    private readonly baseline: SpectralBaseline,
    private readonly ctx: FastContext,
    coupling: EdgeCoupling,
    private readonly branchSet: Set<number>,
    private readonly exact: (eps: number, floor: FloorKind) => PointEvaluation,
    private readonly conditionRaw: number,
  ) {
    this.coupling = coupling;
    this.tie = 1e3 * U * Math.max(baseline.maxDegree, Number.MIN_VALUE);
  }

  /** Null when the perturbation is not rank one (several listening rows). */
  static create(
    baseline: SpectralBaseline,
    ctx: FastContext,
    terms: { row: number; col: number; scale: number }[],
    branchSet: Set<number>,
    exact: (eps: number, floor: FloorKind) => PointEvaluation,
    conditionRaw: number,
  ): FastEdge | null {
    const cpl = edgeCoupling(ctx, terms);
    return cpl ? new FastEdge(baseline, ctx, cpl, branchSet, exact, conditionRaw) : null;
  }

  private fallback(eps: number, floor: FloorKind, why: string): PointEvaluation {
    this.fallbacks += 1;
    observer?.(why, floor === 'none' ? 'check' : 'ladder');
    return this.exact(eps, floor);
  }

  /** A ladder point (floor 'transpose' | 'condition') or a budget check (floor 'none'). */
  point(eps: number, floor: FloorKind): PointEvaluation {
    const { ctx } = this;
    const inR = new Uint8Array(ctx.data.items.length);
    inR[0] = 1;
    const items = [0];
    let size = ctx.size[0];
    const take = (k: number): boolean => {
      if (k < 0 || inR[k] || k === ctx.data.zeroItem) return false;
      inR[k] = 1;
      items.push(k);
      size += ctx.size[k];
      return size <= MAX_REDUCED;
    };
    for (let round = 0; round < MAX_ROUNDS; round++) {
      const rp = reducedProblem(ctx, this.coupling, items);
      // A well-conditioned core: scalar Newton on the secular function; else the matrix form.
      const scalar = ctx.corePoles ? scalarRoots(ctx, this.coupling, ctx.corePoles, eps, items.slice(1)) : null;
      const roots: ReducedRoots = scalar && scalar.ok ? scalar : solveReduced(ctx, this.coupling, rp, eps);
      if (!roots.ok) {
        // Usually an outside eigenvalue colliding with a branch: take the one interacting most.
        if (take(this.strongestOutside(eps, roots.stuckRe ?? NaN, roots.stuckIm ?? NaN, inR))) continue;
        return this.fallback(eps, floor, roots.reason ?? 'root search');
      }
      let minRe = Infinity;
      let lambda2Root = 0;
      for (let i = 0; i < roots.re.length; i++) {
        if (roots.re[i] < minRe || (roots.re[i] === minRe && roots.im[i] > roots.im[lambda2Root])) {
          minRe = roots.re[i];
          lambda2Root = i;
        }
      }
      const { matched, matchedItem, radius } = this.match(items, roots);
      // Half-plane to keep clear: left of the least real part; on ladder points also everything
      // within the matching radius of the items in R (so the one-to-one matching cannot change).
      let s = minRe + this.tie;
      if (floor !== 'none') {
        for (const k of items) {
          const vals = ctx.itemValues[k];
          for (let j = 0; j < vals.length; j += 2) s = Math.max(s, vals[j] + radius + this.tie);
        }
        const near = this.nearRoots(roots, radius, inR);
        if (near >= 0) {
          if (take(near)) continue;
          return this.fallback(eps, floor, 'too many movers');
        }
      }
      const cert = certifyHalfPlane(ctx, this.coupling, eps, s, inR);
      if (!cert.ok) {
        if (take(cert.culprit)) continue;
        return this.fallback(eps, floor, 'certificate');
      }
      // Reported against the baseline's value: Δ = (min Re − own unperturbed value) for a simple λ2.
      const re = minRe - this.referenceShift();
      if (floor === 'none') return { re, tracked: false, raw: NaN };
      let tracked = false;
      let overtaken = false;
      for (let i = 0; i < roots.re.length; i++) {
        if (roots.re[i] > minRe + this.tie) continue;
        if (this.branchSet.has(matched[i])) tracked = true;
        else if (matchedItem[i] !== 0) overtaken = true;
      }
      // Another eigenvalue took the least real part on a ladder point: an identity change, which
      // is confirmed by a full solve.
      if (overtaken && !tracked) return this.fallback(eps, floor, 'identity');
      let raw = NaN;
      if (floor === 'condition') raw = this.conditionRaw;
      else if (floor === 'transpose') raw = this.modelFloor({ rp, roots, matched, minRe, lambda2Root });
      return { re, tracked, raw };
    }
    return this.fallback(eps, floor, 'rounds');
  }

  /**
   * For a simple (or resolved) λ2 the baseline value is one solver's computed λ2 and this path's own
   * unperturbed λ2 differs from it by rounding (~κ·u·‖L‖); measuring Δ from the own value makes Δ
   * vanish as ε → 0 instead of carrying that constant offset. (A rounding-split cluster is measured
   * from its centre by both paths, and needs no shift.)
   */
  private referenceShift(): number {
    const ctx = this.ctx;
    if (ctx.referenceShift !== null) return ctx.referenceShift;
    let shift = 0;
    const b = this.baseline;
    if (b.cluster.size === 1 || b.cluster.resolved) {
      const idx = ctx.data.items[0].spectrumIndex.indexOf(b.lambda2Index);
      const own = idx >= 0 ? ctx.data.items[0].values[2 * idx] : NaN;
      // Only a rounding-sized difference is an offset; anything larger would be a different eigenvalue.
      // Relative to the matrix scale alone: a floor of 1 made the test absolute for weights below 1.
      if (Number.isFinite(own) && Math.abs(own - b.baselineRe) <= 1e-9 * Math.max(b.maxDegree, Number.MIN_VALUE)) shift = own - b.baselineRe;
    }
    ctx.referenceShift = shift;
    return shift;
  }

  /** An outside item whose baseline eigenvalue lies within the matching radius of a root (−1 if none). */
  private nearRoots(roots: ReducedRoots, radius: number, inR: Uint8Array): number {
    const { ctx } = this;
    const limit = radius + this.tie;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < roots.re.length; i++) {
      lo = Math.min(lo, roots.re[i]);
      hi = Math.max(hi, roots.re[i]);
    }
    // Only items whose real parts come within `limit` of a root can be that close.
    const from = lo - limit - ctx.reSpan;
    let a = 0;
    let b = ctx.byRe.length;
    while (a < b) {
      const mid = (a + b) >> 1;
      if (ctx.byReMin[mid] < from) a = mid + 1;
      else b = mid;
    }
    for (let j = a; j < ctx.byRe.length && ctx.byReMin[j] <= hi + limit; j++) {
      const k = ctx.byRe[j];
      if (inR[k]) continue;
      const vals = ctx.itemValues[k];
      for (let v = 0; v < vals.length; v += 2) {
        for (let i = 0; i < roots.re.length; i++) if (folded(roots.re[i], roots.im[i], vals[v], vals[v + 1]) <= limit) return k;
      }
    }
    return -1;
  }

  /** The outside item (not yet in R) contributing most to ε·h at z. */
  private strongestOutside(eps: number, zr: number, zi: number, inR: Uint8Array): number {
    if (!Number.isFinite(zr)) return -1;
    const { ctx } = this;
    const cpl = this.coupling;
    let best = -1;
    let bestMag = 0;
    const consider = (k: number, mag: number) => {
      if (!inR[k] && k !== ctx.data.zeroItem && mag > bestMag) {
        bestMag = mag;
        best = k;
      }
    };
    for (let i = 0; i < ctx.reals.length; i++) {
      consider(ctx.reals[i], Math.abs(eps * cpl.realBeta[i]) / hyp(cpl.realLambda[i] - zr, zi));
    }
    for (let i = 0; i < ctx.pairs.length; i++) {
      const d = Math.min(hyp(cpl.pairMuRe[i] - zr, cpl.pairMuIm[i] - zi), hyp(cpl.pairMuRe[i] - zr, cpl.pairMuIm[i] + zi));
      consider(ctx.pairs[i], (Math.abs(eps) * hyp(cpl.pairBetaRe[i], cpl.pairBetaIm[i])) / d);
    }
    return best;
  }

  /** One-to-one greedy matching (folded distance, closest pairs first) of the roots to the baseline eigenvalues of the items in R. */
  private match(items: number[], roots: ReducedRoots): { matched: Int32Array; matchedItem: Int32Array; radius: number } {
    const targets: { re: number; im: number; index: number; item: number }[] = [];
    for (const k of items) {
      const vals = this.ctx.itemValues[k];
      this.ctx.data.items[k].spectrumIndex.forEach((index, s) => targets.push({ re: vals[2 * s], im: vals[2 * s + 1], index, item: k }));
    }
    const n = roots.re.length;
    const pairs: { d: number; r: number; t: number }[] = [];
    for (let r = 0; r < n; r++) {
      for (let t = 0; t < targets.length; t++) pairs.push({ d: folded(roots.re[r], roots.im[r], targets[t].re, targets[t].im), r, t });
    }
    pairs.sort((x, y) => x.d - y.d);
    const matched = new Int32Array(n).fill(-1);
    const matchedItem = new Int32Array(n).fill(-1);
    const taken = new Uint8Array(targets.length);
    let radius = 0;
    let count = 0;
    for (const { d, r, t } of pairs) {
      if (matched[r] >= 0 || taken[t]) continue;
      matched[r] = targets[t].index;
      matchedItem[r] = targets[t].item;
      taken[t] = 1;
      radius = Math.max(radius, d);
      if (++count === n) break;
    }
    return { matched, matchedItem, radius };
  }

  /**
   * Raw error estimate of λ2 at this point: the larger of (a) how far λ2 of the reduced matrix
   * moves under perturbations sized like the rounding seen at ε = 0 (anchored, floorEta), and
   * (b) the first-order effect κ·η of a generic backward error η = 4u·‖L‖_F·(basis conditioning)
   * on the λ2 root (κ its eigenvalue condition number in the reduced matrix), capped at a tenth of
   * the root's distance to the nearest other root, where first order stops meaning anything.
   */
  private modelFloor(sol: Solution): number {
    const { rp, roots, lambda2Root } = sol;
    const ar = roots.alphaRe[lambda2Root];
    const ai = roots.alphaIm[lambda2Root];
    const anchored = modelSpread(rp, ar, ai, this.floorEta());
    let right = 0;
    let left = 0;
    for (const k of rp.items) {
      right += this.ctx.rightNorm[k] ** 2;
      left += this.ctx.leftNorm[k] ** 2;
    }
    const generic = (4 * U * this.baseline.normF * Math.sqrt(right * left)) / rp.size;
    const zr = roots.re[lambda2Root];
    const zi = roots.im[lambda2Root];
    let separation = Infinity;
    for (let i = 0; i < roots.re.length; i++) if (i !== lambda2Root) separation = Math.min(separation, hyp(roots.re[i] - zr, roots.im[i] - zi));
    const kappa = rootCondition(rp, ar, ai, zr, zi);
    const firstOrder = Number.isFinite(kappa) ? Math.min(kappa * generic, 0.1 * separation) : 0;
    return Math.max(anchored, firstOrder);
  }

  /**
   * The floor model's perturbation size, anchored once per network at ε = 0: the η for which the
   * model's spread of λ2 of the unperturbed core equals the rounding actually seen there — the
   * larger of the L/Lᵀ spread of the baseline solves and the cluster's split in this Schur form.
   * Found by bisection on log η (the spread grows with η).
   */
  private floorEta(): number {
    const ctx = this.ctx;
    if (ctx.floorEta !== null) return ctx.floorEta;
    const core = ctx.data.core;
    const scale = Math.max(this.baseline.normF, Number.MIN_VALUE);
    const rp0 = reducedProblem(ctx, this.coupling, [0]);
    const target = Math.max(core.rawAtZero, core.clusterRadius, 4 * U * scale);
    // Bisect on log(η/scale), not log η: the bisection then visits the same relative sizes whatever
    // the weight unit, so scaling every weight by a power of two scales η (and every floor) exactly.
    // On log η the endpoints log(1e-30·scale) shifted by a rounded log c, and where the model's own
    // rounding already meets the target (a defective core) η landed on a slightly different size
    // per scaling — enough to move the floors of flat sides by a factor of 3 or more.
    let lo = Math.log(1e-30);
    let hi = Math.log(1e-2);
    for (let i = 0; i < 50; i++) {
      const mid = 0.5 * (lo + hi);
      if (modelSpread(rp0, 0, 0, scale * Math.exp(mid)) < target) lo = mid;
      else hi = mid;
    }
    ctx.floorEta = scale * Math.exp(hi);
    return ctx.floorEta;
  }
}

/**
 * How far λ2 of M = A + α·q·pᵀ moves under fixed perturbation patterns of Frobenius size η: the
 * largest move over FLOOR_PATTERNS patterns (one pattern, or the difference of two, can come out
 * small by chance).
 */
function modelSpread(rp: ReducedProblem, ar: number, ai: number, eta: number): number {
  const m = rp.size;
  const patterns = floorPatterns(m);
  const lambda2 = (pattern: Float64Array | null): [number, number] => {
    const mr = new Float64Array(m * m);
    const mi = new Float64Array(m * m);
    for (let r = 0; r < m; r++) {
      for (let c = 0; c < m; c++) {
        const qp = rp.q[r] * rp.p[c];
        mr[r * m + c] = rp.a[r * m + c] + ar * qp + (pattern ? eta * pattern[r * m + c] : 0);
        mi[r * m + c] = ai * qp;
      }
    }
    const ev = complexEigenvalues(mr, mi, m);
    let best = 0;
    for (let i = 1; i < m; i++) if (ev.re[i] < ev.re[best] || (ev.re[i] === ev.re[best] && ev.im[i] > ev.im[best])) best = i;
    return [ev.re[best], ev.im[best]];
  };
  const [x0, y0] = lambda2(null);
  let spread = 0;
  for (const pattern of patterns) {
    const [x, y] = lambda2(pattern);
    spread = Math.max(spread, folded(x, y, x0, y0));
  }
  return spread;
}

/** Eigenvalue condition number ‖x‖‖y‖/|yᵀx| of the root z of M = A + α·q·pᵀ (inverse iteration just off z). */
function rootCondition(rp: ReducedProblem, ar: number, ai: number, zr: number, zi: number): number {
  const m = rp.size;
  if (m === 1) return 1;
  const mr = new Float64Array(m * m);
  const mi = new Float64Array(m * m);
  const tr = new Float64Array(m * m);
  const ti = new Float64Array(m * m);
  let scale = 0;
  for (let r = 0; r < m; r++) {
    for (let c = 0; c < m; c++) {
      const qp = rp.q[r] * rp.p[c];
      mr[r * m + c] = rp.a[r * m + c] + ar * qp;
      mi[r * m + c] = ai * qp;
      scale = Math.max(scale, hyp(mr[r * m + c], mi[r * m + c]));
    }
  }
  const shift = 1e3 * U * Math.max(scale, Number.MIN_VALUE);
  for (let r = 0; r < m; r++) {
    mr[r * m + r] -= zr + shift;
    mi[r * m + r] -= zi;
  }
  for (let r = 0; r < m; r++) for (let c = 0; c < m; c++) {
    tr[c * m + r] = mr[r * m + c];
    ti[c * m + r] = mi[r * m + c];
  }
  const ones = new Float64Array(m).fill(1);
  const zeros = new Float64Array(m);
  const x = solveComplexSmall(mr, mi, ones, zeros, m);
  const y = solveComplexSmall(tr, ti, ones, zeros, m);
  if (!x || !y) return Infinity;
  let xn = 0;
  let yn = 0;
  let dr = 0;
  let di = 0;
  for (let i = 0; i < m; i++) {
    xn += x.re[i] ** 2 + x.im[i] ** 2;
    yn += y.re[i] ** 2 + y.im[i] ** 2;
    dr += y.re[i] * x.re[i] - y.im[i] * x.im[i];
    di += y.re[i] * x.im[i] + y.im[i] * x.re[i];
  }
  const k = Math.sqrt(xn * yn) / hyp(dr, di);
  return Number.isFinite(k) ? k : Infinity;
}
