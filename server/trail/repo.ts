import type { Knex } from 'knex';

export interface EventRow {
  id: number;
  at: string;
  actor_id: number | null;
  action: string;
  subject_type: string;
  subject_id: string | null;
  old_value: string | null;
  new_value: string | null;
  reason: string | null;
  prev_hash: string;
  hash: string;
}

export async function lastHash(db: Knex): Promise<string | null> {
  const row = await db('events').orderBy('id', 'desc').first('hash');
  return row ? row.hash : null;
}

export async function insertEvent(db: Knex, row: Omit<EventRow, 'id'>): Promise<void> {
  await db('events').insert(row);
}

export async function allEvents(db: Knex): Promise<EventRow[]> {
  return db('events').orderBy('id', 'asc').select('*');
}
