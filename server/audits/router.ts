import { Router } from 'express';
import { z } from 'zod';
import {
  auditListQuerySchema,
  commentSchema,
  edgeQuerySchema,
  optionalCommentSchema,
  setDispositionSchema,
  startAuditSchema,
} from '../../lib/schemas/audit';
import { requireRoles } from '../auth/require-roles';
import { HttpError } from '../http/errors';
import { parseBody, parseParams, parseQuery } from '../http/validate';
import { edgesCsv } from './export-csv';
import { toEdgeDetail, toEdgeRow } from './present';
import * as repo from './repo';
import { auditReportPdf } from './report-pdf';
import * as service from './service';
import type { AuditDeps } from './service';
import { trailOf } from './trail';

const idParams = z.object({ auditId: z.coerce.number().int().positive() });
const edgeParams = idParams.extend({ edgeIndex: z.coerce.number().int().min(0) });
const list = (s?: string) => (s ? s.split(',').map((x) => x.trim()).filter(Boolean) : undefined);

function edgeFilter(q: z.infer<typeof edgeQuerySchema>): repo.EdgeFilter {
  return {
    classes: list(q.class),
    expMin: q.expMin,
    expMax: q.expMax,
    tolBelow: q.tolBelow,
    dispositions: list(q.disposition),
    flagged: q.flagged === undefined ? undefined : q.flagged === 'yes',
    q: q.q?.trim() || undefined,
    sort: q.sort,
    dir: q.dir,
  };
}

/** Audits: start, watch, triage, send back, seal, export. Roles per route below. */
export function auditsRouter(deps: AuditDeps): Router {
  const r = Router();

  r.post('/audits', requireRoles('analyst'), async (req, res) => {
    res.status(201).json(await service.startAudit(deps, req.user!, parseBody(startAuditSchema, req)));
  });

  r.get('/audits', requireRoles(), async (req, res) => {
    const q = parseQuery(auditListQuerySchema, req);
    res.json({ audits: await service.listAudits(deps, { states: list(q.state), networkId: q.networkId }) });
  });

  r.get('/audits/:auditId', requireRoles(), async (req, res) => {
    res.json(await service.auditDetail(deps, req.user!, parseParams(idParams, req).auditId));
  });

  r.post('/audits/:auditId/cancel', requireRoles('analyst'), async (req, res) => {
    res.json(await service.cancelAudit(deps, req.user!, parseParams(idParams, req).auditId));
  });

  r.get('/audits/:auditId/edges', requireRoles(), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    const q = parseQuery(edgeQuerySchema, req);
    await exists(deps, auditId);
    const page = await repo.edgePage(deps.db, auditId, edgeFilter(q), q.page, q.pageSize);
    res.json({ rows: page.rows.map(toEdgeRow), total: page.total, page: q.page, pageSize: q.pageSize });
  });

  r.get('/audits/:auditId/edges.csv', requireRoles(), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    const q = parseQuery(edgeQuerySchema, req);
    await exists(deps, auditId);
    const rows = (await repo.allEdgeRows(deps.db, auditId, edgeFilter(q))).map(toEdgeRow);
    res.type('text/csv; charset=utf-8').attachment(`hairline-audit-${auditId}-edges.csv`).send('\uFEFF' + edgesCsv(rows));
  });

  r.get('/audits/:auditId/edges/:edgeIndex', requireRoles(), async (req, res) => {
    const { auditId, edgeIndex } = parseParams(edgeParams, req);
    const row = await repo.findEdge(deps.db, auditId, edgeIndex);
    if (!row) throw new HttpError(404, 'not-found', `Audit ${auditId} has no result for edge ${edgeIndex}.`);
    res.json(toEdgeDetail(row));
  });

  r.put('/audits/:auditId/edges/:edgeIndex/disposition', requireRoles('auditor'), async (req, res) => {
    const { auditId, edgeIndex } = parseParams(edgeParams, req);
    res.json(await service.setDisposition(deps, req.user!, auditId, edgeIndex, parseBody(setDispositionSchema, req)));
  });

  r.post('/audits/:auditId/submit', requireRoles('auditor'), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    res.json(await service.submitAudit(deps, req.user!, auditId, parseBody(optionalCommentSchema, req).comment));
  });

  r.post('/audits/:auditId/return', requireRoles('auditor', 'approver'), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    res.json(await service.returnAudit(deps, req.user!, auditId, parseBody(commentSchema, req).comment));
  });

  r.post('/audits/:auditId/reopen', requireRoles('analyst'), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    res.json(await service.reopenAudit(deps, req.user!, auditId, parseBody(optionalCommentSchema, req).comment));
  });

  r.post('/audits/:auditId/lock', requireRoles('approver'), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    res.json(await service.lockAudit(deps, req.user!, auditId, parseBody(commentSchema, req).comment));
  });

  r.get('/audits/:auditId/trail', requireRoles(), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    await exists(deps, auditId);
    res.json(await trailOf(deps.db, auditId));
  });

  r.get('/audits/:auditId/report.pdf', requireRoles(), async (req, res) => {
    const { auditId } = parseParams(idParams, req);
    const audit = await service.auditDetail(deps, req.user!, auditId);
    const flagged = (await repo.allEdgeRows(deps.db, auditId, { flagged: true, sort: 'class', dir: 'asc' })).map(toEdgeRow);
    const pdf = await auditReportPdf(audit, flagged);
    res.type('application/pdf').attachment(`hairline-audit-${auditId}.pdf`).send(pdf);
  });

  return r;
}

async function exists(deps: AuditDeps, id: number) {
  if (!(await repo.findAudit(deps.db, id))) throw new HttpError(404, 'not-found', `Audit ${id} does not exist.`);
}
