import express, { type Express } from 'express';
import type { Knex } from 'knex';
import type { Config } from './config';
import { healthRouter } from './health/router';
import { apiNotFound, errorHandler } from './http/errors';
import { webRouter } from './web/static';

export interface AppDeps {
  db: Knex;
  config: Config;
  log?: (msg: string, err?: unknown) => void;
}

/** Builds the Express app without listening, so supertest can drive it. */
export function createApp({ db, config, log = defaultLog }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(healthRouter(db));
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
