/**
 * Fast path against exact path, edge by edge (shared by fast.test.ts and the child-process
 * comparison on larger networks; not a test file itself).
 *
 * What must agree (issue 7): the class on each sign, the flags, which points follow λ2's branches,
 * and λ2(ε) — within 1e-9 for a simple (or resolved) λ2, within 1e-7 for a rounding-split
 * (defective) cluster. For a defective cluster the exact path's own values carry its rounding
 * split (its noise floor, up to ~1e-5 near ε = 0 for a Jordan block of size 3), so there the
 * 1e-7 is checked where both paths' floors are below 1e-8 ("clean" points) and the difference
 * elsewhere must stay within the two floors. Budgets: within 1e-6 relative (2 % when bisected),
 * same limit, same confirmation.
 */
import type { EdgeResult, LadderPoint } from '@/lib/spectral';

export const SIMPLE_TOLERANCE = 1e-9;
export const DEFECTIVE_TOLERANCE = 1e-7;
/** Points whose floors (both paths) are below this count as clean for the defective check. */
export const CLEAN_FLOOR = 1e-8;

export interface EdgeComparison {
  issues: string[];
  /** Largest |Δ_fast − Δ_exact| over all points, over points used by both, over clean points. */
  maxDiff: number;
  maxUsedDiff: number;
  maxCleanDiff: number;
  budgetRelDiff: number;
}

/**
 * @param defective λ2 is a rounding-split cluster (the 1e-7 rule applies)
 * @param sameFloors both paths use the same condition-number floor (simple, well-conditioned λ2), so
 *   even the choice of fitted points must match; otherwise each path estimates its own floor
 */
export function compareEdges(fast: EdgeResult, exact: EdgeResult, defective: boolean, sameFloors = !defective): EdgeComparison {
  const issues: string[] = [];
  let maxDiff = 0;
  let maxUsedDiff = 0;
  let maxCleanDiff = 0;
  for (const side of ['plus', 'minus'] as const) {
    const f = fast[side];
    const x = exact[side];
    if (!f || !x) {
      if (f !== x) issues.push(`${side}: present on one path only`);
      continue;
    }
    if (f.class !== x.class) issues.push(`${side}: class ${f.class} (fast) vs ${x.class} (exact)`);
    const ff = [...f.flags].sort().join(',');
    const xf = [...x.flags].sort().join(',');
    if (ff !== xf) issues.push(`${side}: flags [${ff}] vs [${xf}]`);
    if (f.points.length !== x.points.length) {
      issues.push(`${side}: ${f.points.length} vs ${x.points.length} points`);
      continue;
    }
    f.points.forEach((p: LadderPoint, i) => {
      const q = x.points[i];
      if (p.eps !== q.eps) issues.push(`${side}@${i}: ε differs`);
      if (p.tracked !== q.tracked) issues.push(`${side}@${i}: tracked ${p.tracked} vs ${q.tracked}`);
      const d = Math.abs(p.delta - q.delta);
      maxDiff = Math.max(maxDiff, d);
      if (p.used && q.used) maxUsedDiff = Math.max(maxUsedDiff, d);
      if (!defective) {
        if (!(d <= SIMPLE_TOLERANCE)) issues.push(`${side}@${i}: |Δ diff| ${d.toExponential(2)} > ${SIMPLE_TOLERANCE}`);
        if (sameFloors && p.used !== q.used) issues.push(`${side}@${i}: used ${p.used} vs ${q.used}`);
      } else if (p.used && q.used) {
        if (p.floor <= CLEAN_FLOOR && q.floor <= CLEAN_FLOOR) {
          maxCleanDiff = Math.max(maxCleanDiff, d);
          if (!(d <= DEFECTIVE_TOLERANCE)) issues.push(`${side}@${i}: |Δ diff| ${d.toExponential(2)} > ${DEFECTIVE_TOLERANCE} at a clean point`);
        } else if (!(d <= Math.max(DEFECTIVE_TOLERANCE, p.floor + q.floor))) {
          issues.push(`${side}@${i}: |Δ diff| ${d.toExponential(2)} beyond both floors (${p.floor.toExponential(1)} + ${q.floor.toExponential(1)})`);
        }
      }
    });
  }
  const bf = fast.budget;
  const bx = exact.budget;
  const budgetRelDiff = bx.eps === 0 ? Math.abs(bf.eps) : Math.abs(bf.eps - bx.eps) / bx.eps;
  // A budget confirmed at once is the prediction itself (1e-6); a bisected one is resolved only to
  // the bisection's ratio (1.01), and its start comes from the prediction, which interpolates
  // log|Δ| and so can lean on noise-level points.
  const budgetTolerance = bf.confirmed && bx.confirmed ? 1e-6 : 0.02;
  if (!(budgetRelDiff <= budgetTolerance)) issues.push(`budget ${bf.eps} vs ${bx.eps}`);
  if (bf.limitedBy !== bx.limitedBy) issues.push(`budget limited by ${bf.limitedBy} vs ${bx.limitedBy}`);
  if (bf.confirmed !== bx.confirmed) issues.push(`budget confirmed ${bf.confirmed} vs ${bx.confirmed}`);
  return { issues, maxDiff, maxUsedDiff, maxCleanDiff, budgetRelDiff };
}
