import { z } from 'zod';

/**
 * The environment keys of background work, shared by the server (through
 * server/config.ts) and by the queue worker entry point, which reads only
 * these. Two modes: `pool` (the default, worker threads inside the server,
 * nothing to install) and `bullmq` (audit chunks on a Redis queue, computed
 * by any number of `npm run worker` processes).
 */
export const jobsEnvShape = {
  HAIRLINE_JOBS: z.enum(['pool', 'bullmq'], { message: 'must be pool (the default) or bullmq' }).default('pool'),
  HAIRLINE_REDIS_URL: z
    .string()
    .regex(/^rediss?:\/\/[^\s]+$/, 'must be a Redis URL such as redis://127.0.0.1:6379 (rediss:// for TLS)')
    .optional(),
  HAIRLINE_QUEUE: z
    .string()
    .regex(/^[A-Za-z0-9_-]{1,64}$/, 'must be 1–64 letters, digits, - or _')
    .default('hairline-audits'),
  HAIRLINE_JOB_ATTEMPTS: z.coerce.number().int().min(1).max(20).default(3),
  HAIRLINE_JOB_BACKOFF_MS: z.coerce.number().int().min(0).max(600_000).default(2000),
  HAIRLINE_WORKER_THREADS: z.coerce.number().int().min(1).max(256).default(1),
  HAIRLINE_JOB_LOCK_MS: z.coerce.number().int().min(500).max(3_600_000).default(30_000),
  HAIRLINE_JOB_STALL_CHECK_MS: z.coerce.number().int().min(250).max(3_600_000).default(15_000),
  HAIRLINE_JOB_MAX_STALLS: z.coerce.number().int().min(0).max(100).default(2),
};

export interface JobsSettings {
  mode: 'pool' | 'bullmq';
  /** Required in bullmq mode. */
  redisUrl?: string;
  /** The BullMQ queue name; installs sharing one Redis each need their own. */
  queue: string;
  /** Tries per chunk before the run fails, and the first retry's delay (doubling after). */
  attempts: number;
  backoffMs: number;
  /** Per worker process: chunks computed at once, each on its own thread. */
  workerThreads: number;
  /** A worker's hold on a chunk lapses this long after it stops renewing it (a crash). */
  lockMs: number;
  /** How often workers look for lapsed holds and put those chunks back in line. */
  stallCheckMs: number;
  /** A chunk whose worker died more often than this fails instead of being retried again. */
  maxStalls: number;
}

type JobsEnv = z.infer<z.ZodObject<typeof jobsEnvShape>>;

/** Turns parsed keys into settings, or the list of problems that cross keys. */
export function jobsSettingsFrom(e: JobsEnv): { settings: JobsSettings; problems: string[] } {
  const problems: string[] = [];
  if (e.HAIRLINE_JOBS === 'bullmq' && !e.HAIRLINE_REDIS_URL) {
    problems.push('HAIRLINE_REDIS_URL: required when HAIRLINE_JOBS=bullmq (e.g. redis://127.0.0.1:6379)');
  }
  if (e.HAIRLINE_JOB_STALL_CHECK_MS > e.HAIRLINE_JOB_LOCK_MS) {
    problems.push('HAIRLINE_JOB_STALL_CHECK_MS: must not be longer than HAIRLINE_JOB_LOCK_MS');
  }
  return {
    problems,
    settings: {
      mode: e.HAIRLINE_JOBS,
      redisUrl: e.HAIRLINE_REDIS_URL,
      queue: e.HAIRLINE_QUEUE,
      attempts: e.HAIRLINE_JOB_ATTEMPTS,
      backoffMs: e.HAIRLINE_JOB_BACKOFF_MS,
      workerThreads: e.HAIRLINE_WORKER_THREADS,
      lockMs: e.HAIRLINE_JOB_LOCK_MS,
      stallCheckMs: e.HAIRLINE_JOB_STALL_CHECK_MS,
      maxStalls: e.HAIRLINE_JOB_MAX_STALLS,
    },
  };
}

/** For the worker entry point: these keys alone, each problem named. */
export function loadJobsSettings(env: Record<string, string | undefined>): { settings?: JobsSettings; problems: string[] } {
  const parsed = z.object(jobsEnvShape).safeParse(env);
  if (!parsed.success) return { problems: parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) };
  const { settings, problems } = jobsSettingsFrom(parsed.data);
  return problems.length ? { problems } : { settings, problems };
}
