import knex, { type Knex } from 'knex';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { knexSettings } from '../../knexfile';

/**
 * Opens the SQLite database through Knex. Every pooled connection gets WAL
 * (readers never wait for the writer), a busy timeout (a second writer waits
 * instead of failing) and enforced foreign keys.
 */
export function openDatabase(file: string): Knex {
  if (file !== ':memory:') mkdirSync(path.dirname(file), { recursive: true });
  return knex(knexSettings(file));
}

export async function migrateToLatest(db: Knex): Promise<void> {
  await db.migrate.latest();
}
