/**
 * Eigenvalues of a small complex matrix (the reduced m×m problems of the fast sweep).
 *
 * n = 1 and n = 2 are closed forms; larger matrices are reduced to Hessenberg form by complex
 * Householder reflections and then iterated with the single-shift complex QR algorithm (Wilkinson
 * shift, Givens rotations, deflation on negligible subdiagonal entries, an ad hoc exceptional shift
 * when a window stalls) — G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013, §7.4–7.5
 * (the complex Schur decomposition). Backward stable like any QR-based solver, so a defective
 * eigenvalue is split by rounding exactly as in the full-size solve.
 */
import { hyp } from './dense';

export interface ComplexList {
  re: Float64Array;
  im: Float64Array;
}

const EPS = 2 ** -52;

/** Principal square root of x + iy. */
export function csqrt(x: number, y: number): [number, number] {
  if (x === 0 && y === 0) return [0, 0];
  const r = hyp(x, y);
  if (x >= 0) {
    const s = Math.sqrt(0.5 * (r + x));
    return [s, y / (2 * s)];
  }
  const t = Math.sqrt(0.5 * (r - x));
  return [Math.abs(y) / (2 * t), y >= 0 ? t : -t];
}

/** Eigenvalues of [[a, b], [c, d]] (complex entries as [re, im]). */
function eig2c(ar: number, ai: number, br: number, bi: number, cr: number, ci: number, dr: number, di: number): [number, number, number, number] {
  const pr = 0.5 * (ar - dr);
  const pi = 0.5 * (ai - di);
  const discR = pr * pr - pi * pi + (br * cr - bi * ci);
  const discI = 2 * pr * pi + (br * ci + bi * cr);
  const [sr, si] = csqrt(discR, discI);
  const mr = 0.5 * (ar + dr);
  const mi = 0.5 * (ai + di);
  return [mr + sr, mi + si, mr - sr, mi - si];
}

/** Eigenvalues of the n×n complex matrix (re, im row-major; not modified). */
export function complexEigenvalues(reIn: ArrayLike<number>, imIn: ArrayLike<number>, n: number): ComplexList {
  const outRe = new Float64Array(n);
  const outIm = new Float64Array(n);
  if (n === 0) return { re: outRe, im: outIm };
  if (n === 1) {
    outRe[0] = reIn[0];
    outIm[0] = imIn[0];
    return { re: outRe, im: outIm };
  }
  if (n === 2) {
    const [a, b, c, d] = eig2c(reIn[0], imIn[0], reIn[1], imIn[1], reIn[2], imIn[2], reIn[3], imIn[3]);
    outRe[0] = a;
    outIm[0] = b;
    outRe[1] = c;
    outIm[1] = d;
    return { re: outRe, im: outIm };
  }
  const hr = Float64Array.from(reIn);
  const hi = Float64Array.from(imIn);
  hessenbergComplex(hr, hi, n);
  let top = n - 1;
  let iter = 0;
  let total = 0;
  while (top >= 0) {
    let l = top;
    while (l > 0) {
      const s =
        hyp(hr[(l - 1) * n + l - 1], hi[(l - 1) * n + l - 1]) + hyp(hr[l * n + l], hi[l * n + l]);
      if (hyp(hr[l * n + l - 1], hi[l * n + l - 1]) <= EPS * s) {
        hr[l * n + l - 1] = 0;
        hi[l * n + l - 1] = 0;
        break;
      }
      l--;
    }
    if (l === top) {
      outRe[top] = hr[top * n + top];
      outIm[top] = hi[top * n + top];
      top -= 1;
      iter = 0;
      continue;
    }
    if (l === top - 1) {
      const i = top - 1;
      const [a, b, c, d] = eig2c(
        hr[i * n + i], hi[i * n + i], hr[i * n + i + 1], hi[i * n + i + 1],
        hr[top * n + i], hi[top * n + i], hr[top * n + top], hi[top * n + top],
      );
      outRe[i] = a;
      outIm[i] = b;
      outRe[top] = c;
      outIm[top] = d;
      top -= 2;
      iter = 0;
      continue;
    }
    iter += 1;
    total += 1;
    if (total > 60 * n) throw new Error('complex QR did not converge');
    // Wilkinson shift: eigenvalue of the trailing 2×2 nearer the corner entry.
    const i = top - 1;
    let [s1r, s1i, s2r, s2i] = eig2c(
      hr[i * n + i], hi[i * n + i], hr[i * n + top], hi[i * n + top],
      hr[top * n + i], hi[top * n + i], hr[top * n + top], hi[top * n + top],
    );
    const cr = hr[top * n + top];
    const ci = hi[top * n + top];
    let mur = hyp(s1r - cr, s1i - ci) <= hyp(s2r - cr, s2i - ci) ? s1r : s2r;
    let mui = hyp(s1r - cr, s1i - ci) <= hyp(s2r - cr, s2i - ci) ? s1i : s2i;
    if (iter % 10 === 0) {
      const w = hyp(hr[top * n + top - 1], hi[top * n + top - 1]);
      mur = cr + 0.75 * w;
      mui = ci + 0.25 * w;
      s1r = s2r = s1i = s2i = 0;
    }
    qrStep(hr, hi, n, l, top, mur, mui);
  }
  return { re: outRe, im: outIm };
}

