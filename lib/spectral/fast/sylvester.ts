/**
 * Small Sylvester equations A·X − X·B = C (A p×p, B q×q, C p×q; all row-major), solved through the
 * Kronecker form (I_q ⊗ A − Bᵀ ⊗ I_p)·vec(X) = vec(C) with complete pivoting. Used for blocks of at
 * most a few dozen rows, where the p·q-dimensional system is cheap.
 *
 * Solvable exactly when A and B share no eigenvalue (G. H. Golub & C. F. Van Loan, Matrix
 * Computations, 4th ed., 2013, §7.6.3); the block sizes here stay small because the large
 * quasi-triangular factor is handled block by block (Bartels–Stewart order, in blocks.ts).
 */
import { solveSmall } from './dense';

export function solveSylvester(
  a: ArrayLike<number>,
  p: number,
  b: ArrayLike<number>,
  q: number,
  c: ArrayLike<number>,
): Float64Array | null {
  const d = p * q;
  const k = new Float64Array(d * d);
  const rhs = new Float64Array(d);
  // Unknown X[r][s] sits at index s·p + r (column-major vec).
  for (let s = 0; s < q; s++) {
    for (let r = 0; r < p; r++) {
      const row = s * p + r;
      rhs[row] = c[r * q + s];
      for (let t = 0; t < p; t++) k[row * d + s * p + t] += a[r * p + t];
      for (let t = 0; t < q; t++) k[row * d + t * p + r] -= b[t * q + s];
    }
  }
  let scale = 0;
  for (let i = 0; i < k.length; i++) scale = Math.max(scale, Math.abs(k[i]));
  const x = solveSmall(k, rhs, d, scale * 1e-300);
  if (!x) return null;
  const out = new Float64Array(p * q);
  for (let s = 0; s < q; s++) for (let r = 0; r < p; r++) out[r * q + s] = x[s * p + r];
  return out;
}
