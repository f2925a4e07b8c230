import express, { type Express } from 'express';
import type { Knex } from 'knex';
import { mountAccountRoutes, mountIdentity } from './auth/mount';
import type { Config } from './config';
import { healthRouter } from './health/router';
import { apiNotFound, errorHandler } from './http/errors';
import { securityHeaders } from './http/security-headers';
import { noMailer, smtpMailer, type Mailer } from './mail/mailer';
import { createInlinePool } from './jobs/pool';
import { MAX_UPLOAD_BYTES, networksRouter } from './networks/router';
import { SummaryQueue } from './networks/summaries';
import { auditsRouter } from './audits/router';
import { AuditRunner } from './audits/runner';
import { mailNotifier } from './audits/notify';
import { webRouter } from './web/static';

export interface AppDeps {
  db: Knex;
  config: Config;
  log?: (msg: string, err?: unknown) => void;
  /** Outgoing mail; startServer passes one bound to the running mail fake or relay. */
  mailer?: Mailer;
  /** The clock for sessions, links and back-off (tests move it). */
  now?: () => number;
  /** Background spectrum summaries; tests get one that computes on the calling thread. */
  summaries?: SummaryQueue;
  /** Audit sweeps; tests get one that computes on the calling thread. */
  runner?: AuditRunner;
}

/** Builds the Express app without listening, so supertest can drive it. */
export function createApp({ db, config, log = defaultLog, summaries, mailer, now = Date.now, runner }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(securityHeaders());

  const api = express.Router();
  // Answers hold account data and engineering records: no browser or proxy may keep a copy.
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  // A pasted edge list may be large; every other body stays small.
  api.use('/networks/import', express.json({ limit: MAX_UPLOAD_BYTES }));
  api.use(express.json({ limit: '1mb' }));
  // ── Accounts (issue 4): Origin check, session cookie and API tokens set req.user
  //    for every route below; then /auth, /users, /tokens and /outbox.
  const accounts = { db, config, now, mailer: mailer ?? (config.mail.mode === 'smtp' ? smtpMailer(config) : noMailer) };
  mountIdentity(api, accounts);
  mountAccountRoutes(api, accounts);
  // ── end accounts
  const notify = mailNotifier(db, accounts.mailer, log);
  const sweeps = runner ?? new AuditRunner(db, createInlinePool(), notify, log, now);
  api.use(healthRouter(db, () => sweeps.jobsStatus()));
  api.use(
    networksRouter({
      db,
      summaries: summaries ?? new SummaryQueue(db, createInlinePool(), log),
      limits: config.importLimits,
    }),
  );
  api.use(auditsRouter({ db, notify, now, runner: sweeps }));
  api.use(apiNotFound);
  app.use('/api/v1', api);
  app.use('/api', apiNotFound);

  app.use(webRouter(config.webRoot));
  app.use(errorHandler(log));
  return app;
}

function defaultLog(msg: string, err?: unknown): void {
  // Name and message only: stack traces stay out of the logs as well as the responses.
  console.error(`[hairline] ${msg}`, err instanceof Error ? `${err.name}: ${err.message}` : (err ?? ''));
}
