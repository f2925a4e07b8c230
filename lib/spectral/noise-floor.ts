/**
 * Noise floor of the λ2 response.
 *
 * A point is only evidence if Δ(ε) stands clearly above the solver's error on λ2 at that point. The
 * raw estimate is a difference between two computations of the same eigenvalue that round
 * differently — λ2 of M and of Mᵀ (equal in exact arithmetic) — or, where λ2 is simple and well
 * conditioned, the first-order bound κ·u·‖L‖. Either can be small by luck, so it is made robust:
 * near a defective eigenvalue the error grows as |ε| shrinks (the split eigenvalues become more
 * ill-conditioned), never the other way, so each point takes the running maximum of the raw
 * estimates from the largest |ε| down to itself, times a safety factor.
 */
import { UNIT_ROUNDOFF } from './cluster';

/**
 * @param raw raw error estimates ordered by increasing |ε| (NaN: point does not take part)
 * @param safety multiplier (≥ 1)
 * @param minimum lowest raw value allowed (the baseline's own uncertainty)
 */
export function robustFloors(raw: number[], safety: number, minimum: number): number[] {
  const out = new Array<number>(raw.length);
  let running = minimum;
  for (let i = raw.length - 1; i >= 0; i--) {
    if (Number.isFinite(raw[i])) running = Math.max(running, raw[i]);
    out[i] = safety * running;
  }
  return out;
}

/** First-order error estimate for a simple eigenvalue of condition κ in a matrix of Frobenius norm ‖L‖. */
export function conditionFloor(condition: number, normF: number, n: number): number {
  return 4 * Math.sqrt(n) * condition * UNIT_ROUNDOFF * normF;
}
