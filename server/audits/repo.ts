import type { Knex } from 'knex';
import type { EdgeRowFields } from '../../lib/audit/edge-row';
import type { EdgeQuery } from '../../lib/schemas/audit';

/** SQL for audits, their per-edge results and dispositions. No rules here. */

export interface AuditRow {
  id: number;
  network_version_id: number;
  state: string;
  settings_json: string;
  started_by: number;
  started_by_name: string;
  created_at: string;
  finished_at: string | null;
  progress_done: number;
  progress_total: number;
  segment_started_ms: number | null;
  segment_done_at_start: number;
  reason: string | null;
  baseline_json: string | null;
  lambda2_re: number | null;
  lambda2_im: number | null;
  lock_by: number | null;
  lock_by_name: string | null;
  lock_at: string | null;
  lock_comment: string | null;
  lock_hash: string | null;
  network_id: number;
  network_name: string;
  version: number;
  convention: 'in' | 'out';
}

function audits(db: Knex) {
  return db('audits as a')
    .join('network_versions as v', 'v.id', 'a.network_version_id')
    .join('networks as n', 'n.id', 'v.network_id')
    .join('users as s', 's.id', 'a.started_by')
    .leftJoin('users as l', 'l.id', 'a.lock_by')
    .select('a.*', 's.display_name as started_by_name', 'l.display_name as lock_by_name', 'n.id as network_id', 'n.name as network_name', 'v.version', 'n.convention');
}

export async function findAudit(db: Knex, id: number): Promise<AuditRow | undefined> {
  return audits(db).where('a.id', id).first();
}

export async function listAudits(db: Knex, filter: { states?: string[]; networkId?: number }): Promise<AuditRow[]> {
  const q = audits(db).orderBy('a.id', 'desc');
  if (filter.states?.length) q.whereIn('a.state', filter.states);
  if (filter.networkId) q.where('n.id', filter.networkId);
  return q;
}

export async function insertAudit(db: Knex, row: { networkVersionId: number; settingsJson: string; startedBy: number; total: number }): Promise<number> {
  const [r] = await db('audits')
    .insert({ network_version_id: row.networkVersionId, settings_json: row.settingsJson, started_by: row.startedBy, progress_total: row.total, state: 'queued' })
    .returning('id');
  return typeof r === 'object' ? r.id : r;
}

export async function updateAudit(db: Knex, id: number, fields: Record<string, unknown>): Promise<void> {
  await db('audits').where({ id }).update(fields);
}

export async function doneEdgeIndices(db: Knex, auditId: number): Promise<Set<number>> {
  const rows = await db('audit_edges').where({ audit_id: auditId }).select('edge_index');
  return new Set(rows.map((r) => r.edge_index));
}

/**
 * Stores one chunk's rows and the new progress count together: a crash leaves both or neither.
 * A row already stored (a chunk delivered twice) is kept as it is, and progress is counted from the table.
 */
export async function storeChunk(db: Knex, auditId: number, rows: EdgeRowFields[]): Promise<number> {
  return db.transaction(async (trx) => {
    if (rows.length) await trx('audit_edges').insert(rows.map((r) => ({ ...r, audit_id: auditId }))).onConflict(['audit_id', 'edge_index']).ignore();
    const [{ n }] = await trx('audit_edges').where({ audit_id: auditId }).count<{ n: number }[]>({ n: '*' });
    await trx('audits').where({ id: auditId }).update({ progress_done: Number(n) });
    return Number(n);
  });
}

export async function auditsInStates(db: Knex, states: string[]): Promise<number[]> {
  return (await db('audits').whereIn('state', states).select('id')).map((r) => r.id);
}

export async function classCounts(db: Knex, auditId: number): Promise<Record<string, number>> {
  const rows: Array<{ class: string; n: number }> = await db('audit_edges')
    .where({ audit_id: auditId })
    .groupBy('class')
    .select('class', db.raw('count(*) as n'));
  return Object.fromEntries(rows.map((r) => [r.class, Number(r.n)]));
}

export async function flaggedCounts(db: Knex, auditId: number): Promise<{ flagged: number; undisposed: number }> {
  const [row] = await db('audit_edges as e')
    .leftJoin('audit_dispositions as d', function () {
      this.on('d.audit_id', 'e.audit_id').andOn('d.edge_index', 'e.edge_index');
    })
    .where({ 'e.audit_id': auditId, 'e.flagged': true })
    .select(db.raw('count(*) as flagged'), db.raw('sum(case when d.kind is null then 1 else 0 end) as undisposed'));
  return { flagged: Number(row.flagged ?? 0), undisposed: Number(row.undisposed ?? 0) };
}

export async function undisposedFlagged(db: Knex, auditId: number): Promise<Array<{ edge_index: number; source: string; target: string; class: string }>> {
  return db('audit_edges as e')
    .leftJoin('audit_dispositions as d', function () {
      this.on('d.audit_id', 'e.audit_id').andOn('d.edge_index', 'e.edge_index');
    })
    .where({ 'e.audit_id': auditId, 'e.flagged': true })
    .whereNull('d.kind')
    .orderBy('e.edge_index')
    .select('e.edge_index', 'e.source', 'e.target', 'e.class');
}

