import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  auditDetailSchema,
  auditListSchema,
  edgeDetailSchema,
  edgePageSchema,
  edgeRowSchema,
  trailSchema,
  type AuditDetail,
  type AuditState,
  type DispositionKind,
  type EdgeQuery,
  type StartAudit,
} from '../schemas/audit';
import { apiRequest } from './client';

const json = (method: string, body?: unknown): RequestInit => ({ method, body: body === undefined ? undefined : JSON.stringify(body) });

/** States in which the sweep is still running and the audit is polled. */
export const runningStates: readonly AuditState[] = ['queued', 'sweeping'];
export const isRunning = (s: AuditState | undefined) => !!s && runningStates.includes(s);

/**
 * The edge query as a search string in the order the contract lists its keys,
 * leaving out what is empty. `paging: false` for the CSV, which takes the whole filtered table.
 */
export function edgeSearch(query: EdgeQuery, { paging = true } = {}): string {
  const keys = ['class', 'expMin', 'expMax', 'tolBelow', 'disposition', 'flagged', 'q', 'sort', 'dir', ...(paging ? ['page', 'pageSize'] : [])] as const;
  const params = new URLSearchParams();
  for (const k of keys) {
    const v = query[k as keyof EdgeQuery];
    if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  }
  return params.toString();
}

export const auditCsvHref = (auditId: number, query: EdgeQuery) => {
  const s = edgeSearch(query, { paging: false });
  return `/api/v1/audits/${auditId}/edges.csv${s ? `?${s}` : ''}`;
};
export const auditReportHref = (auditId: number) => `/api/v1/audits/${auditId}/report.pdf`;

export function useAudits(states: readonly string[], networkId?: number) {
  const params = new URLSearchParams();
  if (states.length) params.set('state', states.join(','));
  if (networkId) params.set('networkId', String(networkId));
  const s = params.toString();
  return useQuery({
    queryKey: ['audits', states.join(','), networkId ?? null],
    queryFn: () => apiRequest(auditListSchema, `/audits${s ? `?${s}` : ''}`),
    // Keep the list's progress bars moving while any run is in flight.
    refetchInterval: (q) => (q.state.data?.audits.some((a) => isRunning(a.state)) ? 2000 : false),
  });
}

/** One audit; polled every second while its sweep runs. */
export function useAudit(id: number) {
  const qc = useQueryClient();
  return useQuery({
    queryKey: ['audit', id],
    queryFn: async () => {
      const before = qc.getQueryData<AuditDetail>(['audit', id]);
      const next = await apiRequest(auditDetailSchema, `/audits/${id}`);
      // The run finished (or stopped) since the last look: the table and trail are new.
      if (before && isRunning(before.state) && !isRunning(next.state)) {
        void qc.invalidateQueries({ queryKey: ['audit', id, 'edges'] });
        void qc.invalidateQueries({ queryKey: ['audit', id, 'trail'] });
      }
      return next;
    },
    enabled: Number.isFinite(id),
    refetchInterval: (q) => (isRunning(q.state.data?.state) ? 1000 : false),
  });
}

export function useAuditEdges(id: number, query: EdgeQuery, enabled = true) {
  const s = edgeSearch(query);
  return useQuery({
    queryKey: ['audit', id, 'edges', s],
    queryFn: () => apiRequest(edgePageSchema, `/audits/${id}/edges?${s}`),
    enabled: enabled && Number.isFinite(id),
    placeholderData: keepPreviousData,
  });
}

export function useAuditEdge(id: number, edgeIndex: number | undefined) {
  return useQuery({
    queryKey: ['audit', id, 'edge', edgeIndex],
    queryFn: () => apiRequest(edgeDetailSchema, `/audits/${id}/edges/${edgeIndex}`),
    enabled: Number.isFinite(id) && edgeIndex !== undefined && Number.isInteger(edgeIndex),
  });
}

export function useAuditTrail(id: number, enabled = true) {
  return useQuery({
    queryKey: ['audit', id, 'trail'],
    queryFn: () => apiRequest(trailSchema, `/audits/${id}/trail`),
    enabled: enabled && Number.isFinite(id),
  });
}

export function useStartAudit() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: StartAudit) => apiRequest(auditDetailSchema, '/audits', json('POST', body)),
    onSuccess: (detail) => {
      // The audit's page opens on this answer (queued, its bar at zero) and polls from there.
      qc.setQueryData(['audit', detail.id], detail);
      return qc.invalidateQueries({ queryKey: ['audits'] });
    },
  });
}

/** After any change to an audit: its detail, table, trail and the list are stale. */
function useRefreshAudit(id: number) {
  const qc = useQueryClient();
  return (detail?: AuditDetail) => {
    if (detail) qc.setQueryData(['audit', id], detail);
    void qc.invalidateQueries({ queryKey: ['audit', id] });
    void qc.invalidateQueries({ queryKey: ['audits'] });
  };
}

export type ReviewAction = 'cancel' | 'submit' | 'return' | 'reopen' | 'lock';

/** The state changes; each answers with the audit as it now stands. */
export function useReviewAction(id: number, action: ReviewAction) {
  const refresh = useRefreshAudit(id);
  return useMutation({
    mutationFn: (comment?: string) =>
      apiRequest(auditDetailSchema, `/audits/${id}/${action}`, json('POST', action === 'cancel' ? {} : comment?.trim() ? { comment: comment.trim() } : {})),
    onSuccess: (detail) => refresh(detail),
  });
}

export function useSetDisposition(id: number, edgeIndex: number) {
  const refresh = useRefreshAudit(id);
  return useMutation({
    mutationFn: (body: { kind: DispositionKind; note: string }) =>
      apiRequest(edgeRowSchema, `/audits/${id}/edges/${edgeIndex}/disposition`, json('PUT', { kind: body.kind, note: body.note.trim() })),
    onSuccess: () => refresh(),
  });
}
