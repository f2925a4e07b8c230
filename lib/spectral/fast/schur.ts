/**
 * Real Schur form L = Q T Qᵀ: T upper quasi-triangular (1×1 blocks for real eigenvalues, 2×2 blocks
 * for complex conjugate pairs), Q orthogonal.
 *
 * Method: Hessenberg reduction (hessenberg.ts) followed by the implicitly double-shifted Francis QR
 * iteration with deflation on small subdiagonal entries, transformations accumulated into Q —
 * G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013, Algorithms 7.5.1 (Francis QR
 * step) and 7.5.2 (real Schur form), with the usual ad hoc exceptional shift when an active window
 * stalls. 2×2 blocks whose eigenvalues are real are split by one rotation into two 1×1 blocks (the
 * rotation's first column is an eigenvector of the block — derived by hand in `splitRealPair`).
 */
import { reduceToHessenberg } from './hessenberg';

const EPS = 2 ** -52;

export interface RealSchur {
  n: number;
  /** Quasi-triangular factor, row-major. */
  t: Float64Array;
  /** Orthogonal factor, row-major. */
  q: Float64Array;
}

/** Diagonal block layout of a quasi-triangular matrix: start index and size (1 or 2) of each block. */
export function blockLayout(t: Float64Array, n: number): { start: number; size: number }[] {
  const out: { start: number; size: number }[] = [];
  let i = 0;
  while (i < n) {
    if (i + 1 < n && t[(i + 1) * n + i] !== 0) {
      out.push({ start: i, size: 2 });
      i += 2;
    } else {
      out.push({ start: i, size: 1 });
      i += 1;
    }
  }
  return out;
}

/** Eigenvalues read off the diagonal blocks of a quasi-triangular matrix. */
export function schurEigenvalues(t: Float64Array, n: number): { re: number[]; im: number[] } {
  const re: number[] = [];
  const im: number[] = [];
  for (const { start: s, size } of blockLayout(t, n)) {
    if (size === 1) {
      re.push(t[s * n + s]);
      im.push(0);
    } else {
      const e = eig2(t[s * n + s], t[s * n + s + 1], t[(s + 1) * n + s], t[(s + 1) * n + s + 1]);
      re.push(e.re1, e.re2);
      im.push(e.im, -e.im);
    }
  }
  return { re, im };
}

/** Eigenvalues of a 2×2 block [[a, b], [c, d]] (complex pair: re ± i·im with im ≥ 0). */
export function eig2(a: number, b: number, c: number, d: number): { re1: number; re2: number; im: number } {
  const p = 0.5 * (a - d);
  const disc = p * p + b * c;
  const mid = 0.5 * (a + d);
  if (disc >= 0) {
    const s = Math.sqrt(disc);
    return { re1: mid + s, re2: mid - s, im: 0 };
  }
  return { re1: mid, re2: mid, im: Math.sqrt(-disc) };
}

/** Apply the rotation [[cs, sn], [−sn, cs]] to rows i, i+1 (columns from c0) and its transpose to columns i, i+1 (rows up to r1), and to Q. */
function rotate(t: Float64Array, q: Float64Array, n: number, i: number, cs: number, sn: number, c0: number, r1: number): void {
  const ra = i * n;
  const rb = (i + 1) * n;
  for (let j = c0; j < n; j++) {
    const x = t[ra + j];
    const y = t[rb + j];
    t[ra + j] = cs * x + sn * y;
    t[rb + j] = cs * y - sn * x;
  }
  for (let r = 0; r <= r1; r++) {
    const x = t[r * n + i];
    const y = t[r * n + i + 1];
    t[r * n + i] = cs * x + sn * y;
    t[r * n + i + 1] = cs * y - sn * x;
  }
  for (let r = 0; r < n; r++) {
    const x = q[r * n + i];
    const y = q[r * n + i + 1];
    q[r * n + i] = cs * x + sn * y;
    q[r * n + i + 1] = cs * y - sn * x;
  }
}

/**
 * If the 2×2 block at (i, i) has real eigenvalues, rotate it to upper triangular form.
 * With p = (a − d)/2 and z = p ± √(p² + bc) (sign of p, avoiding cancellation), (z, c) is an
 * eigenvector for the eigenvalue d + z: c·z + d·c = (d + z)·c, and a·z + b·c = (d + z)·z because
 * z² − 2pz − bc = 0 (by hand). A rotation with that first column zeroes the subdiagonal.
 */
export function splitRealPair(t: Float64Array, q: Float64Array, n: number, i: number): boolean {
  const a = t[i * n + i];
  const b = t[i * n + i + 1];
  const c = t[(i + 1) * n + i];
  const d = t[(i + 1) * n + i + 1];
  if (c === 0) return true;
  const p = 0.5 * (a - d);
  const disc = p * p + b * c;
  if (disc < 0) return false;
  const z = p + (p >= 0 ? 1 : -1) * Math.sqrt(disc);
  const r = Math.hypot(z, c);
  if (r === 0) return true;
  rotate(t, q, n, i, z / r, c / r, i, i + 1);
  t[(i + 1) * n + i] = 0;
  return true;
}

function house3(x: number, y: number, z: number): [number, number, number, number] {
  const norm = Math.hypot(x, y, z);
  if (norm === 0) return [0, 0, 0, 0];
  const alpha = x >= 0 ? -norm : norm;
  const v0 = x - alpha;
  const vtv = v0 * v0 + y * y + z * z;
  return [v0, y, z, 2 / vtv];
}

