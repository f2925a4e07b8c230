import { Router } from 'express';
import type { Knex } from 'knex';
import type { JobsStatus } from '../../lib/schemas/health';
import { checkHealth } from './service';

export function healthRouter(db: Knex, jobsStatus: () => Promise<JobsStatus>): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const health = await checkHealth(db, jobsStatus);
    res.status(health.database.ok ? 200 : 503).json(health);
  });
  return router;
}
