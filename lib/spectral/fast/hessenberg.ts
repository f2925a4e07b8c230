/**
 * Reduction of a real square matrix to upper Hessenberg form by Householder reflections,
 * H = Qᵀ A Q with Q orthogonal and accumulated explicitly.
 *
 * Method: G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013, §7.4.3 (Householder
 * reduction to Hessenberg form). Row-major Float64Array storage; every update runs along rows so the
 * inner loops are contiguous.
 */
import { identity } from './dense';

/** Overwrites `a` (n×n, row-major) with its Hessenberg form and returns Q (identity if `vectors` is false). */
export function reduceToHessenberg(a: Float64Array, n: number, vectors = true): Float64Array {
  const q = identity(n);
  const v = new Float64Array(n);
  const w = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    let scale = 0;
    for (let i = k + 1; i < n; i++) scale += Math.abs(a[i * n + k]);
    if (scale === 0) continue;
    let sigma = 0;
    for (let i = k + 1; i < n; i++) {
      v[i] = a[i * n + k] / scale;
      sigma += v[i] * v[i];
    }
    const norm = Math.sqrt(sigma);
    const x0 = v[k + 1];
    const alpha = x0 >= 0 ? -norm : norm;
    v[k + 1] = x0 - alpha;
    const vtv = sigma - x0 * x0 + v[k + 1] * v[k + 1];
    if (vtv === 0) continue;
    const beta = 2 / vtv;
    // Left: A[k+1:, k:] -= beta·v·(vᵀA).
    w.fill(0, k, n);
    for (let i = k + 1; i < n; i++) {
      const vi = v[i];
      const row = i * n;
      for (let j = k; j < n; j++) w[j] += vi * a[row + j];
    }
    for (let i = k + 1; i < n; i++) {
      const f = beta * v[i];
      const row = i * n;
      for (let j = k; j < n; j++) a[row + j] -= f * w[j];
    }
    // Right: A[:, k+1:] -= beta·(A v)·vᵀ, and the same on Q.
    for (const m of vectors ? [a, q] : [a]) {
      for (let i = 0; i < n; i++) {
        const row = i * n;
        let s = 0;
        for (let j = k + 1; j < n; j++) s += m[row + j] * v[j];
        s *= beta;
        if (s === 0) continue;
        for (let j = k + 1; j < n; j++) m[row + j] -= s * v[j];
      }
    }
    a[(k + 1) * n + k] = alpha * scale;
    for (let i = k + 2; i < n; i++) a[i * n + k] = 0;
  }
  return q;
}
