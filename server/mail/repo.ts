import type { Knex } from 'knex';

export interface OutboxRow {
  id: number;
  received_at_ms: number;
  mail_from: string;
  rcpt_to: string;
  subject: string;
  text_body: string;
  raw: string;
}

export async function insertMessage(db: Knex, row: Omit<OutboxRow, 'id'>): Promise<void> {
  await db('outbox').insert(row);
}

export async function latestMessages(db: Knex, limit: number): Promise<OutboxRow[]> {
  return db('outbox').orderBy('id', 'desc').limit(limit).select('*');
}
