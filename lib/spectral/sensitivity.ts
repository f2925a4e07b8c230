/**
 * First-order sensitivity of a simple λ2.
 *
 * If λ is a simple eigenvalue with right eigenvector x (L x = λ x) and left eigenvector y
 * (yᴴ L = λ yᴴ), differentiating L(w) x(w) = λ(w) x(w) and multiplying by yᴴ removes the unknown
 * dx: dλ/dw = yᴴ (∂L/∂w) x / (yᴴ x). Since L is real, y is the complex conjugate of a vector z with
 * Lᵀ z = λ z, so yᴴ = zᵀ and no conjugation is needed in the products below.
 *
 * For one edge, ∂L = e_r (e_r − e_c)ᵀ, so the numerator collapses to z_r (x_r − x_c).
 *
 * The eigenvalue condition number 1/|cos∠(x, y)| = ‖x‖‖y‖/|yᴴ x| bounds how much λ can move per unit
 * norm of perturbation; it blows up as λ approaches a defective eigenvalue (x and y become
 * orthogonal), which is exactly where this linear picture breaks down.
 */
import type { EigenvalueDecomposition } from 'ml-matrix';
import type { Complex, FirstOrderData, FirstOrderSensitivity } from './types';
import type { EntryTerm } from './spectrum';

interface ComplexVector {
  re: number[];
  im: number[];
}

/** Eigenvector of the decomposition's eigenvalue closest to `target` (real Schur pair convention). */
export function eigenvectorNear(decomposition: EigenvalueDecomposition, target: Complex): ComplexVector {
  const re = decomposition.realEigenvalues;
  const im = decomposition.imaginaryEigenvalues;
  let j = 0;
  let best = Infinity;
  for (let i = 0; i < re.length; i++) {
    const d = Math.hypot(re[i] - target.re, im[i] - target.im);
    if (d < best) {
      best = d;
      j = i;
    }
  }
  const V = decomposition.eigenvectorMatrix;
  const n = re.length;
  const out: ComplexVector = { re: new Array<number>(n), im: new Array<number>(n) };
  for (let r = 0; r < n; r++) {
    if (im[j] > 0) {
      out.re[r] = V.get(r, j);
      out.im[r] = V.get(r, j + 1);
    } else if (im[j] < 0) {
      out.re[r] = V.get(r, j - 1);
      out.im[r] = -V.get(r, j);
    } else {
      out.re[r] = V.get(r, j);
      out.im[r] = 0;
    }
  }
  return out;
}

function norm(v: ComplexVector): number {
  let s = 0;
  for (let i = 0; i < v.re.length; i++) s += v.re[i] * v.re[i] + v.im[i] * v.im[i];
  return Math.sqrt(s);
}

/** Plain bilinear product Σ a_i b_i (no conjugation). */
function bilinear(a: ComplexVector, b: ComplexVector): Complex {
  let re = 0;
  let im = 0;
  for (let i = 0; i < a.re.length; i++) {
    re += a.re[i] * b.re[i] - a.im[i] * b.im[i];
    im += a.re[i] * b.im[i] + a.im[i] * b.re[i];
  }
  return { re, im };
}

export function firstOrderData(direct: EigenvalueDecomposition, transposed: EigenvalueDecomposition, lambda2: Complex): FirstOrderData {
  const right = eigenvectorNear(direct, lambda2);
  const left = eigenvectorNear(transposed, lambda2);
  const pairing = bilinear(left, right);
  const p = Math.hypot(pairing.re, pairing.im);
  const condition = p === 0 ? Infinity : (norm(left) * norm(right)) / p;
  return { right, left, pairing, condition };
}

/** dλ2/dε for the weight change Σ scale·∂L_e described by `terms`. */
export function sensitivityOf(data: FirstOrderData, terms: EntryTerm[]): FirstOrderSensitivity {
  const { right: x, left: z, pairing } = data;
  let nRe = 0;
  let nIm = 0;
  for (const { row, col, scale } of terms) {
    const dRe = x.re[row] - x.re[col];
    const dIm = x.im[row] - x.im[col];
    nRe += scale * (z.re[row] * dRe - z.im[row] * dIm);
    nIm += scale * (z.re[row] * dIm + z.im[row] * dRe);
  }
  const den = pairing.re * pairing.re + pairing.im * pairing.im;
  // `+ 0` turns a negative zero into a plain one, so results survive a JSON round trip unchanged.
  return {
    re: (nRe * pairing.re + nIm * pairing.im) / den + 0,
    im: (nIm * pairing.re - nRe * pairing.im) / den + 0,
    condition: data.condition,
  };
}
