import type { Knex } from 'knex';
import { chainHash, firstBrokenLink, genesisHash, type TrailEventFields } from '../../lib/trail/chain';
import { allEvents, insertEvent, lastHash } from './repo';

export interface NewEvent {
  actorId: number | null;
  action: string;
  subjectType: string;
  subjectId: string | number | null;
  oldValue?: unknown;
  newValue?: unknown;
  reason?: string | null;
}

const text = (v: unknown): string | null => (v === undefined || v === null ? null : typeof v === 'string' ? v : JSON.stringify(v));

/**
 * Appends one event to the hash chain. Reading the last hash and inserting
 * happen in one transaction (inside the caller's, when given one), so two
 * events can never claim the same predecessor.
 */
export async function recordEvent(db: Knex | Knex.Transaction, e: NewEvent, now: number): Promise<void> {
  const write = async (trx: Knex.Transaction) => {
    const fields: TrailEventFields = {
      at: new Date(now).toISOString(),
      actorId: e.actorId,
      action: e.action,
      subjectType: e.subjectType,
      subjectId: e.subjectId === null ? null : String(e.subjectId),
      oldValue: text(e.oldValue),
      newValue: text(e.newValue),
      reason: e.reason ?? null,
    };
    const prev = (await lastHash(trx)) ?? genesisHash;
    await insertEvent(trx, {
      at: fields.at,
      actor_id: fields.actorId,
      action: fields.action,
      subject_type: fields.subjectType,
      subject_id: fields.subjectId,
      old_value: fields.oldValue,
      new_value: fields.newValue,
      reason: fields.reason,
      prev_hash: prev,
      hash: chainHash(prev, fields),
    });
  };
  if ((db as Knex.Transaction).isTransaction) await write(db as Knex.Transaction);
  else await (db as Knex).transaction(write);
}

/** Index of the first event that does not chain, or -1 when the trail is intact. */
export async function verifyTrail(db: Knex): Promise<number> {
  const rows = await allEvents(db);
  return firstBrokenLink(
    rows.map((r) => ({
      at: r.at,
      actorId: r.actor_id,
      action: r.action,
      subjectType: r.subject_type,
      subjectId: r.subject_id,
      oldValue: r.old_value,
      newValue: r.new_value,
      reason: r.reason,
      prevHash: r.prev_hash,
      hash: r.hash,
    })),
  );
}
