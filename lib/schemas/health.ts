import { z } from 'zod';

/** GET /api/v1/health */
export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  version: z.string(),
  database: z.object({ ok: z.boolean(), message: z.string().optional() }),
});
export type Health = z.infer<typeof healthSchema>;
