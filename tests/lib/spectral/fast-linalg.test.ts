/**
 * The dense linear algebra under the fast sweep: Hessenberg form, real Schur form, block swaps,
 * Sylvester equations, small complex eigenvalues, block-diagonalisation and the λ2 cluster's
 * spectral projector — against closed forms and against ml-matrix.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { analyseBaseline, randomNetwork, seededUniform, type Complex } from '@/lib/spectral';
import { reduceToHessenberg } from '@/lib/spectral/fast/hessenberg';
import { blockLayout, eig2, realSchur } from '@/lib/spectral/fast/schur';
import { swapAdjacent } from '@/lib/spectral/fast/reorder';
import { solveSylvester } from '@/lib/spectral/fast/sylvester';
import { complexEigenvalues } from '@/lib/spectral/fast/small-eig';
import { multiply, transpose } from '@/lib/spectral/fast/dense';
import { net, spectrumDistance } from './helpers';

function randomMatrix(n: number, seed: number): Float64Array {
  const rand = seededUniform(seed);
  return Float64Array.from({ length: n * n }, () => 2 * rand() - 1);
}

function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

function orthogonalityDefect(q: Float64Array, n: number): number {
  const qtq = multiply(transpose(q, n), q, n);
  let m = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m = Math.max(m, Math.abs(qtq[i * n + j] - (i === j ? 1 : 0)));
  return m;
}

/** Eigenvalues read off the diagonal blocks of a quasi-triangular matrix. */
function schurValues(t: Float64Array, n: number): Complex[] {
  const out: Complex[] = [];
  for (const { start: s, size } of blockLayout(t, n)) {
    if (size === 1) out.push({ re: t[s * n + s], im: 0 });
    else {
      const e = eig2(t[s * n + s], t[s * n + s + 1], t[(s + 1) * n + s], t[(s + 1) * n + s + 1]);
      out.push({ re: e.re1, im: e.im }, { re: e.re2, im: -e.im });
    }
  }
  return out;
}

function mlValues(a: ArrayLike<number>, n: number): Complex[] {
  const rows = Array.from({ length: n }, (_, i) => Array.from(a).slice(i * n, i * n + n));
  const d = new EigenvalueDecomposition(new Matrix(rows));
  return d.realEigenvalues.map((re, i) => ({ re, im: d.imaginaryEigenvalues[i] }));
}

describe('Hessenberg reduction', () => {
  it.each([5, 12, 30])('n = %i: H = QᵀAQ is upper Hessenberg, Q orthogonal', (n) => {
    const a = randomMatrix(n, 100 + n);
    const h = Float64Array.from(a);
    const q = reduceToHessenberg(h, n);
    for (let i = 2; i < n; i++) for (let j = 0; j < i - 1; j++) expect(h[i * n + j]).toBe(0);
    expect(orthogonalityDefect(q, n)).toBeLessThan(1e-14);
    expect(maxAbsDiff(multiply(multiply(q, h, n), transpose(q, n), n), a)).toBeLessThan(1e-13);
  });
});

describe('real Schur form', () => {
  it.each([4, 9, 25, 40])('random n = %i: A = QTQᵀ, T quasi-triangular, eigenvalues as ml-matrix', (n) => {
    const a = randomMatrix(n, 200 + n);
    const { t, q } = realSchur(a, n);
    expect(orthogonalityDefect(q, n)).toBeLessThan(1e-13);
    expect(maxAbsDiff(multiply(multiply(q, t, n), transpose(q, n), n), a)).toBeLessThan(1e-12);
    for (const { start, size } of blockLayout(t, n)) {
      // 2×2 blocks hold complex pairs only (real pairs were split by a rotation).
      if (size === 2) expect(eig2(t[start * n + start], t[start * n + start + 1], t[(start + 1) * n + start], t[(start + 1) * n + start + 1]).im).toBeGreaterThan(0);
    }
    expect(spectrumDistance(schurValues(t, n), mlValues(a, n))).toBeLessThan(1e-10);
  });

  it('a rotation–scaling block keeps its closed-form pair a ± ib', () => {
    // [[a, −b], [b, a]] has eigenvalues a ± ib (by hand: (a − λ)² + b² = 0).
    const a = 0.7;
    const b = 1.3;
    const { t } = realSchur([a, -b, 0.4, b, a, -0.2, 0, 0, 3], 3);
    const vals = schurValues(t, 3).sort((x, y) => x.re - y.re || x.im - y.im);
    expect(vals[0].re).toBeCloseTo(a, 13);
    expect(Math.abs(vals[0].im)).toBeCloseTo(b, 13);
    expect(vals[2].re).toBeCloseTo(3, 13);
  });

  it.each([5, 13])('directed %i-cycle Laplacian: eigenvalues 1 − e^(2πik/n)', (n) => {
    // Circulant I − P (P. J. Davis, Circulant Matrices, 1979).
    const names = Array.from({ length: n }, (_, i) => `v${i}`);
    const b = analyseBaseline(net(names.map((s, i) => [s, names[(i + 1) % n], 1] as [string, string, number]), names));
    const { t } = realSchur(b.laplacian, n);
    const expected = Array.from({ length: n }, (_, k) => ({ re: 1 - Math.cos((2 * Math.PI * k) / n), im: -Math.sin((2 * Math.PI * k) / n) }));
    expect(spectrumDistance(schurValues(t, n), expected)).toBeLessThan(1e-12);
  });
});

