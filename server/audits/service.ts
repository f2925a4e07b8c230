import type { Knex } from 'knex';
import type { AuditDetail, AuditState, AuditSummary, EdgeRow } from '../../lib/schemas/audit';
import { auditSettingsSchema, startAuditSchema } from '../../lib/schemas/audit';
import type { RequestUser } from '../auth/require-roles';
import { HttpError } from '../http/errors';
import { recordEvent } from '../trail/service';
import type { AuditNotifier } from './notify';
import { toDetailExtras, toEdgeRow, toSummary } from './present';
import * as repo from './repo';
import type { AuditRunner } from './runner';
import { sealHash } from './seal';

export interface AuditDeps {
  db: Knex;
  runner: AuditRunner;
  notify: AuditNotifier;
  now: () => number;
}

type Action = AuditDetail['allowed'][number];

const has = (u: RequestUser, role: string) => u.roles.includes(role as never);

/** The workflow's rules in one table: which state and role allow which action. */
export function allowedActions(state: AuditState, user: RequestUser, startedBy: number): Action[] {
  const out: Action[] = [];
  if ((state === 'queued' || state === 'sweeping') && has(user, 'analyst')) out.push('cancel');
  if (state === 'in-review' && has(user, 'auditor')) out.push('dispose', 'submit', 'return');
  if (state === 'awaiting-sign-off' && has(user, 'approver')) {
    out.push('return');
    if (user.id !== startedBy) out.push('lock');
  }
  if (state === 'sent-back' && has(user, 'analyst')) out.push('reopen');
  return out;
}

async function load(deps: AuditDeps, id: number): Promise<repo.AuditRow> {
  const a = await repo.findAudit(deps.db, id);
  if (!a) throw new HttpError(404, 'not-found', `Audit ${id} does not exist.`);
  return a;
}

function ensureAllowed(deps: AuditDeps, a: repo.AuditRow, user: RequestUser, action: Action, what: string): void {
  if (a.state === 'sealed') throw new HttpError(409, 'sealed', `Audit ${a.id} is sealed; nothing in it can change.`);
  if (allowedActions(a.state as AuditState, user, a.started_by).includes(action)) return;
  if (action === 'lock' && a.state === 'awaiting-sign-off' && has(user, 'approver') && user.id === a.started_by) {
    throw new HttpError(403, 'four-eyes', 'You started this audit, so another approver must seal it.');
  }
  throw new HttpError(409, 'wrong-state', `Audit ${a.id} is ${a.state}; you cannot ${what} now.`);
}

export async function summaryOf(deps: AuditDeps, a: repo.AuditRow): Promise<AuditSummary> {
  const [classes, flagged] = await Promise.all([repo.classCounts(deps.db, a.id), repo.flaggedCounts(deps.db, a.id)]);
  return toSummary(a, { classes, flagged: flagged.flagged, undisposed: flagged.undisposed }, deps.now());
}

export async function auditDetail(deps: AuditDeps, user: RequestUser, id: number): Promise<AuditDetail> {
  const a = await load(deps, id);
  const summary = await summaryOf(deps, a);
  let lock: AuditDetail['lock'] = null;
  let hashCheck: AuditDetail['hashCheck'] = null;
  if (a.state === 'sealed' && a.lock_at && a.lock_hash && a.lock_by) {
    lock = { by: { id: a.lock_by, name: a.lock_by_name ?? '' }, at: a.lock_at, meaning: 'approved', comment: a.lock_comment ?? '', hash: a.lock_hash };
    const recomputed = await sealHash(deps.db, a, { comment: a.lock_comment ?? '', by: a.lock_by, at: a.lock_at });
    hashCheck = { recomputed, matches: recomputed === a.lock_hash };
  }
  const last = await deps.db('events as ev')
    .leftJoin('users as u', 'u.id', 'ev.actor_id')
    .where({ 'ev.subject_type': 'audit', 'ev.subject_id': String(id) })
    .whereIn('ev.action', ['audit.submitted', 'audit.returned', 'audit.reopened', 'audit.sealed'])
    .orderBy('ev.id', 'desc')
    .first('ev.action', 'ev.reason', 'ev.at', 'u.display_name');
  return {
    ...summary,
    ...toDetailExtras(a),
    lock,
    hashCheck,
    lastComment: last?.reason ? { by: last.display_name ?? '', at: last.at, text: last.reason, action: last.action.replace('audit.', '') } : null,
    allowed: allowedActions(a.state as AuditState, user, a.started_by),
    // Only while the run waits on workers: a queued run with none connected says why it does not move.
    jobs: a.state === 'queued' || a.state === 'sweeping' ? await deps.runner.jobsStatus() : null,
  };
}

