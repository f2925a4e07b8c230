import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ConfigError, loadConfig } from '../../server/config';

const tmp = () => mkdtempSync(path.join(os.tmpdir(), 'hairline-jobs-config-'));
const problemsOf = (env: Record<string, string>): string => {
  try {
    loadConfig(env, tmp());
  } catch (e) {
    if (e instanceof ConfigError) return e.problems.join('\n');
    throw e;
  }
  throw new Error('expected a ConfigError');
};

describe('background work settings', () => {
  test('the default is the in-process pool, with nothing to install', () => {
    const c = loadConfig({}, tmp());
    expect(c.jobs).toMatchObject({ mode: 'pool', queue: 'hairline-audits', attempts: 3, workerThreads: 1 });
    expect(c.jobs.redisUrl).toBeUndefined();
  });

  test('bullmq mode takes a Redis URL and the retry and lock settings', () => {
    const c = loadConfig(
      { HAIRLINE_JOBS: 'bullmq', HAIRLINE_REDIS_URL: 'redis://127.0.0.1:6379/2', HAIRLINE_QUEUE: 'tuning-lab', HAIRLINE_JOB_ATTEMPTS: '5', HAIRLINE_JOB_LOCK_MS: '60000' },
      tmp(),
    );
    expect(c.jobs).toMatchObject({ mode: 'bullmq', redisUrl: 'redis://127.0.0.1:6379/2', queue: 'tuning-lab', attempts: 5, lockMs: 60_000 });
  });

  test('bullmq mode without a Redis URL is refused, naming the key and an example', () => {
    expect(problemsOf({ HAIRLINE_JOBS: 'bullmq' })).toMatch(/HAIRLINE_REDIS_URL: required when HAIRLINE_JOBS=bullmq \(e\.g\. redis:\/\//);
  });

  test('bad values are refused with messages naming each key', () => {
    const problems = problemsOf({ HAIRLINE_JOBS: 'kafka', HAIRLINE_REDIS_URL: 'http://cache:6379', HAIRLINE_QUEUE: 'has:colon', HAIRLINE_JOB_ATTEMPTS: '0' });
    expect(problems).toMatch(/HAIRLINE_JOBS: must be pool \(the default\) or bullmq/);
    expect(problems).toMatch(/HAIRLINE_REDIS_URL: must be a Redis URL/);
    expect(problems).toMatch(/HAIRLINE_QUEUE: must be 1–64 letters/);
    expect(problems).toMatch(/HAIRLINE_JOB_ATTEMPTS/);
    expect(problemsOf({ HAIRLINE_JOB_LOCK_MS: '1000', HAIRLINE_JOB_STALL_CHECK_MS: '5000' })).toMatch(/HAIRLINE_JOB_STALL_CHECK_MS: must not be longer than HAIRLINE_JOB_LOCK_MS/);
  });

  test('the worker entry point refuses to start without a Redis URL and exits 2', () => {
    const root = path.resolve(__dirname, '../..');
    const env: NodeJS.ProcessEnv = { ...process.env };
    delete env.HAIRLINE_REDIS_URL;
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'server/jobs/bullmq-worker.ts'], { cwd: root, env, encoding: 'utf8', timeout: 60_000 });
    expect(run.stderr).toMatch(/worker cannot start[\s\S]*HAIRLINE_REDIS_URL: required for a queue worker/);
    expect(run.status).toBe(2);
  }, 60_000);
});
