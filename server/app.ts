import express, { type Express } from 'express';
import type { Knex } from 'knex';
import { DEFAULT_LIMITS } from '../lib/formats';
import type { Config } from './config';
import { healthRouter } from './health/router';
import { apiNotFound, errorHandler } from './http/errors';
import { createInlinePool } from './jobs/pool';
import { MAX_UPLOAD_BYTES, networksRouter } from './networks/router';
import { SummaryQueue } from './networks/summaries';
import { webRouter } from './web/static';

export interface AppDeps {
  db: Knex;
  config: Config;
  log?: (msg: string, err?: unknown) => void;
  /** Background spectrum summaries; tests get one that computes on the calling thread. */
  summaries?: SummaryQueue;
}

/** Builds the Express app without listening, so supertest can drive it. */
export function createApp({ db, config, log = defaultLog, summaries }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  const api = express.Router();
  // A pasted edge list may be large; every other body stays small.
  api.use('/networks/import', express.json({ limit: MAX_UPLOAD_BYTES }));
  api.use(express.json({ limit: '1mb' }));
  api.use(healthRouter(db));
  api.use(
    networksRouter({
      db,
      summaries: summaries ?? new SummaryQueue(db, createInlinePool(), log),
      limits: { maxNodes: DEFAULT_LIMITS.maxNodes, maxEdges: DEFAULT_LIMITS.maxEdges },
    }),
  );
  api.use(apiNotFound);
  app.use('/api/v1', api);
  app.use('/api', apiNotFound);

  app.use(webRouter(config.webRoot));
  app.use(errorHandler(log));
  return app;
}

function defaultLog(msg: string, err?: unknown): void {
  console.error(`[hairline] ${msg}`, err instanceof Error ? err.stack : (err ?? ''));
}