function hessenbergComplex(hr: Float64Array, hi: Float64Array, n: number): void {
  const vr = new Float64Array(n);
  const vi = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    let norm2 = 0;
    for (let i = k + 1; i < n; i++) norm2 += hr[i * n + k] ** 2 + hi[i * n + k] ** 2;
    if (norm2 === 0) continue;
    const norm = Math.sqrt(norm2);
    const x0r = hr[(k + 1) * n + k];
    const x0i = hi[(k + 1) * n + k];
    const a0 = hyp(x0r, x0i);
    const phr = a0 === 0 ? 1 : x0r / a0;
    const phi = a0 === 0 ? 0 : x0i / a0;
    // α = −e^{iθ}‖x‖; v = x − α e1.
    const alr = -phr * norm;
    const ali = -phi * norm;
    for (let i = k + 1; i < n; i++) {
      vr[i] = hr[i * n + k];
      vi[i] = hi[i * n + k];
    }
    vr[k + 1] -= alr;
    vi[k + 1] -= ali;
    let vtv = 0;
    for (let i = k + 1; i < n; i++) vtv += vr[i] * vr[i] + vi[i] * vi[i];
    const beta = 2 / vtv;
    // Left: A ← A − β v (vᴴ A), columns k..n−1.
    for (let j = k; j < n; j++) {
      let sr = 0;
      let si = 0;
      for (let i = k + 1; i < n; i++) {
        const ar = hr[i * n + j];
        const ai = hi[i * n + j];
        sr += vr[i] * ar + vi[i] * ai;
        si += vr[i] * ai - vi[i] * ar;
      }
      sr *= beta;
      si *= beta;
      for (let i = k + 1; i < n; i++) {
        hr[i * n + j] -= vr[i] * sr - vi[i] * si;
        hi[i * n + j] -= vr[i] * si + vi[i] * sr;
      }
    }
    // Right: A ← A − β (A v) vᴴ, all rows.
    for (let r = 0; r < n; r++) {
      let sr = 0;
      let si = 0;
      for (let j = k + 1; j < n; j++) {
        const ar = hr[r * n + j];
        const ai = hi[r * n + j];
        sr += ar * vr[j] - ai * vi[j];
        si += ar * vi[j] + ai * vr[j];
      }
      sr *= beta;
      si *= beta;
      for (let j = k + 1; j < n; j++) {
        // (A v)·conj(v_j)
        hr[r * n + j] -= sr * vr[j] + si * vi[j];
        hi[r * n + j] -= si * vr[j] - sr * vi[j];
      }
    }
    hr[(k + 1) * n + k] = alr;
    hi[(k + 1) * n + k] = ali;
    for (let i = k + 2; i < n; i++) {
      hr[i * n + k] = 0;
      hi[i * n + k] = 0;
    }
  }
}

/** One explicitly shifted QR step H − μI = QR, H ← RQ + μI on the window [lo, top]. */
function qrStep(hr: Float64Array, hi: Float64Array, n: number, lo: number, top: number, mur: number, mui: number): void {
  for (let k = lo; k <= top; k++) {
    hr[k * n + k] -= mur;
    hi[k * n + k] -= mui;
  }
  const cs = new Float64Array(top - lo);
  const snr = new Float64Array(top - lo);
  const sni = new Float64Array(top - lo);
  for (let k = lo; k < top; k++) {
    const ar = hr[k * n + k];
    const ai = hi[k * n + k];
    const br = hr[(k + 1) * n + k];
    const bi = hi[(k + 1) * n + k];
    const aa = hyp(ar, ai);
    const r = hyp(aa, Math.hypot(br, bi));
    let c: number;
    let sr: number;
    let si: number;
    if (r === 0) {
      c = 1;
      sr = 0;
      si = 0;
    } else if (aa === 0) {
      c = 0;
      sr = 1;
      si = 0;
      // s = 1 maps [0; b] to [b; 0]: fine for the triangularisation.
    } else {
      c = aa / r;
      // s = (a/|a|)·conj(b)/r
      const ur = ar / aa;
      const ui = ai / aa;
      sr = (ur * br + ui * bi) / r;
      si = (ui * br - ur * bi) / r;
    }
    cs[k - lo] = c;
    snr[k - lo] = sr;
    sni[k - lo] = si;
    // Rows k, k+1: [x; y] → [c x + s y; −conj(s) x + c y]
    for (let j = k; j <= top; j++) {
      const xr = hr[k * n + j];
      const xi = hi[k * n + j];
      const yr = hr[(k + 1) * n + j];
      const yi = hi[(k + 1) * n + j];
      hr[k * n + j] = c * xr + (sr * yr - si * yi);
      hi[k * n + j] = c * xi + (sr * yi + si * yr);
      hr[(k + 1) * n + j] = -(sr * xr + si * xi) + c * yr;
      hi[(k + 1) * n + j] = -(sr * xi - si * xr) + c * yi;
    }
  }
  for (let k = lo; k < top; k++) {
    const c = cs[k - lo];
    const sr = snr[k - lo];
    const si = sni[k - lo];
    // Columns k, k+1 times Gᴴ: [u, w] → [u c + w conj(s), −u s + w c]
    const rmax = Math.min(k + 2, top);
    for (let r = lo; r <= rmax; r++) {
      const ur = hr[r * n + k];
      const ui = hi[r * n + k];
      const wr = hr[r * n + k + 1];
      const wi = hi[r * n + k + 1];
      hr[r * n + k] = ur * c + (wr * sr + wi * si);
      hi[r * n + k] = ui * c + (wi * sr - wr * si);
      hr[r * n + k + 1] = -(ur * sr - ui * si) + wr * c;
      hi[r * n + k + 1] = -(ur * si + ui * sr) + wi * c;
    }
  }
  for (let k = lo; k <= top; k++) {
    hr[k * n + k] += mur;
    hi[k * n + k] += mui;
  }
}
