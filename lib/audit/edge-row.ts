import type { EdgeResult, ResponseClass, SignResponse } from '../spectral/types';

/**
 * How an edge's two signed responses become one row of the audit table.
 * Pure, so the server's storage and the tests agree on one definition.
 */

/** Severity: the lower the exponent, the harder a small error bites. */
const rank: Record<ResponseClass, number> = {
  'cube-root': 0,
  'square-root': 1,
  other: 2,
  linear: 3,
  quadratic: 4,
  flat: 5,
};

export function classRank(c: ResponseClass): number {
  return rank[c];
}

/** The worse of the two signs (the one with the lower rank). */
export function worseClass(plus: SignResponse | null, minus: SignResponse | null): ResponseClass {
  const classes = [plus?.class, minus?.class].filter((c): c is ResponseClass => !!c);
  if (classes.length === 0) return 'flat';
  return classes.reduce((a, b) => (rank[b] < rank[a] ? b : a));
}

/**
 * An edge needs a disposition when a small weight error moves Re λ2 faster
 * than linearly: a root-type law on either sign (square-root, cube-root, or
 * an unclassified slope clearly below 1), or a crossover toward one.
 */
export function isFlagged(plus: SignResponse | null, minus: SignResponse | null): boolean {
  return [plus, minus].some(
    (s) =>
      !!s &&
      (s.class === 'square-root' ||
        s.class === 'cube-root' ||
        (s.class === 'other' && s.exponent !== null && s.exponent < 0.85) ||
        s.flags.includes('crossover')),
  );
}

export interface EdgeRowFields {
  edge_index: number;
  source: string;
  target: string;
  weight: number;
  class: ResponseClass;
  class_rank: number;
  plus_class: ResponseClass | null;
  plus_exponent: number | null;
  minus_class: ResponseClass | null;
  minus_exponent: number | null;
  flags: string;
  tolerance: number;
  tolerance_rel: number | null;
  sensitivity: number | null;
  flagged: boolean;
  detail_json: string;
}

const finite = (x: number | null | undefined): number | null => (x === null || x === undefined || !Number.isFinite(x) ? null : x);

export function toEdgeRowFields(r: EdgeResult): EdgeRowFields {
  const cls = worseClass(r.plus, r.minus);
  const flags = [...new Set([...(r.plus?.flags ?? []).map((f) => `+${f}`), ...(r.minus?.flags ?? []).map((f) => `−${f}`)])];
  return {
    edge_index: r.index,
    source: r.source,
    target: r.target,
    weight: r.weight,
    class: cls,
    class_rank: rank[cls],
    plus_class: r.plus?.class ?? null,
    plus_exponent: finite(r.plus?.exponent),
    minus_class: r.minus?.class ?? null,
    minus_exponent: finite(r.minus?.exponent),
    flags: flags.join(' '),
    tolerance: r.tolerance,
    tolerance_rel: finite(r.budget.relative),
    sensitivity: finite(r.sensitivity?.re),
    flagged: isFlagged(r.plus, r.minus),
    detail_json: JSON.stringify({ plus: r.plus, minus: r.minus, budget: r.budget, sensitivity: r.sensitivity }),
  };
}
