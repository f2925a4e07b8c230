/** Small complex linear systems M x = rhs by Gaussian elimination with partial pivoting (inputs kept). */
import { hyp } from './dense';
export function solveComplexSmall(
  mrIn: ArrayLike<number>,
  miIn: ArrayLike<number>,
  brIn: ArrayLike<number>,
  biIn: ArrayLike<number>,
  n: number,
): { re: Float64Array; im: Float64Array } | null {
  const mr = Float64Array.from(mrIn);
  const mi = Float64Array.from(miIn);
  const xr = Float64Array.from(brIn);
  const xi = Float64Array.from(biIn);
  for (let c = 0; c < n; c++) {
    let p = c;
    let best = hyp(mr[c * n + c], mi[c * n + c]);
    for (let r = c + 1; r < n; r++) {
      const v = hyp(mr[r * n + c], mi[r * n + c]);
      if (v > best) {
        best = v;
        p = r;
      }
    }
    if (!(best > 0)) return null;
    if (p !== c) {
      for (let j = 0; j < n; j++) {
        let t = mr[c * n + j];
        mr[c * n + j] = mr[p * n + j];
        mr[p * n + j] = t;
        t = mi[c * n + j];
        mi[c * n + j] = mi[p * n + j];
        mi[p * n + j] = t;
      }
      let t = xr[c];
      xr[c] = xr[p];
      xr[p] = t;
      t = xi[c];
      xi[c] = xi[p];
      xi[p] = t;
    }
    const pr = mr[c * n + c];
    const pi = mi[c * n + c];
    const pd = pr * pr + pi * pi;
    for (let r = c + 1; r < n; r++) {
      const ar = mr[r * n + c];
      const ai = mi[r * n + c];
      if (ar === 0 && ai === 0) continue;
      const fr = (ar * pr + ai * pi) / pd;
      const fi = (ai * pr - ar * pi) / pd;
      for (let j = c; j < n; j++) {
        const ur = mr[c * n + j];
        const ui = mi[c * n + j];
        mr[r * n + j] -= fr * ur - fi * ui;
        mi[r * n + j] -= fr * ui + fi * ur;
      }
      xr[r] -= fr * xr[c] - fi * xi[c];
      xi[r] -= fr * xi[c] + fi * xr[c];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let sr = xr[r];
    let si = xi[r];
    for (let j = r + 1; j < n; j++) {
      sr -= mr[r * n + j] * xr[j] - mi[r * n + j] * xi[j];
      si -= mr[r * n + j] * xi[j] + mi[r * n + j] * xr[j];
    }
    const pr = mr[r * n + r];
    const pi = mi[r * n + r];
    const pd = pr * pr + pi * pi;
    xr[r] = (sr * pr + si * pi) / pd;
    xi[r] = (si * pr - sr * pi) / pd;
  }
  return { re: xr, im: xi };
}
