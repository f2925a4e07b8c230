/**
 * The ε ladder: ε = s·w̄·10^(−t) for t on an even grid (default 2, 2.5, …, 7), s = ±1.
 *
 * Geometric spacing gives equal weight to every decade of log|ε|, which is what a power-law fit in
 * log–log coordinates needs. Scaling by the mean weight w̄ makes the ladder mean the same relative
 * change on any network. On the minus side a real edge may only lose up to half its weight
 * (|ε| ≤ w_e/2): past that the link is nearly cut and the network is a different one. A weight-0
 * probe has no weight to lose; its minus side is a formal negative-weight probe and is kept whole.
 */
import type { LadderSpec, SweepSign } from './types';

/** Ladder magnitudes |ε|, increasing. */
export function ladderMagnitudes(spec: LadderSpec, meanWeight: number): number[] {
  const out: number[] = [];
  const count = Math.floor((spec.to - spec.from) / spec.step + 1e-9);
  for (let i = count; i >= 0; i--) {
    const t = spec.from + i * spec.step;
    out.push(meanWeight * Math.pow(10, -t));
  }
  return out;
}

/**
 * Signed ε values for one sign, increasing in |ε|, with the minus side cut at w/2 for real edges.
 * `truncated` tells whether any point was cut.
 */
export function signedLadder(
  magnitudes: number[],
  sign: SweepSign,
  edgeWeight: number,
): { eps: number[]; truncated: boolean } {
  if (sign === 'plus') return { eps: [...magnitudes], truncated: false };
  if (edgeWeight === 0) return { eps: magnitudes.map((m) => -m), truncated: false };
  const kept = magnitudes.filter((m) => m <= edgeWeight / 2);
  return { eps: kept.map((m) => -m), truncated: kept.length < magnitudes.length };
}
