import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { Knex } from 'knex';
import { createApp } from '../../../server/app';
import { AuditRunner } from '../../../server/audits/runner';
import { silentNotifier } from '../../../server/audits/notify';
import { loadConfig } from '../../../server/config';
import { createWorkerPool, type JobPool } from '../../../server/jobs/pool';
import type { JobsSettings } from '../../../server/jobs/settings';
import { browser, demo } from '../support/accounts';
import { freshDatabase } from '../support/test-db';

export const repoRoot = path.resolve(__dirname, '../../..');

/**
 * A throw-away redis-server on a free loopback port, with nothing written to
 * disk. A machine without redis-server fails the test that asked, with the
 * way to install it; nothing is skipped.
 */
export interface LocalRedis {
  url: string;
  port: number;
  /** Freezes the server (SIGSTOP): connections stay open and every command waits, as with a Redis that hangs. */
  freeze(): void;
  /** Lets a frozen server go on (SIGCONT). */
  thaw(): void;
  stop(): Promise<void>;
}

function redisBinary(): string {
  const named = process.env.HAIRLINE_REDIS_SERVER;
  if (named) return named;
  for (const dir of (process.env.PATH ?? '').split(path.delimiter).concat(['/usr/bin', '/usr/sbin', '/usr/local/bin'])) {
    const candidate = path.join(dir, 'redis-server');
    if (dir && existsSync(candidate)) return candidate;
  }
  throw new Error(
    "redis-server is not installed, and the BullMQ tests need it. Install Debian's package (`sudo apt-get install redis-server`; `npm test` does this itself when run as root) or set HAIRLINE_REDIS_SERVER to a redis-server binary.",
  );
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

/** `extraArgs` go to redis-server as they are, e.g. to switch a command off as some hosted Redis services do. */
export async function startRedis(extraArgs: string[] = []): Promise<LocalRedis> {
  const bin = redisBinary();
  let lastOutput = '';
  for (let attempt = 0; attempt < 3; attempt++) {
    const port = await freePort();
    const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-redis-'));
    const child = spawn(bin, ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--dir', dir, ...extraArgs], { stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    const ready = await new Promise<boolean>((resolve) => {
      const timer = setTimeout(() => resolve(false), 15_000);
      const onData = (d: Buffer) => {
        output += d.toString();
        if (/Ready to accept connections/.test(output)) {
          clearTimeout(timer);
          resolve(true);
        }
      };
      child.stdout!.on('data', onData);
      child.stderr!.on('data', onData);
      child.once('exit', () => {
        clearTimeout(timer);
        resolve(false);
      });
      child.once('error', (err) => {
        output += String(err);
        clearTimeout(timer);
        resolve(false);
      });
    });
    if (ready) {
      return {
        url: `redis://127.0.0.1:${port}`,
        port,
        freeze: () => child.kill('SIGSTOP'),
        thaw: () => child.kill('SIGCONT'),
        stop: () => {
          if (child.exitCode === null && child.signalCode === null) child.kill('SIGCONT'); // a frozen server cannot act on SIGTERM
          return stopChild(child);
        },
      };
    }
    lastOutput = output;
    await stopChild(child);
  }
  throw new Error(`redis-server (${bin}) did not start on a loopback port; its last output:\n${lastOutput}`);
}

/** Ends a child this test started, by its own pid, and waits for it to go. */
export function stopChild(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill(signal);
  });
}

/**
 * The frame of a suite that runs queue workers inside the test process: one
 * redis-server for the suite and one compute thread; after each test, held
 * computations are let go first (a worker closing waits for its chunk), then
 * whatever the test opened is closed, newest first.
 */
export function inProcessQueueSuite() {
  const suite = {
    /** Set before the first test runs. */
    redis: undefined as unknown as LocalRedis,
    threads: createWorkerPool(1),
    cleanup: [] as Array<() => Promise<unknown>>,
    releases: [] as Array<() => void>,
  };
  beforeAll(async () => {
    suite.redis = await startRedis();
  }, 30_000);
  afterEach(async () => {
    while (suite.releases.length) suite.releases.pop()!();
    while (suite.cleanup.length) await suite.cleanup.pop()!().catch(() => {});
  }, 30_000);
  afterAll(async () => {
    await suite.threads.close();
    await suite.redis?.stop();
  }, 30_000);
  return suite;
}

/** Settings for a test's queue: short holds, so a killed worker's chunk is noticed within seconds. */
export function testJobSettings(url: string, queue: string, overrides: Partial<JobsSettings> = {}): JobsSettings {
  return { mode: 'bullmq', redisUrl: url, queue, attempts: 3, backoffMs: 200, workerThreads: 1, lockMs: 2000, stallCheckMs: 1000, maxStalls: 3, ...overrides };
}

/** A queue worker process (`npm run worker` without the npm and tsx wrappers), its output kept line by line. */
export interface WorkerProcess {
  child: ChildProcess;
  lines: string[];
  /** Resolves with the first line from index `from` on that matches. */
  waitForLine(pattern: RegExp, from?: number, timeoutMs?: number): Promise<{ line: string; index: number }>;
}

