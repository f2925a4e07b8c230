import type { EdgeDetail } from '@/lib/schemas/audit';

/**
 * Geometry of the log–log response plot, kept pure so it can be tested without
 * drawing: |Δ Re λ2| against |ε| for each sign, the fitted power laws
 * |prefactor|·|ε|^exponent, each sign's noise floor and crossover.
 */

export type SignDetail = NonNullable<EdgeDetail['plus']>;
export type Sign = 'plus' | 'minus';

export interface Frame {
  width: number;
  height: number;
  pad: { l: number; r: number; t: number; b: number };
}

export interface PlotPoint {
  sign: Sign;
  eps: number;
  delta: number;
  used: boolean;
  cx: number;
  cy: number;
}

export interface FitLine {
  sign: Sign;
  exponent: number;
  prefactor: number;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface ResponseGeometry {
  /** Decade exponents of each axis (10^lo … 10^hi). */
  xDecades: { lo: number; hi: number };
  yDecades: { lo: number; hi: number };
  xTicks: { value: number; at: number }[];
  yTicks: { value: number; at: number }[];
  points: PlotPoint[];
  fits: FitLine[];
  /** SVG polyline `points` strings, one per sign. */
  floors: { sign: Sign; path: string }[];
  crossovers: { sign: Sign; eps: number; at: number }[];
  /** Points with Δ = 0 (or ε = 0), which have no place on a log axis. */
  skipped: number;
}

const log = Math.log10;

function decades(values: number[]): { lo: number; hi: number } {
  const pos = values.filter((v) => v > 0 && Number.isFinite(v));
  if (pos.length === 0) return { lo: -1, hi: 0 };
  const lo = Math.floor(log(Math.min(...pos)));
  const hi = Math.ceil(log(Math.max(...pos)));
  return hi > lo ? { lo, hi } : { lo, hi: lo + 1 };
}

function ticks(d: { lo: number; hi: number }, at: (v: number) => number, most = 6) {
  const step = Math.max(1, Math.ceil((d.hi - d.lo) / most));
  const out: { value: number; at: number }[] = [];
  for (let k = d.lo; k <= d.hi; k += step) out.push({ value: 10 ** k, at: at(10 ** k) });
  return out;
}

/** |prefactor|·|ε|^exponent at |ε| = e. */
export const fittedDelta = (f: { exponent: number; prefactor: number }, e: number) => Math.abs(f.prefactor) * e ** f.exponent;

export function responseGeometry(signs: { plus: SignDetail | null; minus: SignDetail | null }, frame: Frame): ResponseGeometry {
  const entries = (['plus', 'minus'] as const).flatMap((sign) => (signs[sign] ? [{ sign, d: signs[sign]! }] : []));
  let skipped = 0;
  const raw = entries.flatMap(({ sign, d }) =>
    d.points.flatMap((p) => {
      const eps = Math.abs(p.eps), delta = Math.abs(p.delta);
      if (!(eps > 0) || !(delta > 0)) {
        skipped += 1;
        return [];
      }
      return [{ sign, eps, delta, used: p.used === 1 }];
    }),
  );
  const fitsRaw = entries.flatMap(({ sign, d }) => {
    if (d.exponent === null || d.prefactor === null || d.prefactor === 0 || d.class === 'flat') return [];
    const run = d.points.filter((p) => p.used === 1 && p.eps !== 0).map((p) => Math.abs(p.eps));
    const span = run.length >= 2 ? run : d.points.filter((p) => p.eps !== 0).map((p) => Math.abs(p.eps));
    if (span.length === 0) return [];
    const f = { exponent: d.exponent, prefactor: d.prefactor };
    const a = Math.min(...span), b = Math.max(...span);
    return [{ sign, ...f, a, b, ya: fittedDelta(f, a), yb: fittedDelta(f, b) }];
  });
  const floorPts = entries.map(({ sign, d }) => ({
    sign,
    pts: d.points.filter((p) => p.eps !== 0 && p.floor > 0).map((p) => ({ eps: Math.abs(p.eps), floor: p.floor })).sort((u, v) => u.eps - v.eps),
  }));
  const cross = entries.flatMap(({ sign, d }) => (d.crossoverEps && d.crossoverEps > 0 ? [{ sign, eps: d.crossoverEps }] : []));

  const xDecades = decades([...raw.map((p) => p.eps), ...cross.map((c) => c.eps), ...floorPts.flatMap((f) => f.pts.map((p) => p.eps))]);
  const yDecades = decades([...raw.map((p) => p.delta), ...fitsRaw.flatMap((f) => [f.ya, f.yb]), ...floorPts.flatMap((f) => f.pts.map((p) => p.floor))]);
  const { width, height, pad } = frame;
  const w = width - pad.l - pad.r, h = height - pad.t - pad.b;
  const x = (v: number) => pad.l + ((log(v) - xDecades.lo) / (xDecades.hi - xDecades.lo)) * w;
  const y = (v: number) => pad.t + ((yDecades.hi - log(v)) / (yDecades.hi - yDecades.lo)) * h;

  return {
    xDecades,
    yDecades,
    xTicks: ticks(xDecades, x),
    yTicks: ticks(yDecades, y, 5),
    points: raw.map((p) => ({ ...p, cx: x(p.eps), cy: y(p.delta) })),
    fits: fitsRaw.map((f) => ({ sign: f.sign, exponent: f.exponent, prefactor: f.prefactor, x1: x(f.a), y1: y(f.ya), x2: x(f.b), y2: y(f.yb) })),
    floors: floorPts.filter((f) => f.pts.length > 0).map((f) => ({ sign: f.sign, path: f.pts.map((p) => `${x(p.eps).toFixed(1)},${y(p.floor).toFixed(1)}`).join(' ') })),
    crossovers: cross.map((c) => ({ ...c, at: x(c.eps) })),
    skipped,
  };
}