/**
 * Creates the audit and starts its sweep. The answer is the audit's full
 * detail as it stands before the sweep begins (queued, nothing swept), so the
 * page it opens shows the run from its first frame instead of a loading state.
 */
export async function startAudit(deps: AuditDeps, user: RequestUser, input: ReturnType<typeof startAuditSchema.parse>): Promise<AuditDetail> {
  const version = await deps.db('network_versions').where({ network_id: input.networkId, version: input.version }).first('id', 'edge_count');
  if (!version) throw new HttpError(404, 'not-found', `Network ${input.networkId} has no version ${input.version}.`);
  const settings = auditSettingsSchema.parse(input.settings);
  const id = await deps.db.transaction(async (trx) => {
    const auditId = await repo.insertAudit(trx, { networkVersionId: version.id, settingsJson: JSON.stringify(settings), startedBy: user.id, total: version.edge_count });
    await recordEvent(trx, { actorId: user.id, action: 'audit.started', subjectType: 'audit', subjectId: auditId, newValue: settings }, deps.now());
    return auditId;
  });
  const detail = await auditDetail(deps, user, id);
  void deps.runner.start(id);
  return detail;
}

export async function listAudits(deps: AuditDeps, filter: { states?: string[]; networkId?: number }): Promise<AuditSummary[]> {
  const rows = await repo.listAudits(deps.db, filter);
  return Promise.all(rows.map((a) => summaryOf(deps, a)));
}

export async function cancelAudit(deps: AuditDeps, user: RequestUser, id: number): Promise<AuditDetail> {
  const a = await load(deps, id);
  ensureAllowed(deps, a, user, 'cancel', 'cancel it');
  if (deps.runner.isRunning(id)) {
    deps.runner.cancel(id);
    await deps.runner.settled(id);
  } else {
    await transition(deps, a, user, 'cancelled', 'audit.cancelled', 'cancelled before the sweep started');
  }
  return auditDetail(deps, user, id);
}

export async function setDisposition(deps: AuditDeps, user: RequestUser, id: number, edgeIndex: number, body: { kind: string; note: string }): Promise<EdgeRow> {
  const a = await load(deps, id);
  ensureAllowed(deps, a, user, 'dispose', 'record dispositions');
  const edge = await repo.findEdge(deps.db, id, edgeIndex);
  if (!edge) throw new HttpError(404, 'not-found', `Audit ${id} has no edge ${edgeIndex}.`);
  const at = new Date(deps.now()).toISOString();
  await deps.db.transaction(async (trx) => {
    await repo.upsertDisposition(trx, { auditId: id, edgeIndex, kind: body.kind, note: body.note, by: user.id, at });
    await recordEvent(
      trx,
      {
        actorId: user.id,
        action: 'audit.disposition',
        subjectType: 'audit',
        subjectId: id,
        oldValue: edge.d_kind ? { edge: edgeIndex, kind: edge.d_kind, note: edge.d_note } : null,
        newValue: { edge: edgeIndex, kind: body.kind, note: body.note },
      },
      deps.now(),
    );
  });
  return toEdgeRow((await repo.findEdge(deps.db, id, edgeIndex))!);
}

