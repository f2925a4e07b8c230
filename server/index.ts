import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { createApp } from './app';
import type { Config } from './config';
import { migrateToLatest, openDatabase } from './db/connection';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { smtpMailer } from './mail/mailer';
import { createWorkerPool, type JobPool } from './jobs/pool';
import { createBullmqPool } from './jobs/bullmq-pool';
import { SummaryQueue } from './networks/summaries';
import { AuditRunner } from './audits/runner';
import { mailNotifier } from './audits/notify';

export interface RunningServer {
  url: string;
  db: Knex;
  server: Server;
  /** The local mail fake's port when HAIRLINE_MAIL=fake. */
  smtpPort?: number;
  close(): Promise<void>;
}

/**
 * Opens and migrates the database, then listens. Used by `npm start` and by
 * the browser tests, which start it in-process on a free port.
 */
export async function startServer(config: Config, options: { seed?: boolean } = {}): Promise<RunningServer> {
  const db = openDatabase(config.databaseFile);
  await migrateToLatest(db);
  if (options.seed) await db.seed.run();
  // Import summaries get a thread of their own: one dense eigen-solve of a 2,000-node network takes
  // minutes, and on a shared thread every audit chunk would queue behind it.
  const summaryThreads = createWorkerPool(1);
  const log = (msg: string, err?: unknown) => console.error(`[hairline] ${msg}`, err instanceof Error ? err.message : (err ?? ''));
  // Audit sweeps: on worker threads by default, or as chunks on a Redis queue for `npm run worker` processes.
  let sweeps: JobPool;
  try {
    sweeps = config.jobs.mode === 'bullmq' ? await createBullmqPool(config.jobs, log) : createWorkerPool();
  } catch (err) {
    await summaryThreads.close();
    await db.destroy();
    throw err;
  }
  const summaries = new SummaryQueue(db, summaryThreads, log);
  // Versions stored before a stop still owe their summary.
  await summaries.resumePending();
  // Mail (issue 4): in fake mode a loopback SMTP server stores every message in the outbox.
  const fakeSmtp: FakeSmtp | null = config.mail.mode === 'fake' ? await startFakeSmtp(db, { port: config.mail.fakePort }) : null;
  const mailer = smtpMailer(config, fakeSmtp?.port);
  const runner = new AuditRunner(db, sweeps, mailNotifier(db, mailer, log), log);
  const app = createApp({ db, config, summaries, log, mailer, runner });
  // Sweeps cut short by a stop continue from their stored rows.
  await runner.resumeInterrupted();
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const host = config.host === '0.0.0.0' || config.host === '::' ? 'localhost' : config.host;
  return {
    url: `http://${host}:${port}`,
    db,
    server,
    smtpPort: fakeSmtp?.port,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections?.();
      runner.stop();
      summaries.stop();
      await sweeps.close();
      await summaryThreads.close();
      await runner.idle();
      await summaries.idle();
      await fakeSmtp?.close();
      await db.destroy();
    },
  };
}
