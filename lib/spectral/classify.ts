/**
 * From ladder points to a response class for one sign.
 *
 * Lidskii–Vishik–Lyusternik theory says that under a generic perturbation a Jordan block of size k
 * splits like |ε|^(1/k), so the small-ε exponent names the local structure at λ2: 1 for a simple
 * eigenvalue (or a semisimple one), 1/2 for a 2-block, 1/3 for a 3-block. An exponent of 2 appears
 * when the first-order term vanishes. The class therefore comes from the slope over the three
 * smallest |ε| of the fitted run (the asymptotic regime), matched to the nearest of 1/3, 1/2, 1, 2
 * within a fixed window.
 */
import type { LadderPoint, ResponseClass, ResponseFlag, SignResponse } from './types';
import { fitLine, interceptForSlope, longestRun, meetingPoint, type Line } from './fit';

export const CLASS_EXPONENTS: ReadonlyArray<{ name: ResponseClass; exponent: number }> = [
  { name: 'cube-root', exponent: 1 / 3 },
  { name: 'square-root', exponent: 1 / 2 },
  { name: 'linear', exponent: 1 },
  { name: 'quadratic', exponent: 2 },
];
/** Half-width of the window around each exponent. */
export const CLASS_WINDOW = 0.07;
/** Minimal drift |slopeSmall − slopeLarge| that counts as a crossover. */
export const CROSSOVER_DRIFT = 0.15;
/** Points needed for a fit that may name a class. */
export const MIN_RUN = 3;
/** Points this many floors above the floor are "clean" (used for the prefactor when available). */
export const CLEAN_MARGIN = 10;

export function classFromSlope(slope: number | null): ResponseClass {
  if (slope === null || !Number.isFinite(slope)) return 'other';
  let best: { name: ResponseClass; exponent: number } | null = null;
  for (const c of CLASS_EXPONENTS) {
    if (Math.abs(slope - c.exponent) <= CLASS_WINDOW && (!best || Math.abs(slope - c.exponent) < Math.abs(slope - best.exponent))) {
      best = c;
    }
  }
  return best ? best.name : 'other';
}

export function exponentOfClass(name: ResponseClass): number | null {
  return CLASS_EXPONENTS.find((c) => c.name === name)?.exponent ?? null;
}

/** The two end laws, kept for the tolerance budget (log10 form, sign separate). */
export interface ResponseLaws {
  small: Line | null;
  large: Line | null;
  /** Sign of Δ at the small end of the run (+1/−1). */
  sign: number;
}

export interface SignInput {
  eps: number[];
  delta: number[];
  floor: number[];
  tracked: boolean[];
  truncated: boolean;
  probe: boolean;
}

export function analyseSign(input: SignInput): { response: SignResponse; laws: ResponseLaws } {
  const { eps, delta, floor, tracked } = input;
  const n = eps.length;
  const flags: ResponseFlag[] = [];
  if (input.probe) flags.push('probe');
  if (input.truncated) flags.push('truncated');
  if (tracked.some((t) => !t)) flags.push('identity-change');

  const ok = eps.map((_, i) => tracked[i] && Math.abs(delta[i]) > floor[i]);
  const [a, b] = longestRun(ok);
  const run = b - a;
  const used = eps.map((_, i) => (i >= a && i < b ? 1 : 0) as 0 | 1);
  const points: LadderPoint[] = eps.map((e, i) => ({
    eps: e,
    delta: delta[i],
    floor: floor[i],
    used: used[i],
    tracked: (tracked[i] ? 1 : 0) as 0 | 1,
  }));
  const noiseFloor = floor.length ? Math.max(...floor) : 0;
  const empty = {
    exponent: null,
    prefactor: null,
    slopeSmall: null,
    slopeLarge: null,
    crossoverEps: null,
    noiseFloor,
    points,
  };
  const noLaws: ResponseLaws = { small: null, large: null, sign: 1 };

  if (n === 0 || !tracked.some(Boolean)) {
    flags.push('low-signal');
    return { response: { class: 'other', flags, ...empty }, laws: noLaws };
  }
  if (run === 0) {
    return { response: { class: 'flat', flags, ...empty }, laws: noLaws };
  }

  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = a; i < b; i++) {
    xs.push(Math.log10(Math.abs(eps[i])));
    ys.push(Math.log10(Math.abs(delta[i])));
  }
  const sign = Math.sign(delta[a]) || 1;
  if (delta.slice(a, b).some((d) => Math.sign(d) !== sign)) flags.push('mixed-sign');

  if (run < MIN_RUN) {
    flags.push('low-signal');
    const line = run >= 2 ? fitLine(xs, ys) : null;
    return {
      response: {
        class: 'other',
        flags,
        ...empty,
        exponent: line ? line.slope : null,
        prefactor: line ? sign * Math.pow(10, line.intercept) : null,
      },
      laws: { small: line, large: line, sign },
    };
  }

  const whole = fitLine(xs, ys);
  const small = fitLine(xs.slice(0, MIN_RUN), ys.slice(0, MIN_RUN));
  const large = fitLine(xs.slice(-MIN_RUN), ys.slice(-MIN_RUN));
  const cls = classFromSlope(small.slope);
  // The prefactor belongs to the asymptotic law: with the class's exact exponent over the small end.
  // Its window is the three smallest run points standing a further factor CLEAN_MARGIN above the
  // floor when there are three such points (their relative error is then below about 1 %), else
  // the three smallest of the run.
  const p = exponentOfClass(cls);
  let window = [0, 1, 2];
  const clean: number[] = [];
  for (let i = a; i < b; i++) if (Math.abs(delta[i]) >= CLEAN_MARGIN * floor[i]) clean.push(i - a);
  if (clean.length >= MIN_RUN) window = clean.slice(0, MIN_RUN);
  const logC =
    p === null
      ? whole.intercept
      : interceptForSlope(
          window.map((i) => xs[i]),
          window.map((i) => ys[i]),
          p,
        );

  let crossoverEps: number | null = null;
  if (run >= 5 && Math.abs(small.slope - large.slope) > CROSSOVER_DRIFT) {
    flags.push('crossover');
    crossoverEps = meetingPoint(small, large);
  }
  return {
    response: {
      class: cls,
      exponent: whole.slope,
      prefactor: sign * Math.pow(10, logC),
      flags,
      slopeSmall: small.slope,
      slopeLarge: large.slope,
      crossoverEps,
      noiseFloor,
      points,
    },
    laws: { small, large, sign },
  };
}
