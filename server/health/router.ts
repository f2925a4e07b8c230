import { Router } from 'express';
import type { Knex } from 'knex';
import { checkHealth } from './service';

export function healthRouter(db: Knex): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const health = await checkHealth(db);
    res.status(health.database.ok ? 200 : 503).json(health);
  });
  return router;
}
