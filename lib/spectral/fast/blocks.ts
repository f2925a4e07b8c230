/**
 * Block-diagonal Schur decomposition L = V·diag(B₁, …, B_K)·V⁻¹.
 *
 * Starting from an ordered real Schur form L = Q T Qᵀ whose diagonal blocks are grouped into
 * contiguous "items" (item 0 is the λ2 cluster; other items are single eigenvalues, conjugate
 * pairs, or groups of close eigenvalues), a unit upper block-triangular Ξ with TΞ = ΞD,
 * D = diag(T₁₁, …, T_KK), is found column block by column block from the Sylvester equations
 *   T_ii Ξ_ij − Ξ_ij T_jj = −Σ_{i<l≤j} T_il Ξ_lj   (i = j−1, …, 0),
 * which are solvable because different items share no eigenvalue. This is the Bartels–Stewart
 * order applied block by block (R. H. Bartels & G. W. Stewart, "Solution of the matrix equation
 * AX + XB = C", Comm. ACM 15, 1972; block-diagonalisation as in C. A. Bavely & G. W. Stewart,
 * SIAM J. Numer. Anal. 16, 1979; G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013,
 * §7.6.3 — cited from memory). Then V = QΞ and V⁻¹ = Ξ⁻¹Qᵀ.
 *
 * For item 0 this yields exactly the spectral projector of the issue: with T₁₁ the cluster block
 * and R the solution of T₁₁R − R T₂₂ = −T₁₂, P = Q₁(Q₁ᵀ − R Q₂ᵀ), its range basis X = Q₁ and
 * Yᵀ = Q₁ᵀ − R Q₂ᵀ (YᵀX = I), and A = YᵀLX = T₁₁.
 */
import { solveSylvester } from './sylvester';

export interface ItemRange {
  start: number;
  size: number;
}

export interface BlockDiagonal {
  /** Right basis V = QΞ, row-major n×n. */
  v: Float64Array;
  /** Transposed left basis (V⁻¹)ᵀ = Q·(Ξ⁻¹)ᵀ, row-major n×n: wt[r·n + k] = (V⁻¹)[k][r]. */
  wt: Float64Array;
  /** Largest entry of Ξ (a cheap measure of how well the items are separated). */
  xiMax: number;
}

/** Returns null when a Sylvester equation is numerically singular (items not separated). */
export function blockDiagonalise(t: Float64Array, q: Float64Array, n: number, items: ItemRange[]): BlockDiagonal | null {
  // Ξ row-major and its transpose (for contiguous inner products).
  const xi = new Float64Array(n * n);
  const xiT = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    xi[i * n + i] = 1;
    xiT[i * n + i] = 1;
  }
  let xiMax = 1;
  const itemOf = new Int32Array(n);
  items.forEach((it, k) => {
    for (let i = 0; i < it.size; i++) itemOf[it.start + i] = k;
  });
  for (let jj = 1; jj < items.length; jj++) {
    const J = items[jj];
    const endJ = J.start + J.size;
    const tjj = new Float64Array(J.size * J.size);
    for (let r = 0; r < J.size; r++) for (let s = 0; s < J.size; s++) tjj[r * J.size + s] = t[(J.start + r) * n + J.start + s];
    for (let ii = jj - 1; ii >= 0; ii--) {
      const I = items[ii];
      const endI = I.start + I.size;
      // rhs = −T[I, endI:endJ] · Ξ[endI:endJ, J]
      const rhs = new Float64Array(I.size * J.size);
      for (let r = 0; r < I.size; r++) {
        const trow = (I.start + r) * n;
        for (let c = 0; c < J.size; c++) {
          const xrow = (J.start + c) * n;
          let acc = 0;
          for (let k = endI; k < endJ; k++) acc += t[trow + k] * xiT[xrow + k];
          rhs[r * J.size + c] = -acc;
        }
      }
      const tii = new Float64Array(I.size * I.size);
      for (let r = 0; r < I.size; r++) for (let s = 0; s < I.size; s++) tii[r * I.size + s] = t[(I.start + r) * n + I.start + s];
      const y = solveSylvester(tii, I.size, tjj, J.size, rhs);
      if (!y) return null;
      for (let r = 0; r < I.size; r++) {
        for (let c = 0; c < J.size; c++) {
          const val = y[r * J.size + c];
          if (!Number.isFinite(val)) return null;
          xi[(I.start + r) * n + J.start + c] = val;
          xiT[(J.start + c) * n + I.start + r] = val;
          if (Math.abs(val) > xiMax) xiMax = Math.abs(val);
        }
      }
    }
  }
  // G = Ξ⁻¹ (unit upper block-triangular): G[I,J] = −Ξ[I, endI:endJ]·G[endI:endJ, J], bottom-up.
  // Stored transposed (gT[c·n + k] = G[k][c]) for contiguous inner products.
  const gT = new Float64Array(n * n);
  for (let i = 0; i < n; i++) gT[i * n + i] = 1;
  for (let jj = 1; jj < items.length; jj++) {
    const J = items[jj];
    const endJ = J.start + J.size;
    for (let ii = jj - 1; ii >= 0; ii--) {
      const I = items[ii];
      const endI = I.start + I.size;
      for (let r = 0; r < I.size; r++) {
        const xrow = (I.start + r) * n;
        for (let c = 0; c < J.size; c++) {
          const grow = (J.start + c) * n;
          let acc = 0;
          for (let k = endI; k < endJ; k++) acc += xi[xrow + k] * gT[grow + k];
          gT[grow + I.start + r] = -acc;
        }
      }
    }
  }
  // V = Q·Ξ: V[r][c] = Σ_{k ≤ end(item c)} Q[r][k]·Ξ[k][c].
  const v = new Float64Array(n * n);
  const wt = new Float64Array(n * n);
  const endOf = new Int32Array(n);
  const startOf = new Int32Array(n);
  for (let c = 0; c < n; c++) {
    const it = items[itemOf[c]];
    endOf[c] = it.start + it.size;
    startOf[c] = it.start;
  }
  // G row-major for W: Wt[r][c] = Σ_{k ≥ start(item c)} Q[r][k]·G[c][k].
  const g = new Float64Array(n * n);
  for (let c = 0; c < n; c++) for (let k = 0; k < n; k++) g[c * n + k] = gT[k * n + c];
  for (let r = 0; r < n; r++) {
    const qrow = r * n;
    for (let c = 0; c < n; c++) {
      const xrow = c * n;
      let acc = 0;
      const end = endOf[c];
      for (let k = 0; k < end; k++) acc += q[qrow + k] * xiT[xrow + k];
      v[qrow + c] = acc;
      let acc2 = 0;
      for (let k = startOf[c]; k < n; k++) acc2 += q[qrow + k] * g[xrow + k];
      wt[qrow + c] = acc2;
    }
  }
  return { v, wt, xiMax };
}