describe('swapping adjacent Schur blocks', () => {
  it('moves every block to the top in turn: similarity kept, eigenvalue order changed', () => {
    const n = 10;
    const a = randomMatrix(n, 321);
    const { t, q } = realSchur(a, n);
    const layout = blockLayout(t, n);
    // Bubble the last block to the front.
    let sizes = layout.map((b) => b.size);
    const lastValue = schurValues(t, n).slice(-1)[0];
    for (let p = sizes.length - 1; p > 0; p--) {
      const j = sizes.slice(0, p - 1).reduce((s, x) => s + x, 0);
      expect(swapAdjacent(t, q, n, j, sizes[p - 1], sizes[p])).toBe(true);
      [sizes[p - 1], sizes[p]] = [sizes[p], sizes[p - 1]];
    }
    sizes = [...sizes];
    expect(orthogonalityDefect(q, n)).toBeLessThan(1e-13);
    expect(maxAbsDiff(multiply(multiply(q, t, n), transpose(q, n), n), a)).toBeLessThan(1e-12);
    for (let i = sizes[0]; i < n; i++) for (let j = 0; j < sizes[0]; j++) expect(t[i * n + j]).toBe(0);
    const first = sizes[0] === 1 ? { re: t[0], im: 0 } : (() => {
      const e = eig2(t[0], t[1], t[n], t[n + 1]);
      return { re: e.re1, im: e.im };
    })();
    expect(Math.hypot(first.re - lastValue.re, Math.abs(first.im) - Math.abs(lastValue.im))).toBeLessThan(1e-11);
  });
});

describe('Sylvester equations', () => {
  it('diagonal A and B: X_ij = C_ij / (a_i − b_j) (by hand)', () => {
    const x = solveSylvester([2, 0, 0, 5], 2, [1, 0, 0, -3], 2, [1, 2, 3, 4]) as Float64Array;
    [1 / (2 - 1), 2 / (2 + 3), 3 / (5 - 1), 4 / (5 + 3)].forEach((v, i) => expect(x[i]).toBeCloseTo(v, 15));
  });

  it('random blocks: the residual AX − XB − C is at rounding level', () => {
    const a = randomMatrix(4, 11);
    const b = Float64Array.from(randomMatrix(3, 12), (v, i) => v + (i % 4 === 0 ? 5 : 0));
    const c = randomMatrix(4, 13).slice(0, 12);
    const x = solveSylvester(a, 4, b, 3, c) as Float64Array;
    let worst = 0;
    for (let r = 0; r < 4; r++) {
      for (let s = 0; s < 3; s++) {
        let v = -c[r * 3 + s];
        for (let k = 0; k < 4; k++) v += a[r * 4 + k] * x[k * 3 + s];
        for (let k = 0; k < 3; k++) v -= x[r * 3 + k] * b[k * 3 + s];
        worst = Math.max(worst, Math.abs(v));
      }
    }
    expect(worst).toBeLessThan(1e-13);
  });

  it('shared eigenvalues: no solution is reported', () => {
    expect(solveSylvester([1], 1, [1], 1, [1])).toBeNull();
  });
});

describe('eigenvalues of small complex matrices', () => {
  it.each([1, 2, 3, 6, 11])('real n = %i agrees with ml-matrix', (n) => {
    const a = randomMatrix(n, 400 + n);
    const e = complexEigenvalues(a, new Float64Array(n * n), n);
    const vals = Array.from(e.re, (re, i) => ({ re, im: e.im[i] }));
    expect(spectrumDistance(vals, mlValues(a, n))).toBeLessThan(1e-12);
  });

  it('a complex triangular matrix returns its diagonal; a similarity does not change it', () => {
    // Upper triangular ⇒ eigenvalues are the diagonal (by hand); S T S⁻¹ with S = I + N (N strictly
    // lower, so S⁻¹ = I − N + N² − …) keeps them.
    const n = 4;
    const diag: Complex[] = [{ re: 1, im: 2 }, { re: -0.5, im: 0.3 }, { re: 3, im: -1 }, { re: 0.2, im: 0 }];
    const tr = new Float64Array(n * n);
    const ti = new Float64Array(n * n);
    const rand = seededUniform(9);
    for (let i = 0; i < n; i++) {
      tr[i * n + i] = diag[i].re;
      ti[i * n + i] = diag[i].im;
      for (let j = i + 1; j < n; j++) {
        tr[i * n + j] = rand() - 0.5;
        ti[i * n + j] = rand() - 0.5;
      }
    }
    const direct = complexEigenvalues(tr, ti, n);
    expect(spectrumDistance(Array.from(direct.re, (re, i) => ({ re, im: direct.im[i] })), diag)).toBeLessThan(1e-14);
    // S = I + e₂e₁ᵀ·s (one subdiagonal entry), S⁻¹ = I − e₂e₁ᵀ·s.
    const s = 0.7;
    const mr = Float64Array.from(tr);
    const mi = Float64Array.from(ti);
    // Rows: row1 += s·row0; columns: col0 −= s·col1.
    for (let j = 0; j < n; j++) {
      mr[n + j] += s * tr[j];
      mi[n + j] += s * ti[j];
    }
    for (let i = 0; i < n; i++) {
      mr[i * n] -= s * mr[i * n + 1];
      mi[i * n] -= s * mi[i * n + 1];
    }
    const similar = complexEigenvalues(mr, mi, n);
    expect(spectrumDistance(Array.from(similar.re, (re, i) => ({ re, im: similar.im[i] })), diag)).toBeLessThan(1e-13);
  });
});

