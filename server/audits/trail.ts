import type { Knex } from 'knex';
import { verifyTrail } from '../trail/service';

/** An audit's entries of the hash-chained trail, and whether the whole chain verifies. */
export async function trailOf(db: Knex, auditId: number) {
  const rows = await db('events as ev')
    .leftJoin('users as u', 'u.id', 'ev.actor_id')
    .where({ 'ev.subject_type': 'audit', 'ev.subject_id': String(auditId) })
    .orderBy('ev.id', 'asc')
    .select('ev.id', 'ev.at', 'u.display_name as actor', 'ev.action', 'ev.old_value', 'ev.new_value', 'ev.reason', 'ev.hash');
  const broken = await verifyTrail(db);
  return {
    entries: rows.map((r) => ({ id: r.id, at: r.at, actor: r.actor ?? null, action: r.action, oldValue: r.old_value, newValue: r.new_value, reason: r.reason, hash: r.hash })),
    verified: broken === -1,
  };
}