const sortColumns: Record<NonNullable<EdgeQuery['sort']>, string> = {
  edge: 'e.edge_index',
  source: 'e.source',
  target: 'e.target',
  weight: 'e.weight',
  class: 'e.class_rank',
  plusExponent: 'e.plus_exponent',
  minusExponent: 'e.minus_exponent',
  tolerance: 'e.tolerance',
  toleranceRel: 'e.tolerance_rel',
  sensitivity: 'e.sensitivity',
  disposition: 'd.kind',
};

export interface EdgeFilter {
  classes?: string[];
  expMin?: number;
  expMax?: number;
  tolBelow?: number;
  dispositions?: string[];
  flagged?: boolean;
  q?: string;
  sort: keyof typeof sortColumns;
  dir: 'asc' | 'desc';
}

/** The filtered, sorted edge rows with their dispositions; paging is optional (CSV takes all). */
export function edgeRowsQuery(db: Knex, auditId: number, f: EdgeFilter) {
  const q = db('audit_edges as e')
    .leftJoin('audit_dispositions as d', function () {
      this.on('d.audit_id', 'e.audit_id').andOn('d.edge_index', 'e.edge_index');
    })
    .leftJoin('users as u', 'u.id', 'd.by_user')
    .where('e.audit_id', auditId);
  if (f.classes?.length) q.whereIn('e.class', f.classes);
  // An exponent filter keeps an edge when either sign's exponent falls in the range.
  if (f.expMin !== undefined || f.expMax !== undefined) {
    const lo = f.expMin ?? -Infinity;
    const hi = f.expMax ?? Infinity;
    q.where((w) => {
      for (const col of ['e.plus_exponent', 'e.minus_exponent']) {
        w.orWhere((x) => {
          x.whereNotNull(col);
          if (Number.isFinite(lo)) x.where(col, '>=', lo);
          if (Number.isFinite(hi)) x.where(col, '<=', hi);
        });
      }
    });
  }
  if (f.tolBelow !== undefined) q.where('e.tolerance_rel', '<', f.tolBelow);
  if (f.flagged !== undefined) q.where('e.flagged', f.flagged);
  if (f.dispositions?.length) {
    const kinds = f.dispositions.filter((d) => d !== 'none');
    q.where((w) => {
      if (kinds.length) w.orWhereIn('d.kind', kinds);
      if (f.dispositions!.includes('none')) w.orWhereNull('d.kind');
    });
  }
  if (f.q) {
    const pattern = `%${f.q.replace(/[%_\\]/g, (c) => '\\' + c)}%`;
    q.whereRaw("(e.source like ? escape '\\' or e.target like ? escape '\\')", [pattern, pattern]);
  }
  return q;
}

export async function edgePage(db: Knex, auditId: number, f: EdgeFilter, page: number, pageSize: number) {
  const [{ n }] = await edgeRowsQuery(db, auditId, f).count<{ n: number }[]>({ n: '*' });
  const rows = await edgeRowsQuery(db, auditId, f)
    .select('e.*', 'd.kind as d_kind', 'd.note as d_note', 'd.at as d_at', 'u.display_name as d_by')
    .orderByRaw(`${sortColumns[f.sort]} is null`) // empty values last in either direction
    .orderBy(sortColumns[f.sort], f.dir)
    .orderBy('e.edge_index', 'asc')
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  return { rows, total: Number(n) };
}

export async function allEdgeRows(db: Knex, auditId: number, f: EdgeFilter) {
  return edgeRowsQuery(db, auditId, f)
    .select('e.*', 'd.kind as d_kind', 'd.note as d_note', 'd.at as d_at', 'u.display_name as d_by')
    .orderByRaw(`${sortColumns[f.sort]} is null`)
    .orderBy(sortColumns[f.sort], f.dir)
    .orderBy('e.edge_index', 'asc');
}

export async function findEdge(db: Knex, auditId: number, edgeIndex: number) {
  return edgeRowsQuery(db, auditId, { sort: 'edge', dir: 'asc' })
    .where('e.edge_index', edgeIndex)
    .select('e.*', 'd.kind as d_kind', 'd.note as d_note', 'd.at as d_at', 'u.display_name as d_by')
    .first();
}

export async function upsertDisposition(db: Knex, row: { auditId: number; edgeIndex: number; kind: string; note: string; by: number; at: string }) {
  await db('audit_dispositions')
    .insert({ audit_id: row.auditId, edge_index: row.edgeIndex, kind: row.kind, note: row.note, by_user: row.by, at: row.at })
    .onConflict(['audit_id', 'edge_index'])
    .merge(['kind', 'note', 'by_user', 'at']);
}

export async function sealInputs(db: Knex, auditId: number) {
  const edges = await db('audit_edges').where({ audit_id: auditId }).orderBy('edge_index');
  const dispositions = await db('audit_dispositions').where({ audit_id: auditId }).orderBy('edge_index');
  return { edges, dispositions };
}
