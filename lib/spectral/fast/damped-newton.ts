/**
 * Newton's method for a root of a complex function, with every step cut to a length limit. The
 * secular functions of core-poles.ts have poles close to the roots sought; an unlimited step can
 * jump past a pole onto another branch's root, which the caller would then report twice.
 */
import { hyp } from './dense';

/** Value and derivative of the function at z = zr + i·zi: [fRe, fIm, f′Re, f′Im]. */
export type ValueAndSlope = (zr: number, zi: number) => [number, number, number, number];

/** Steps before giving up; the callers fall back to another method, so failing early is cheap. */
const STEPS = 30;

/**
 * The root reached from z, or null when the derivative vanishes or the iteration does not settle
 * (a step no longer than `tol`) within STEPS. With `real` the iterate stays on the real axis, where
 * the callers' functions are real: a real root comes out exactly real, and a real branch that cannot
 * settle there fails rather than drifting off (the callers retry off the axis, where two real roots
 * that met continue as a pair).
 */
export function dampedNewton(f: ValueAndSlope, zr: number, zi: number, real: boolean, limit: number, tol: number): [number, number] | null {
  for (let it = 0; it < STEPS; it++) {
    const [fr, fi, gr, gi] = f(zr, zi);
    const gg = gr * gr + gi * gi;
    if (!(gg > 0) || !Number.isFinite(gg)) return null;
    let sr = (fr * gr + fi * gi) / gg;
    let si = real ? 0 : (fi * gr - fr * gi) / gg;
    const size = hyp(sr, si);
    if (size > limit) {
      sr *= limit / size;
      si *= limit / size;
    }
    zr -= sr;
    zi -= si;
    if (size <= tol) return [zr, zi];
  }
  return null;
}
