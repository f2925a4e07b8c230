import type { Knex } from 'knex';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { migrateToLatest, openDatabase } from '../../../server/db/connection';

/**
 * A fresh, migrated database file per call (a file, not :memory:, so tests
 * see the same WAL and pragma set-up as the running server).
 */
export async function freshDatabase(options: { seed?: boolean } = {}): Promise<Knex> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-test-db-'));
  const db = openDatabase(path.join(dir, 'test.sqlite3'));
  await migrateToLatest(db);
  if (options.seed) await db.seed.run();
  return db;
}

/**
 * Asserts that a database call is refused with a message matching `pattern`.
 * better-sqlite3's native binding keeps the error class of the first test
 * file that loaded it in a jest worker, so `toThrow` (an instanceof check)
 * misses errors in later files; the message is what matters here anyway.
 */
export async function expectRefusal(call: PromiseLike<unknown>, pattern: RegExp): Promise<void> {
  let message: string | null = null;
  try {
    await call;
  } catch (err) {
    message = String((err as { message?: unknown }).message ?? err);
  }
  expect(message).toMatch(pattern);
}