export function spawnWorker(settings: JobsSettings): WorkerProcess {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    HAIRLINE_REDIS_URL: settings.redisUrl!,
    HAIRLINE_QUEUE: settings.queue,
    HAIRLINE_WORKER_THREADS: String(settings.workerThreads),
    HAIRLINE_JOB_LOCK_MS: String(settings.lockMs),
    HAIRLINE_JOB_STALL_CHECK_MS: String(settings.stallCheckMs),
    HAIRLINE_JOB_MAX_STALLS: String(settings.maxStalls),
  };
  // `node --import tsx`, not the tsx command: that one runs the worker in a child process of its own,
  // which a SIGKILL of the command would leave running.
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/jobs/bullmq-worker.ts', '--verbose'], { cwd: repoRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
  const lines: string[] = [];
  const listeners = new Set<() => void>();
  let partial = '';
  const take = (d: Buffer) => {
    partial += d.toString();
    const parts = partial.split('\n');
    partial = parts.pop()!;
    lines.push(...parts);
    for (const l of listeners) l();
  };
  child.stdout!.on('data', take);
  child.stderr!.on('data', take);
  child.once('exit', () => {
    for (const l of listeners) l();
  });
  return {
    child,
    lines,
    waitForLine(pattern, from = 0, timeoutMs = 60_000) {
      return new Promise((resolve, reject) => {
        const look = () => {
          for (let i = from; i < lines.length; i++) {
            if (pattern.test(lines[i])) {
              done();
              resolve({ line: lines[i], index: i });
              return;
            }
          }
          if (child.exitCode !== null || child.signalCode !== null) {
            done();
            reject(new Error(`the worker exited before printing ${pattern}; its output:\n${lines.join('\n')}`));
          }
        };
        const timer = setTimeout(() => {
          done();
          reject(new Error(`no line matching ${pattern} from the worker within ${timeoutMs / 1000} s; its output:\n${lines.join('\n')}`));
        }, timeoutMs);
        const done = () => {
          clearTimeout(timer);
          listeners.delete(look);
        };
        listeners.add(look);
        look();
      });
    },
  };
}

/** The app over a seeded database with audits run by `runner` on the given job pool. */
export async function queueWorld(pool: JobPool, parallel?: number) {
  const db: Knex = await freshDatabase({ seed: true });
  const web = mkdtempSync(path.join(os.tmpdir(), 'hairline-web-'));
  writeFileSync(path.join(web, '+not-found.html'), '<p>no such page</p>');
  const config = loadConfig({ HAIRLINE_DATABASE: ':memory:', HAIRLINE_WEB_ROOT: web, HAIRLINE_SESSION_SECRET: 'x'.repeat(40), HAIRLINE_SIGN_IN_LIMIT: '1000' }, os.tmpdir());
  const logged: string[] = [];
  const log = (m: string, e?: unknown) => logged.push(`${m} ${e instanceof Error ? e.message : String(e ?? '')}`);
  const runner = new AuditRunner(db, pool, silentNotifier, log, Date.now, parallel);
  const app = createApp({ db, config, runner, log });
  const analyst = async () => {
    const agent = browser(app);
    const res = await agent.post('/api/v1/auth/sign-in').send({ email: demo.analyst.email, password: demo.analyst.password });
    if (res.status !== 200) throw new Error(`sign-in answered ${res.status}`);
    return agent;
  };
  return { db, app, runner, logged, analyst };
}

/** A ring with chords: `nodes` nodes, two edges each. */
export function ringCsv(nodes: number, chord = 7): string {
  const rows = ['source,target,weight'];
  for (let i = 0; i < nodes; i++) rows.push(`r${i},r${(i + 1) % nodes},1`, `r${i},r${(i + chord) % nodes},0.5`);
  return rows.join('\n');
}

/** Imports a ring of `nodes` (see ringCsv) as the analyst and starts a one-sign audit of it; the start's answer. */
export async function startRingAudit(
  analyst: Awaited<ReturnType<Awaited<ReturnType<typeof queueWorld>>['analyst']>>,
  opts: { name: string; nodes: number; ladderTo?: number },
) {
  const imported = await analyst.post('/api/v1/networks/import').send({ name: opts.name, format: 'csv', text: ringCsv(opts.nodes) });
  if (imported.status !== 201) throw new Error(`import of ${opts.name} answered ${imported.status}`);
  const started = await analyst
    .post('/api/v1/audits')
    .send({ networkId: imported.body.networkId, version: 1, settings: { ladder: { from: 2, to: opts.ladderTo ?? 4, step: 1 }, signs: ['plus'] } });
  if (started.status !== 201) throw new Error(`start of an audit of ${opts.name} answered ${started.status}`);
  return started;
}

/** Every stored column of an audit's edges but the audit id, in edge order. */
export async function storedEdges(db: Knex, auditId: number) {
  const rows = await db('audit_edges').where({ audit_id: auditId }).orderBy('edge_index');
  return rows.map(({ audit_id: _drop, ...rest }) => rest);
}

/** Polls `check` until it holds; fails with `what` when it has not within `timeoutMs`. */
export async function until(check: () => Promise<boolean>, what: string, timeoutMs = 60_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
