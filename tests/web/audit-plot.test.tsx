import { fig, pct } from '@/components/audits/numbers';
import { fittedDelta, responseGeometry, type SignDetail } from '@/components/audits/response-geometry';
import { decadeLabel } from '@/components/audits/response-plot';

const frame = { width: 460, height: 260, pad: { l: 50, r: 10, t: 10, b: 50 } };
// Plot area: x from 50 to 450 (400 px), y from 10 to 210 (200 px).

/** A sign whose points follow |Δ| = c|ε|^p exactly, with the largest rungs left out of the fit. */
function sign(p: number, c: number, epss: number[], extra: Partial<SignDetail> = {}): SignDetail {
  return {
    class: p === 0.5 ? 'square-root' : 'linear',
    exponent: p,
    prefactor: c,
    flags: [],
    slopeSmall: p,
    slopeLarge: p,
    crossoverEps: null,
    noiseFloor: 1e-9,
    points: epss.map((e, i) => ({ eps: e, delta: Math.sign(e) * Math.abs(c) * Math.abs(e) ** p, floor: 1e-9, used: i < epss.length - 1 ? 1 : 0, tracked: 1 })),
    ...extra,
  };
}

describe('response plot geometry', () => {
  test('axes span whole decades around every point, fit and floor', () => {
    const g = responseGeometry({ plus: sign(1, 2, [1e-2, 1e-3, 1e-4]), minus: null }, frame);
    expect(g.xDecades).toEqual({ lo: -4, hi: -2 });
    // |Δ| from 2e-4 to 2e-2, floor 1e-9 → 10^-9 … 10^-1
    expect(g.yDecades).toEqual({ lo: -9, hi: -1 });
    expect(g.xTicks.map((t) => t.at)).toEqual([50, 250, 450]);
  });

  test('points sit where log10 puts them, filled when used in the fit', () => {
    const g = responseGeometry({ plus: sign(1, 1, [1e-2, 1e-3, 1e-4]), minus: null }, frame);
    const at = (e: number) => g.points.find((p) => p.eps === e)!;
    expect(at(1e-3).cx).toBeCloseTo(250);
    // |Δ| = 1e-3 on a 10^-9 … 10^-2 axis: 1 decade below the top of 7 → 10 + 200/7
    expect(g.yDecades).toEqual({ lo: -9, hi: -2 });
    expect(at(1e-3).cy).toBeCloseTo(10 + 200 / 7);
    expect(g.points.map((p) => p.used)).toEqual([true, true, false]);
  });

  test('a fitted square-root law is a straight line of slope ½ in decades', () => {
    const g = responseGeometry({ plus: null, minus: sign(0.5, -3, [-1e-8, -1e-6, -1e-4, -1e-2]) }, frame);
    const [f] = g.fits;
    expect(f.sign).toBe('minus');
    const pxPerDecadeX = 400 / (g.xDecades.hi - g.xDecades.lo);
    const pxPerDecadeY = 200 / (g.yDecades.hi - g.yDecades.lo);
    const slope = ((f.y1 - f.y2) / pxPerDecadeY) / ((f.x2 - f.x1) / pxPerDecadeX);
    expect(slope).toBeCloseTo(0.5, 10);
    // The line runs over the points used in the fit only (1e-8 … 1e-4), not the unused 1e-2.
    expect(f.x1).toBeCloseTo(g.points.find((p) => p.eps === 1e-8)!.cx);
    expect(f.x2).toBeCloseTo(g.points.find((p) => p.eps === 1e-4)!.cx);
    // …and passes through them: |prefactor|·|ε|^p.
    expect(f.y2).toBeCloseTo(g.points.find((p) => p.eps === 1e-4)!.cy);
    expect(fittedDelta(f, 1e-4)).toBeCloseTo(3e-2);
  });

  test('both signs, the noise floor path and a crossover marker', () => {
    const plus = sign(1, 1, [1e-2, 1e-3, 1e-4], { crossoverEps: 3.2e-3, flags: ['crossover'] });
    plus.points[2].floor = 1e-6;
    const g = responseGeometry({ plus, minus: sign(0.5, -1, [-1e-2, -1e-3, -1e-4]) }, frame);
    expect(new Set(g.points.map((p) => p.sign))).toEqual(new Set(['plus', 'minus']));
    expect(g.floors.map((f) => f.sign)).toEqual(['plus', 'minus']);
    // Floor points ordered by |ε| from left to right.
    const xs = g.floors[0].path.split(' ').map((pt) => Number(pt.split(',')[0]));
    expect(xs).toEqual([...xs].sort((a, b) => a - b));
    expect(g.crossovers).toHaveLength(1);
    expect(g.crossovers[0].at).toBeGreaterThan(g.points.find((p) => p.eps === 1e-3 && p.sign === 'plus')!.cx);
    expect(g.crossovers[0].at).toBeLessThan(g.points.find((p) => p.eps === 1e-2 && p.sign === 'plus')!.cx);
  });

  test('Δ = 0 has no place on a log axis: skipped and counted, and a flat class draws no fit', () => {
    const flat: SignDetail = { ...sign(1, 1, [1e-2, 1e-3]), class: 'flat', exponent: null, prefactor: null };
    flat.points[1].delta = 0;
    const g = responseGeometry({ plus: flat, minus: null }, frame);
    expect(g.skipped).toBe(1);
    expect(g.points).toHaveLength(1);
    expect(g.fits).toEqual([]);
  });

  test('nothing to draw still gives a sane frame', () => {
    const g = responseGeometry({ plus: null, minus: null }, frame);
    expect(g.points).toEqual([]);
    expect(g.xDecades.hi).toBeGreaterThan(g.xDecades.lo);
  });

  test('decade labels use true superscripts', () => {
    expect(decadeLabel(-7)).toBe('10⁻⁷');
    expect(decadeLabel(0)).toBe('1');
    expect(decadeLabel(2)).toBe('10²');
  });
});

describe('table figures', () => {
  test('whole numbers stay whole instead of turning into 1.0e+2', () => {
    expect(pct(1)).toBe('100');
    expect(pct(0.99999)).toBe('100');
    expect(fig(12345.6, 4)).toBe('12\u2009346');
    expect(fig(-250, 2)).toBe('−250');
    expect(pct(0.0123)).toBe('1.2');
    expect(pct(7.84e-6)).toBe('7.8×10⁻⁴');
    expect(pct(null)).toBe('—');
  });
});
