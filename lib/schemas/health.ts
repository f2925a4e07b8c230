import { z } from 'zod';

/**
 * Who computes audit sweeps. `threads`: worker threads inside the server, so
 * `workers` is the pool's width and a run always has somewhere to go. `queue`
 * (HAIRLINE_JOBS=bullmq): `npm run worker` processes connected to the Redis
 * queue right now; 0 means queued chunks wait until one connects, and null
 * means Redis did not say (down, slow, or refusing CLIENT LIST).
 */
export const jobsStatusSchema = z.object({
  mode: z.enum(['threads', 'queue']),
  workers: z.number().int().min(0).nullable(),
});
export type JobsStatus = z.infer<typeof jobsStatusSchema>;

/** GET /api/v1/health */
export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  version: z.string(),
  database: z.object({ ok: z.boolean(), message: z.string().optional() }),
  jobs: jobsStatusSchema,
});
export type Health = z.infer<typeof healthSchema>;
