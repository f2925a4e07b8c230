import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { canonicalJson, type SealContent } from '../../lib/audit/canonical';
import type { AuditRow } from './repo';
import { sealInputs } from './repo';

/**
 * SHA-256 over the canonical serialisation of everything the approver signs:
 * results, dispositions, the comment, who and when. Recomputed on every read
 * of a sealed audit, so an edit made behind the database triggers shows.
 */
export async function sealHash(db: Knex, audit: AuditRow, seal: { comment: string; by: number; at: string }): Promise<string> {
  const { edges, dispositions } = await sealInputs(db, audit.id);
  const content: SealContent = {
    auditId: audit.id,
    networkVersionId: audit.network_version_id,
    settings: JSON.parse(audit.settings_json),
    lambda2: audit.lambda2_re === null ? null : { re: audit.lambda2_re, im: audit.lambda2_im ?? 0 },
    edges: edges.map((e) => ({
      edgeIndex: e.edge_index,
      source: e.source,
      target: e.target,
      weight: e.weight,
      class: e.class,
      plusClass: e.plus_class,
      plusExponent: e.plus_exponent,
      minusClass: e.minus_class,
      minusExponent: e.minus_exponent,
      flags: e.flags,
      tolerance: e.tolerance,
    })),
    dispositions: dispositions.map((d) => ({ edgeIndex: d.edge_index, kind: d.kind, note: d.note, by: d.by_user, at: d.at })),
    comment: seal.comment,
    sealedBy: seal.by,
    sealedAt: seal.at,
  };
  return createHash('sha256').update(canonicalJson(content), 'utf8').digest('hex');
}
