/**
 * Power-law fits of the response Δ(ε) ≈ c·|ε|^p.
 *
 * In log–log coordinates the law is a line: log|Δ| = log|c| + p·log|ε|. Least squares over the run
 * of trustworthy points gives the overall exponent; the same fit over only the three smallest and
 * the three largest |ε| gives the local exponents at both ends. They differ when the response
 * crosses over between two laws — typically a near-degenerate pair with gap δ, linear for |ε| ≪ δ²
 * and square-root beyond — and the scale of that crossover is where the two end laws meet.
 */

export interface Line {
  slope: number;
  /** log10 of |c|. */
  intercept: number;
}

/** Least-squares line through (x, y); needs at least two distinct x. */
export function fitLine(xs: number[], ys: number[]): Line {
  const n = xs.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += xs[i];
    my += ys[i];
  }
  mx /= n;
  my /= n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i] - mx) * (xs[i] - mx);
    sxy += (xs[i] - mx) * (ys[i] - my);
  }
  const slope = sxx === 0 ? NaN : sxy / sxx;
  return { slope, intercept: my - slope * mx };
}

/** log10|c| for a fixed exponent p: the mean of log|Δ| − p·log|ε|. */
export function interceptForSlope(xs: number[], ys: number[], slope: number): number {
  let s = 0;
  for (let i = 0; i < xs.length; i++) s += ys[i] - slope * xs[i];
  return s / xs.length;
}

/** [start, end) of the longest run of consecutive true values (first one on ties). */
export function longestRun(ok: boolean[]): [number, number] {
  let best: [number, number] = [0, 0];
  let start = -1;
  for (let i = 0; i <= ok.length; i++) {
    if (i < ok.length && ok[i]) {
      if (start < 0) start = i;
    } else if (start >= 0) {
      if (i - start > best[1] - best[0]) best = [start, i];
      start = -1;
    }
  }
  return best;
}

/** |ε| where c1·|ε|^p1 and c2·|ε|^p2 meet (magnitudes; null if the exponents coincide). */
export function meetingPoint(a: Line, b: Line): number | null {
  const dp = a.slope - b.slope;
  if (!Number.isFinite(dp) || Math.abs(dp) < 1e-12) return null;
  return Math.pow(10, (b.intercept - a.intercept) / dp);
}
