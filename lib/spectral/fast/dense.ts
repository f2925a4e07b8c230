/**
 * Small dense helpers on row-major Float64Array matrices (the fast path's working format).
 * Pure functions, no I/O.
 */

export const U = 2 ** -53;

/** √(a² + b²) without Math.hypot's variadic overhead (inputs here are far from overflow). */
export function hyp(a: number, b: number): number {
  return Math.sqrt(a * a + b * b);
}

export function identity(n: number): Float64Array {
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) m[i * n + i] = 1;
  return m;
}

/** C = A·B for square n×n row-major matrices. */
export function multiply(a: Float64Array, b: Float64Array, n: number): Float64Array {
  const c = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const ci = i * n;
    for (let k = 0; k < n; k++) {
      const aik = a[ci + k];
      if (aik === 0) continue;
      const bk = k * n;
      for (let j = 0; j < n; j++) c[ci + j] += aik * b[bk + j];
    }
  }
  return c;
}

export function transpose(a: Float64Array, n: number): Float64Array {
  const t = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t[j * n + i] = a[i * n + j];
  return t;
}

/**
 * Solve the small dense system K x = rhs (dimension d, row-major K) by Gaussian elimination with
 * complete pivoting. K and rhs are overwritten. Returns null when a pivot falls below
 * `tiny` (numerically singular).
 */
export function solveSmall(k: Float64Array, rhs: Float64Array, d: number, tiny = 0): Float64Array | null {
  const colPerm = Array.from({ length: d }, (_, i) => i);
  for (let c = 0; c < d; c++) {
    let pr = c;
    let pc = c;
    let best = -1;
    for (let i = c; i < d; i++) {
      for (let j = c; j < d; j++) {
        const v = Math.abs(k[i * d + j]);
        if (v > best) {
          best = v;
          pr = i;
          pc = j;
        }
      }
    }
    if (!(best > tiny)) return null;
    if (pr !== c) {
      for (let j = 0; j < d; j++) {
        const t = k[c * d + j];
        k[c * d + j] = k[pr * d + j];
        k[pr * d + j] = t;
      }
      const t = rhs[c];
      rhs[c] = rhs[pr];
      rhs[pr] = t;
    }
    if (pc !== c) {
      for (let i = 0; i < d; i++) {
        const t = k[i * d + c];
        k[i * d + c] = k[i * d + pc];
        k[i * d + pc] = t;
      }
      const t = colPerm[c];
      colPerm[c] = colPerm[pc];
      colPerm[pc] = t;
    }
    const piv = k[c * d + c];
    for (let i = c + 1; i < d; i++) {
      const f = k[i * d + c] / piv;
      if (f === 0) continue;
      for (let j = c; j < d; j++) k[i * d + j] -= f * k[c * d + j];
      rhs[i] -= f * rhs[c];
    }
  }
  const y = new Float64Array(d);
  for (let i = d - 1; i >= 0; i--) {
    let s = rhs[i];
    for (let j = i + 1; j < d; j++) s -= k[i * d + j] * y[j];
    y[i] = s / k[i * d + i];
  }
  const x = new Float64Array(d);
  for (let i = 0; i < d; i++) x[colPerm[i]] = y[i];
  return x;
}
