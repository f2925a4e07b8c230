import type { Knex } from 'knex';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Health, JobsStatus } from '../../lib/schemas/health';

const version: string = JSON.parse(readFileSync(path.join(__dirname, '../../package.json'), 'utf8')).version;

/**
 * Asks the database a trivial question so the answer proves it responds, and
 * reports who computes audit sweeps. No queue worker is not "degraded": the
 * server itself serves fine, and a balancer must not restart it for that.
 */
export async function checkHealth(db: Knex, jobsStatus: () => Promise<JobsStatus>): Promise<Health> {
  const [database, jobs] = await Promise.all([
    db.raw('select 1 as one').then(
      () => ({ ok: true }),
      (err: Error) => ({ ok: false, message: err.message }),
    ),
    jobsStatus(),
  ]);
  return { status: database.ok ? 'ok' : 'degraded', version, database, jobs };
}
