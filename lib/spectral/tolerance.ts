/**
 * Weight tolerance budgets.
 *
 * The question an engineer asks of an edge: how far may this weight drift before the convergence
 * rate Re λ2 changes by more than a fraction τ? That is the largest |ε| with |Δ(±ε)| ≤ τ·Re λ2.
 * The measured ladder points bracket the answer when it lies inside the ladder (interpolate in
 * log–log between the last point that passes and the first that fails); outside it the fitted end
 * laws extrapolate (small-ε law below, large-ε law above). A prediction is only a prediction:
 * it is then checked by a direct solve on both signs, and bisected downward if it fails (Δ is
 * assumed to grow with |ε| between the last passing and the first failing value).
 */
import type { ResponseLaws } from './classify';

export interface SignTrace {
  magnitudes: number[];
  /** |Δ| at each magnitude (every computed point, whatever eigenvalue carries λ2). */
  absDelta: number[];
  laws: ResponseLaws;
  flat: boolean;
}

/** Predicted largest |ε| with |Δ| ≤ allowed on one sign, before confirmation. Capped at `cap`. */
export function predictBudget(trace: SignTrace, allowed: number, cap: number): number {
  const { magnitudes: m, absDelta: d, laws } = trace;
  if (m.length === 0) return cap;
  let lastPass = -1;
  for (let i = 0; i < m.length; i++) {
    if (d[i] <= allowed) lastPass = i;
    else break;
  }
  const invert = (law: NonNullable<ResponseLaws['small']>): number =>
    Math.pow(10, (Math.log10(allowed) - law.intercept) / law.slope);
  let guess: number;
  if (lastPass === m.length - 1) {
    // Every point passes: extrapolate upward with the large-ε law, if there is one.
    const law = laws.large;
    guess = trace.flat || !law || !(law.slope > 0) ? cap : Math.max(invert(law), m[m.length - 1]);
  } else if (lastPass === -1) {
    const law = laws.small;
    guess = !law || !(law.slope > 0) ? m[0] / 2 : Math.min(invert(law), m[0]);
  } else {
    const x0 = Math.log10(m[lastPass]);
    const x1 = Math.log10(m[lastPass + 1]);
    const y0 = Math.log10(Math.max(d[lastPass], Number.MIN_VALUE));
    const y1 = Math.log10(d[lastPass + 1]);
    const y = Math.log10(allowed);
    const t = y1 === y0 ? 0 : Math.min(1, Math.max(0, (y - y0) / (y1 - y0)));
    guess = Math.pow(10, x0 + t * (x1 - x0));
  }
  return Math.min(Number.isFinite(guess) && guess > 0 ? guess : cap, cap);
}

/**
 * Confirm `candidate` with `passes` (a direct check on both signs); if it fails, halve until a
 * value passes and then bisect geometrically between pass and fail to a ratio of `ratio`.
 */
export function confirmBudget(
  candidate: number,
  passes: (eps: number) => boolean,
  ratio = 1.05,
  maxHalvings = 40,
): { eps: number; confirmed: boolean; checks: number } {
  let checks = 1;
  if (candidate <= 0 || passes(candidate)) return { eps: Math.max(candidate, 0), confirmed: true, checks };
  let hi = candidate;
  let lo = candidate / 2;
  let halvings = 0;
  for (;;) {
    checks += 1;
    if (passes(lo)) break;
    hi = lo;
    lo /= 2;
    halvings += 1;
    if (halvings >= maxHalvings) return { eps: 0, confirmed: false, checks };
  }
  while (hi / lo > ratio) {
    const mid = Math.sqrt(hi * lo);
    checks += 1;
    if (passes(mid)) lo = mid;
    else hi = mid;
  }
  return { eps: lo, confirmed: false, checks };
}
