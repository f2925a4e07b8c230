import type { AuditDetail, AuditSummary, EdgeDetail, EdgeRow } from '../../lib/schemas/audit';
import type { AuditRow } from './repo';

/** Database rows → the shapes of lib/schemas/audit.ts. */

export function toSummary(a: AuditRow, counts: { classes: Record<string, number>; flagged: number; undisposed: number }, now: number): AuditSummary {
  const settings = JSON.parse(a.settings_json);
  const baseline = a.baseline_json ? JSON.parse(a.baseline_json) : null;
  return {
    id: a.id,
    networkId: a.network_id,
    networkName: a.network_name,
    version: a.version,
    convention: a.convention,
    state: a.state as AuditSummary['state'],
    settings: { ladder: settings.ladder, signs: settings.signs, tolerance: settings.tolerance },
    startedBy: { id: a.started_by, name: a.started_by_name },
    createdAt: String(a.created_at),
    finishedAt: a.finished_at,
    progress: { done: a.progress_done, total: a.progress_total, etaSeconds: eta(a, now) },
    reason: a.reason,
    lambda2: a.lambda2_re === null ? null : { re: a.lambda2_re, im: a.lambda2_im ?? 0 },
    cluster: baseline?.cluster ?? null,
    classCounts: counts.classes,
    flaggedCount: counts.flagged,
    undisposedCount: counts.undisposed,
  };
}

/** Time left at the pace of the current run segment (a resume starts a new segment). */
function eta(a: AuditRow, now: number): number | null {
  if (a.state !== 'sweeping' || a.segment_started_ms === null) return null;
  const doneNow = a.progress_done - a.segment_done_at_start;
  if (doneNow <= 0) return null;
  const perEdge = (now - Number(a.segment_started_ms)) / 1000 / doneNow;
  return Math.max(0, Math.round(perEdge * (a.progress_total - a.progress_done)));
}

export function toDetailExtras(a: AuditRow): Pick<AuditDetail, 'rooted' | 'cutOff' | 'spectrum'> {
  const b = a.baseline_json ? JSON.parse(a.baseline_json) : null;
  return { rooted: b?.rooted ?? null, cutOff: b?.cutOff ?? [], spectrum: b?.spectrum ?? [] };
}

type EdgeDbRow = Record<string, any>;

export function toEdgeRow(r: EdgeDbRow): EdgeRow {
  return {
    edgeIndex: r.edge_index,
    source: r.source,
    target: r.target,
    weight: r.weight,
    class: r.class,
    plusClass: r.plus_class,
    plusExponent: r.plus_exponent,
    minusClass: r.minus_class,
    minusExponent: r.minus_exponent,
    flags: r.flags ? String(r.flags).split(' ') : [],
    tolerance: r.tolerance,
    toleranceRel: r.tolerance_rel,
    sensitivity: r.sensitivity,
    flagged: !!r.flagged,
    disposition: r.d_kind ? { kind: r.d_kind, note: r.d_note, by: r.d_by ?? '', at: r.d_at } : null,
  };
}

export function toEdgeDetail(r: EdgeDbRow): EdgeDetail {
  const d = JSON.parse(r.detail_json);
  const sign = (s: any) => (s ? { ...s, exponent: fin(s.exponent), prefactor: fin(s.prefactor) } : null);
  return {
    ...toEdgeRow(r),
    plus: sign(d.plus),
    minus: sign(d.minus),
    budget: { eps: d.budget.eps, relative: d.budget.relative, limitedBy: d.budget.limitedBy, allowedDelta: d.budget.allowedDelta, confirmed: d.budget.confirmed },
    sensitivityDetail: d.sensitivity ?? null,
  };
}

const fin = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) ? x : null);