describe('block-diagonal form and the λ2 cluster projector', () => {
  function projector(b: ReturnType<typeof analyseBaseline>): { p: Float64Array; n: number; m: number } {
    const f = b.fast;
    if (!f || !f.ok) throw new Error('no fast data');
    const n = f.n;
    const m = f.core.size;
    const p = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) for (let k = 0; k < m; k++) p[i * n + j] += f.v[i * n + k] * f.wt[j * n + k];
    return { p, n, m };
  }

  it('triangle 1→2, 2→3, 3→1, 2→1: the core is the defective pair at 2 and P = I − 1ℓᵀ', () => {
    // The core holds every eigenvalue but 0, so P = I − (projector on 0) = I − 1ℓᵀ with ℓ the left
    // null vector normalised by ℓᵀ1 = 1. Columns of ℓᵀL = 0 with rows (2, −1, −1), (−1, 1, 0),
    // (0, −1, 1): 2ℓ₁ = ℓ₂, ℓ₃ = ℓ₁ ⇒ ℓ = (1, 2, 1)/4 (by hand).
    const b = analyseBaseline(net([['1', '2', 1], ['2', '3', 1], ['3', '1', 1], ['2', '1', 1]]));
    expect(b.fast?.core.size).toBe(2);
    expect(b.fast?.core.clusterSize).toBe(2);
    const { p, n } = projector(b);
    const ell = [0.25, 0.5, 0.25];
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(p[i * n + j]).toBeCloseTo((i === j ? 1 : 0) - ell[j], 13);
  });

  it.each([
    ['random N = 60', randomNetwork({ nodes: 60, seed: 606 })],
    ['4-cycle with chords (Jordan block of size 3)', net([['1', '2', 1], ['2', '3', 1], ['3', '4', 1], ['4', '1', 1], ['1', '3', 1], ['1', '4', 1]])],
  ])('%s: P² = P, LP = PL, trace P = core size, ‖P² − P‖ reported at rounding level', (_, network) => {
    const b = analyseBaseline(network);
    const { p, n, m } = projector(b);
    const p2 = multiply(p, p, n);
    const L = Float64Array.from(b.laplacian);
    const lp = multiply(L, p, n);
    const pl = multiply(p, L, n);
    expect(maxAbsDiff(p2, p)).toBeLessThan(1e-12);
    expect(maxAbsDiff(lp, pl)).toBeLessThan(1e-11);
    let trace = 0;
    for (let i = 0; i < n; i++) trace += p[i * n + i];
    expect(trace).toBeCloseTo(m, 11);
    expect(b.fast?.core.projectorDefect).toBeLessThan(1e-13);
    expect(b.fast?.core.invarianceResidual).toBeLessThan(1e-12);
  });

  it('simple λ2: P = x zᵀ / (zᵀx) from ml-matrix eigenvectors of L and Lᵀ', () => {
    // Spectral projector of a simple eigenvalue (G. H. Golub & C. F. Van Loan, Matrix
    // Computations, 4th ed., 2013, §7.2 — cited from memory).
    const b = analyseBaseline(randomNetwork({ nodes: 25, seed: 2525 }));
    expect(b.fast?.core.size).toBe(1);
    expect(b.lambda2.im).toBe(0);
    const { p, n } = projector(b);
    const { right: x, left: z, pairing } = b.firstOrder as NonNullable<typeof b.firstOrder>;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) expect(p[i * n + j]).toBeCloseTo((x.re[i] * z.re[j]) / pairing.re, 11);
    }
  });

  it('V⁻¹·V = I and V·diag(B)·V⁻¹ = L on a random network', () => {
    const b = analyseBaseline(randomNetwork({ nodes: 40, seed: 4040 }));
    const f = b.fast as NonNullable<typeof b.fast>;
    const n = f.n;
    const v = Float64Array.from(f.v);
    const winv = transpose(Float64Array.from(f.wt), n);
    const eye = multiply(winv, v, n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(Math.abs(eye[i * n + j] - (i === j ? 1 : 0))).toBeLessThan(1e-12);
    const d = new Float64Array(n * n);
    for (const it of f.items) for (let r = 0; r < it.size; r++) for (let c = 0; c < it.size; c++) d[(it.start + r) * n + it.start + c] = it.block[r * it.size + c];
    expect(maxAbsDiff(multiply(multiply(v, d, n), winv, n), b.laplacian)).toBeLessThan(1e-11);
  });
});
