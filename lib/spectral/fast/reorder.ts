/**
 * Reordering a real Schur form: swapping two adjacent diagonal blocks (1×1 or 2×2) by an orthogonal
 * similarity, so that chosen eigenvalues can be brought to the top-left corner.
 *
 * Method ("direct swapping"): for M = [[A, C], [0, B]] solve A·X − X·B = C; then M·[X; −I] =
 * [X; −I]·B, so the columns of [X; −I] span B's invariant subspace. An orthogonal Z whose first
 * columns span that subspace (Householder QR of [X; −I]) gives Zᵀ M Z = [[B', *], [E, A']] with E
 * zero in exact arithmetic; E is checked against the rounding level and set to zero.
 * Z. Bai & J. W. Demmel, "On swapping diagonal blocks in real Schur form", Linear Algebra Appl. 186,
 * 1993; G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013, §7.6.2 (cited from memory).
 */
import { solveSylvester } from './sylvester';
import { U } from './dense';

/** Explicit orthogonal factor (k×k, row-major) of a Householder QR of the k×c matrix z (row-major). */
function orthogonalFactor(z: Float64Array, k: number, c: number): Float64Array {
  const q = new Float64Array(k * k);
  for (let i = 0; i < k; i++) q[i * k + i] = 1;
  const a = Float64Array.from(z);
  const v = new Float64Array(k);
  for (let col = 0; col < c; col++) {
    let norm = 0;
    for (let i = col; i < k; i++) norm += a[i * c + col] * a[i * c + col];
    norm = Math.sqrt(norm);
    if (norm === 0) continue;
    const x0 = a[col * c + col];
    const alpha = x0 >= 0 ? -norm : norm;
    v.fill(0);
    v[col] = x0 - alpha;
    for (let i = col + 1; i < k; i++) v[i] = a[i * c + col];
    let vtv = 0;
    for (let i = col; i < k; i++) vtv += v[i] * v[i];
    const beta = 2 / vtv;
    for (let j = 0; j < c; j++) {
      let s = 0;
      for (let i = col; i < k; i++) s += v[i] * a[i * c + j];
      s *= beta;
      for (let i = col; i < k; i++) a[i * c + j] -= s * v[i];
    }
    // q ← q·(I − β v vᵀ)
    for (let i = 0; i < k; i++) {
      let s = 0;
      for (let j = col; j < k; j++) s += q[i * k + j] * v[j];
      s *= beta;
      for (let j = col; j < k; j++) q[i * k + j] -= s * v[j];
    }
  }
  return q;
}

/**
 * Swap the adjacent diagonal blocks of sizes p (at j) and q (at j + p) of the quasi-triangular t,
 * updating the orthogonal factor `qm` (t = qmᵀ·L·qm stays true). Returns false (leaving t and qm
 * untouched) when the blocks share eigenvalues or the swap would not be backward stable.
 */
export function swapAdjacent(t: Float64Array, qm: Float64Array, n: number, j: number, p: number, q: number): boolean {
  const k = p + q;
  const a = new Float64Array(p * p);
  const b = new Float64Array(q * q);
  const c = new Float64Array(p * q);
  let mNorm = 0;
  for (let r = 0; r < k; r++) for (let s = 0; s < k; s++) mNorm += t[(j + r) * n + j + s] ** 2;
  mNorm = Math.sqrt(mNorm);
  for (let r = 0; r < p; r++) for (let s = 0; s < p; s++) a[r * p + s] = t[(j + r) * n + j + s];
  for (let r = 0; r < q; r++) for (let s = 0; s < q; s++) b[r * q + s] = t[(j + p + r) * n + j + p + s];
  for (let r = 0; r < p; r++) for (let s = 0; s < q; s++) c[r * q + s] = t[(j + r) * n + j + p + s];
  const x = solveSylvester(a, p, b, q, c);
  if (!x) return false;
  const z = new Float64Array(k * q);
  for (let r = 0; r < p; r++) for (let s = 0; s < q; s++) z[r * q + s] = x[r * q + s];
  for (let r = 0; r < q; r++) z[(p + r) * q + r] = -1;
  const zq = orthogonalFactor(z, k, q);
  // Check on a copy of the k×k block first (stability test), then apply to the whole matrix.
  const m = new Float64Array(k * k);
  for (let r = 0; r < k; r++) for (let s = 0; s < k; s++) m[r * k + s] = t[(j + r) * n + j + s];
  const tmp = new Float64Array(k * k);
  for (let r = 0; r < k; r++) for (let s = 0; s < k; s++) {
    let acc = 0;
    for (let u = 0; u < k; u++) acc += m[r * k + u] * zq[u * k + s];
    tmp[r * k + s] = acc;
  }
  let lower = 0;
  for (let r = q; r < k; r++) for (let s = 0; s < q; s++) {
    let acc = 0;
    for (let u = 0; u < k; u++) acc += zq[u * k + r] * tmp[u * k + s];
    lower += acc * acc;
  }
  if (!(Math.sqrt(lower) <= 1e3 * U * Math.max(mNorm, Number.MIN_VALUE))) return false;
  // Rows j..j+k−1 (columns j..n−1): T ← Zᵀ T.
  const row = new Float64Array(k);
  for (let col = j; col < n; col++) {
    for (let r = 0; r < k; r++) row[r] = t[(j + r) * n + col];
    for (let r = 0; r < k; r++) {
      let acc = 0;
      for (let u = 0; u < k; u++) acc += zq[u * k + r] * row[u];
      t[(j + r) * n + col] = acc;
    }
  }
  // Columns j..j+k−1 (rows 0..j+k−1) of T, and all rows of Q: X ← X Z.
  const applyRight = (mat: Float64Array, rows: number) => {
    for (let r = 0; r < rows; r++) {
      const base = r * n + j;
      for (let s = 0; s < k; s++) row[s] = mat[base + s];
      for (let s = 0; s < k; s++) {
        let acc = 0;
        for (let u = 0; u < k; u++) acc += row[u] * zq[u * k + s];
        mat[base + s] = acc;
      }
    }
  };
  applyRight(t, j + k);
  applyRight(qm, n);
  for (let r = q; r < k; r++) for (let s = 0; s < q; s++) t[(j + r) * n + j + s] = 0;
  // Block sizes are kept as they were (a 2×2 block stays one block even if rounding made its
  // eigenvalues real): callers track blocks by position, not by re-reading the subdiagonal.
  return true;
}