export async function submitAudit(deps: AuditDeps, user: RequestUser, id: number, comment?: string): Promise<AuditDetail> {
  const a = await load(deps, id);
  ensureAllowed(deps, a, user, 'submit', 'submit it');
  const missing = await repo.undisposedFlagged(deps.db, id);
  if (missing.length > 0) {
    throw new HttpError(
      409,
      'undisposed',
      `${missing.length} flagged edge${missing.length === 1 ? ' has' : 's have'} no disposition yet; record one for each before submitting.`,
      undefined,
      missing.map((m) => ({ code: 'undisposed', message: `edge ${m.edge_index} (${m.source} → ${m.target}, ${m.class}) has no disposition`, element: `edge ${m.edge_index}` })),
    );
  }
  await transition(deps, a, user, 'awaiting-sign-off', 'audit.submitted', comment ?? null);
  await deps.notify.toRole('approver', `Hairline: audit ${id} awaits sign-off`, `${user.displayName} submitted audit ${id} (${a.network_name} v${a.version}) for approval.${comment ? `\n\nComment: ${comment}` : ''}`);
  return auditDetail(deps, user, id);
}

export async function returnAudit(deps: AuditDeps, user: RequestUser, id: number, comment: string): Promise<AuditDetail> {
  const a = await load(deps, id);
  ensureAllowed(deps, a, user, 'return', 'send it back');
  await transition(deps, a, user, 'sent-back', 'audit.returned', comment);
  await deps.notify.toUser(a.started_by, `Hairline: audit ${id} was sent back`, `${user.displayName} sent audit ${id} (${a.network_name} v${a.version}) back to you.\n\nComment: ${comment}`);
  return auditDetail(deps, user, id);
}

export async function reopenAudit(deps: AuditDeps, user: RequestUser, id: number, comment?: string): Promise<AuditDetail> {
  const a = await load(deps, id);
  ensureAllowed(deps, a, user, 'reopen', 'reopen it');
  await transition(deps, a, user, 'in-review', 'audit.reopened', comment ?? null);
  await deps.notify.toRole('auditor', `Hairline: audit ${id} is back for review`, `${user.displayName} reopened audit ${id} for review.${comment ? `\n\nComment: ${comment}` : ''}`);
  return auditDetail(deps, user, id);
}

export async function lockAudit(deps: AuditDeps, user: RequestUser, id: number, comment: string): Promise<AuditDetail> {
  const a = await load(deps, id);
  ensureAllowed(deps, a, user, 'lock', 'seal it');
  const at = new Date(deps.now()).toISOString();
  await deps.db.transaction(async (trx) => {
    const hash = await sealHash(trx, a, { comment, by: user.id, at });
    await recordEvent(trx, { actorId: user.id, action: 'audit.sealed', subjectType: 'audit', subjectId: id, oldValue: a.state, newValue: { state: 'sealed', meaning: 'approved', hash }, reason: comment }, deps.now());
    // Last write of all: once the state is 'sealed' the triggers refuse any other.
    await repo.updateAudit(trx, id, { lock_by: user.id, lock_at: at, lock_comment: comment, lock_hash: hash, state: 'sealed' });
  });
  await deps.notify.toUser(a.started_by, `Hairline: audit ${id} is sealed`, `${user.displayName} approved and sealed audit ${id} (${a.network_name} v${a.version}).\n\nComment: ${comment}`);
  return auditDetail(deps, user, id);
}

async function transition(deps: AuditDeps, a: repo.AuditRow, user: RequestUser, to: AuditState, action: string, reason: string | null): Promise<void> {
  await deps.db.transaction(async (trx) => {
    const fields: Record<string, unknown> = { state: to };
    if (to === 'cancelled') Object.assign(fields, { reason, finished_at: new Date(deps.now()).toISOString() });
    await repo.updateAudit(trx, a.id, fields);
    await recordEvent(trx, { actorId: user.id, action, subjectType: 'audit', subjectId: a.id, oldValue: a.state, newValue: to, reason }, deps.now());
  });
}