/**
 * Real Schur form of a dense real matrix (row-major, not modified). Throws if QR does not converge.
 * With `vectors` false the orthogonal factor is not accumulated (eigenvalues only; q is then the
 * Hessenberg reduction's factor alone and must not be used).
 */
export function realSchur(matrix: ArrayLike<number>, n: number, vectors = true): RealSchur {
  const h = Float64Array.from(matrix);
  const q = reduceToHessenberg(h, n, vectors);
  let norm = 0;
  for (let i = 0; i < n; i++) for (let j = Math.max(0, i - 1); j < n; j++) norm += Math.abs(h[i * n + j]);
  let hi = n - 1;
  let iter = 0;
  let total = 0;
  while (hi >= 0) {
    let l = hi;
    while (l > 0) {
      let s = Math.abs(h[(l - 1) * n + l - 1]) + Math.abs(h[l * n + l]);
      if (s === 0) s = norm;
      if (Math.abs(h[l * n + l - 1]) < EPS * s) {
        h[l * n + l - 1] = 0;
        break;
      }
      l--;
    }
    if (l === hi) {
      hi -= 1;
      iter = 0;
      continue;
    }
    if (l === hi - 1) {
      splitRealPair(h, q, n, hi - 1);
      hi -= 2;
      iter = 0;
      continue;
    }
    iter += 1;
    total += 1;
    if (total > 100 * n) throw new Error('real Schur form: QR iteration did not converge');
    let s: number;
    let t: number;
    if (iter % 10 === 0) {
      // Exceptional shift (ad hoc, breaks cycles).
      const w = Math.abs(h[hi * n + hi - 1]) + Math.abs(h[(hi - 1) * n + hi - 2]);
      s = 1.5 * w + h[hi * n + hi];
      t = w * w + h[hi * n + hi] * (s - h[hi * n + hi]);
    } else {
      const a11 = h[(hi - 1) * n + hi - 1];
      const a12 = h[(hi - 1) * n + hi];
      const a21 = h[hi * n + hi - 1];
      const a22 = h[hi * n + hi];
      s = a11 + a22;
      t = a11 * a22 - a12 * a21;
    }
    const h00 = h[l * n + l];
    const h01 = h[l * n + l + 1];
    const h10 = h[(l + 1) * n + l];
    const h11 = h[(l + 1) * n + l + 1];
    const h21 = h[(l + 2) * n + l + 1];
    let x = h00 * h00 + h01 * h10 - s * h00 + t;
    let y = h10 * (h00 + h11 - s);
    let z = h10 * h21;
    for (let k = l; k <= hi - 2; k++) {
      const [v0, v1, v2, beta] = house3(x, y, z);
      if (beta !== 0) {
        const c0 = Math.max(l, k - 1);
        const r0 = k * n;
        const r1 = (k + 1) * n;
        const r2 = (k + 2) * n;
        for (let j = c0; j < n; j++) {
          const f = beta * (v0 * h[r0 + j] + v1 * h[r1 + j] + v2 * h[r2 + j]);
          h[r0 + j] -= f * v0;
          h[r1 + j] -= f * v1;
          h[r2 + j] -= f * v2;
        }
        if (k > l) {
          h[r1 + k - 1] = 0;
          h[r2 + k - 1] = 0;
        }
        const rmax = Math.min(k + 3, hi);
        for (let i = 0; i <= rmax; i++) {
          const ri = i * n;
          const f = beta * (h[ri + k] * v0 + h[ri + k + 1] * v1 + h[ri + k + 2] * v2);
          h[ri + k] -= f * v0;
          h[ri + k + 1] -= f * v1;
          h[ri + k + 2] -= f * v2;
        }
        for (let i = 0; vectors && i < n; i++) {
          const ri = i * n;
          const f = beta * (q[ri + k] * v0 + q[ri + k + 1] * v1 + q[ri + k + 2] * v2);
          q[ri + k] -= f * v0;
          q[ri + k + 1] -= f * v1;
          q[ri + k + 2] -= f * v2;
        }
      }
      x = h[(k + 1) * n + k];
      y = h[(k + 2) * n + k];
      if (k < hi - 2) z = h[(k + 3) * n + k];
    }
    // Closing 2-vector reflection on rows/columns hi−1, hi.
    const norm2 = Math.hypot(x, y);
    if (norm2 !== 0) {
      const alpha = x >= 0 ? -norm2 : norm2;
      const v0 = x - alpha;
      const v1 = y;
      const beta = 2 / (v0 * v0 + v1 * v1);
      const k = hi - 1;
      const r0 = k * n;
      const r1 = hi * n;
      for (let j = Math.max(l, k - 1); j < n; j++) {
        const f = beta * (v0 * h[r0 + j] + v1 * h[r1 + j]);
        h[r0 + j] -= f * v0;
        h[r1 + j] -= f * v1;
      }
      if (k - 1 >= l) h[r1 + k - 1] = 0;
      for (let i = 0; i <= hi; i++) {
        const ri = i * n;
        const f = beta * (h[ri + k] * v0 + h[ri + k + 1] * v1);
        h[ri + k] -= f * v0;
        h[ri + k + 1] -= f * v1;
      }
      for (let i = 0; vectors && i < n; i++) {
        const ri = i * n;
        const f = beta * (q[ri + k] * v0 + q[ri + k + 1] * v1);
        q[ri + k] -= f * v0;
        q[ri + k + 1] -= f * v1;
      }
    }
  }
  // Clean everything below the quasi-triangular structure.
  void vectors;
  for (let i = 1; i < n; i++) for (let j = 0; j < i - 1; j++) h[i * n + j] = 0;
  return { n, t: h, q };
}
