import type { Knex } from 'knex';
import { readFileSync } from 'node:fs';
import path from 'node:path';

const version: string = JSON.parse(readFileSync(path.join(__dirname, '../../package.json'), 'utf8')).version;

export interface Health {
  status: 'ok' | 'degraded';
  version: string;
  database: { ok: boolean; message?: string };
}

/** Asks the database a trivial question so the answer proves it responds. */
export async function checkHealth(db: Knex): Promise<Health> {
  try {
    await db.raw('select 1 as one');
    return { status: 'ok', version, database: { ok: true } };
  } catch (err) {
    return { status: 'degraded', version, database: { ok: false, message: (err as Error).message } };
  }
}
