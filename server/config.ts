import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { jobsEnvShape, jobsSettingsFrom, type JobsSettings } from './jobs/settings';

/** Everything the server reads from the environment, checked once at start. */
const envSchema = z.object({
  HAIRLINE_PORT: z.coerce.number().int().min(0).max(65535).default(4321),
  HAIRLINE_HOST: z.string().min(1).default('127.0.0.1'),
  HAIRLINE_DATABASE: z.string().min(1).default('data/hairline.sqlite3'),
  HAIRLINE_SESSION_SECRET: z
    .string()
    .min(32, 'must be at least 32 characters; leave it unset to have one generated')
    .optional(),
  HAIRLINE_PUBLIC_URL: z.url('must be a full URL such as http://localhost:4321').optional(),
  HAIRLINE_MAIL: z.enum(['fake', 'smtp']).default('fake'),
  HAIRLINE_FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  HAIRLINE_SMTP_URL: z.string().regex(/^smtps?:\/\//, 'must start with smtp:// or smtps://').optional(),
  HAIRLINE_MAIL_FROM: z.string().min(3).default('Hairline <hairline@localhost>'),
  HAIRLINE_WEB_ROOT: z.string().min(1).default('dist'),
  HAIRLINE_SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(30),
  HAIRLINE_SESSION_MAX_HOURS: z.coerce.number().int().min(1).max(24 * 30).default(12),
  HAIRLINE_MAX_NODES: z.coerce.number().int().min(2).max(100_000).default(2000),
  HAIRLINE_MAX_EDGES: z.coerce.number().int().min(1).max(1_000_000).default(20_000),
  HAIRLINE_SIGN_IN_LIMIT: z.coerce.number().int().min(1).max(10_000).default(20),
  ...jobsEnvShape,
});

export interface Config {
  port: number;
  host: string;
  databaseFile: string;
  sessionSecret: string;
  publicUrl?: string;
  mail: { mode: 'fake'; fakePort: number; from: string } | { mode: 'smtp'; url: string; from: string };
  webRoot: string;
  /** Sessions end after this long without a request, and this long after sign-in at the latest. */
  session: { idleMs: number; absoluteMs: number };
  /** Sign-in, invitation and reset attempts allowed per client address per 15 minutes. */
  signInLimit: number;
  /** The largest network an import may hold. */
  importLimits: { maxNodes: number; maxEdges: number };
  /** Where audit sweeps run: the in-process pool (default) or BullMQ workers over Redis. */
  jobs: JobsSettings;
}

export class ConfigError extends Error {
  constructor(public readonly problems: string[]) {
    super(`Hairline cannot start; fix these settings:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

/**
 * Reads and validates the environment. A missing session secret is generated
 * once and kept beside the database so sessions survive restarts.
 */
export function loadConfig(env: Record<string, string | undefined> = process.env, cwd = process.cwd()): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    throw new ConfigError(
      parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`),
    );
  }
  const e = parsed.data;
  if (e.HAIRLINE_MAIL === 'smtp' && !e.HAIRLINE_SMTP_URL) {
    throw new ConfigError(['HAIRLINE_SMTP_URL: required when HAIRLINE_MAIL=smtp (e.g. smtp://relay.example:587)']);
  }
  const jobs = jobsSettingsFrom(e);
  if (jobs.problems.length) throw new ConfigError(jobs.problems);
  const databaseFile =
    e.HAIRLINE_DATABASE === ':memory:' ? ':memory:' : path.resolve(cwd, e.HAIRLINE_DATABASE);
  const sessionSecret = e.HAIRLINE_SESSION_SECRET ?? keptSecret(databaseFile, cwd);
  return {
    port: e.HAIRLINE_PORT,
    host: e.HAIRLINE_HOST,
    databaseFile,
    sessionSecret,
    publicUrl: e.HAIRLINE_PUBLIC_URL,
    mail:
      e.HAIRLINE_MAIL === 'smtp'
        ? { mode: 'smtp', url: e.HAIRLINE_SMTP_URL!, from: e.HAIRLINE_MAIL_FROM }
        : { mode: 'fake', fakePort: e.HAIRLINE_FAKE_SMTP_PORT, from: e.HAIRLINE_MAIL_FROM },
    webRoot: path.resolve(cwd, e.HAIRLINE_WEB_ROOT),
    session: { idleMs: e.HAIRLINE_SESSION_IDLE_MINUTES * 60_000, absoluteMs: e.HAIRLINE_SESSION_MAX_HOURS * 3_600_000 },
    signInLimit: e.HAIRLINE_SIGN_IN_LIMIT,
    importLimits: { maxNodes: e.HAIRLINE_MAX_NODES, maxEdges: e.HAIRLINE_MAX_EDGES },
    jobs: jobs.settings,
  };
}

function keptSecret(databaseFile: string, cwd: string): string {
  const dir = databaseFile === ':memory:' ? path.resolve(cwd, 'data') : path.dirname(databaseFile);
  const file = path.join(dir, 'session-secret');
  if (existsSync(file)) {
    const kept = readFileSync(file, 'utf8').trim();
    if (kept.length >= 32) return kept;
  }
  mkdirSync(dir, { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

/** For command-line entry points: the configuration, or the list of problems and exit code 2. */
export function loadConfigOrExit(env: Record<string, string | undefined> = process.env): Config {
  try {
    return loadConfig(env);
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(2);
    }
    throw err;
  }
}
