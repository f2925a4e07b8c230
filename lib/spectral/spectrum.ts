/**
 * Eigenvalues of the (non-symmetric) Laplacian and of its perturbations.
 *
 * The solver is ml-matrix's EigenvalueDecomposition (Hessenberg reduction and shifted QR), which is
 * backward stable: the computed eigenvalues are exact for a matrix within about u·‖L‖ of the input
 * (u the unit roundoff). For a simple eigenvalue that means an error of about κ·u·‖L‖; for a
 * defective one of Jordan size k the error is of order (u·‖L‖)^(1/k) — the reason the engine needs
 * clusters, baselines and noise floors at all.
 *
 * λ2 is picked by rule: set aside the one eigenvalue closest to 0 (every Laplacian has 0 exactly),
 * then take the least real part; among a conjugate pair, the member with non-negative imaginary part.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { Complex } from './types';

export interface EigenvalueList {
  re: number[];
  im: number[];
}

/** One weight change expressed on matrix entries: row `row` gains `scale·ε` on the diagonal and loses it at `col`. */
export interface EntryTerm {
  row: number;
  col: number;
  scale: number;
}

export function solveEigenvalues(matrix: Matrix): EigenvalueList {
  const decomposition = new EigenvalueDecomposition(matrix);
  return { re: decomposition.realEigenvalues, im: decomposition.imaginaryEigenvalues };
}

/** Full decomposition, for the baseline only (eigenvectors are needed there). */
export function decompose(matrix: Matrix): EigenvalueDecomposition {
  return new EigenvalueDecomposition(matrix);
}

export function toMatrix(flat: number[], n: number, transpose = false): Matrix {
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) m.set(i, j, transpose ? flat[j * n + i] : flat[i * n + j]);
  }
  return m;
}

/**
 * Reusable matrices for a sweep: L and Lᵀ are copied once; a point writes the few entries its
 * perturbation touches, solves, and writes the original values back (no drift, no reallocation
 * of the n×n input; the solver still allocates its own work arrays).
 */
export class PerturbationWorkspace {
  readonly n: number;
  private readonly base: number[];
  private readonly direct: Matrix;
  private transposed: Matrix | null = null;

  constructor(laplacian: number[], n: number) {
    this.n = n;
    this.base = laplacian;
    this.direct = toMatrix(laplacian, n);
  }

  /** Eigenvalues of L + ε·Σ scale·∂L (or of its transpose). */
  solve(terms: EntryTerm[], eps: number, transpose = false): EigenvalueList {
    const n = this.n;
    let m: Matrix;
    if (transpose) {
      if (!this.transposed) this.transposed = toMatrix(this.base, n, true);
      m = this.transposed;
    } else {
      m = this.direct;
    }
    const touched: [number, number][] = [];
    for (const { row, col, scale } of terms) {
      if (row === col) continue;
      const d = eps * scale;
      // Diagonal entry (row,row) is the same in both orientations; the off-diagonal one swaps.
      const [oi, oj] = transpose ? [col, row] : [row, col];
      m.set(row, row, m.get(row, row) + d);
      m.set(oi, oj, m.get(oi, oj) - d);
      touched.push([row, row], [oi, oj]);
    }
    try {
      return solveEigenvalues(m);
    } finally {
      for (const [i, j] of touched) m.set(i, j, transpose ? this.base[j * n + i] : this.base[i * n + j]);
    }
  }
}

/** Index of the eigenvalue closest to 0 — the one every Laplacian owns, set aside. */
export function zeroIndexOf(values: EigenvalueList): number {
  let best = 0;
  let bestAbs = Infinity;
  for (let i = 0; i < values.re.length; i++) {
    const a = Math.hypot(values.re[i], values.im[i]);
    if (a < bestAbs) {
      bestAbs = a;
      best = i;
    }
  }
  return best;
}

/** Least real part once `skip` is set aside; a conjugate pair resolves to its upper member. */
export function leastRealIndex(values: EigenvalueList, skip: number): number {
  let best = -1;
  for (let i = 0; i < values.re.length; i++) {
    if (i === skip) continue;
    if (
      best === -1 ||
      values.re[i] < values.re[best] ||
      (values.re[i] === values.re[best] && values.im[i] > values.im[best])
    ) {
      best = i;
    }
  }
  return best;
}

/** λ2 of an eigenvalue list (for n = 1 there is none: returns 0). */
export function lambda2Of(values: EigenvalueList): Complex {
  if (values.re.length < 2) return { re: 0, im: 0 };
  const i = leastRealIndex(values, zeroIndexOf(values));
  return { re: values.re[i], im: values.im[i] };
}

/**
 * Distance with conjugates identified (both points mirrored into the upper half plane): the natural
 * metric when a real matrix's eigenvalues can only be followed up to conjugation.
 */
export function foldedDistance(aRe: number, aIm: number, bRe: number, bIm: number): number {
  return Math.hypot(aRe - bRe, Math.abs(aIm) - Math.abs(bIm));
}

export function toComplexList(values: EigenvalueList): Complex[] {
  return values.re.map((re, i) => ({ re, im: values.im[i] }));
}

/** Sort for presentation: by real part, then imaginary part. Returns a new array. */
export function sortSpectrum(spectrum: Complex[]): Complex[] {
  return [...spectrum].sort((a, b) => a.re - b.re || a.im - b.im);
}
