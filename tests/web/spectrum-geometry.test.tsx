import { markSpectrum, niceTicks } from '@/components/networks/spectrum-geometry';
import { fmt, fmtTick, scientific } from '@/components/ui/format';

describe('spectrum marking', () => {
  test('marks the eigenvalue nearest 0 as the zero mode and the cluster nearest λ2', () => {
    const spectrum = [
      { re: 3, im: 0 },
      { re: 2 + 1e-6, im: 2e-6 },
      { re: 1e-15, im: 0 },
      { re: 2 + 1e-6, im: -2e-6 },
      { re: 2 - 2e-6, im: 0 },
      { re: 4, im: 1 },
    ];
    const marked = markSpectrum({ spectrum, lambda2: { re: 2, im: 0 }, cluster: { size: 3, spread: 4e-6 }, rooted: true });
    expect(marked.map((p) => p.role)).toEqual(['other', 'cluster', 'zero', 'cluster', 'cluster', 'other']);
  });

  test('a simple λ2 marks exactly one point', () => {
    const marked = markSpectrum({ spectrum: [{ re: 0, im: 0 }, { re: 1, im: 0 }, { re: 1.5, im: 0 }], lambda2: { re: 1, im: 0 }, cluster: { size: 1, spread: 0 }, rooted: true });
    expect(marked.filter((p) => p.role === 'cluster').map((p) => p.re)).toEqual([1]);
  });
});

describe('axis ticks and figures', () => {
  test('ticks are round numbers that cover the range', () => {
    expect(niceTicks(0, 4.6)).toEqual([0, 1, 2, 3, 4]);
    const t = niceTicks(-8e-6, 8e-6, 4);
    expect(t[0]).toBeGreaterThanOrEqual(-8e-6);
    expect(t).toContain(0);
  });

  test('tiny values are written in scientific form with a true minus sign', () => {
    expect(scientific(1.6e-5, 2)).toBe('1.6×10⁻⁵');
    expect(fmtTick(-5e-6)).toBe('−5×10⁻⁶');
    expect(fmt(-0.5, 3)).toBe('−0.500');
    expect(fmt(null)).toBe('—');
  });
});

describe('figures that round past their digits', () => {
  test('99.999 to two digits is written 1.0×10², never in e-notation', () => {
    expect(fmt(99.999, 2)).toBe('1.0×10²');
    expect(fmt(12.34, 2)).toBe('12');
  });
});
