import path from 'node:path';
import Piscina from 'piscina';
import type { JobsStatus } from '../../lib/schemas/health';
import { runTask, type Task } from './tasks';

/** Names the run a task belongs to (e.g. `audit-7`), so its pending tasks can be dropped together. */
export interface JobTicket {
  group: string;
}

/**
 * Where heavy tasks run. Two kinds: worker threads inside this process
 * (`createWorkerPool`, the default; `createInlinePool` for tests and CLIs)
 * and a Redis queue served by worker processes (`createBullmqPool` in
 * bullmq-pool.ts). Callers see the same thing: a task in, its result out.
 */
export interface JobPool {
  run<T>(task: Task, ticket?: JobTicket): Promise<T>;
  /** Drops the group's tasks that no worker has started; their callers get a JobDiscardedError. */
  discard(group: string): Promise<void>;
  /** How many tasks one run is worth keeping in flight here. */
  readonly width: number;
  /**
   * Who computes the tasks: for the health answer and a running audit's page.
   * Never rejects: a count that cannot be had is reported as null.
   */
  status(): Promise<JobsStatus>;
  close(): Promise<void>;
}

/** The task was dropped by `discard` (a cancelled run) or by closing the pool before it finished. */
export class JobDiscardedError extends Error {
  constructor(message = 'the task was dropped before it finished') {
    super(message);
    this.name = 'JobDiscardedError';
  }
}

/**
 * The worker-thread pool for heavy numerical work. One thread per core but
 * one, so the event loop keeps a core for requests.
 */
export function createWorkerPool(threads = Math.max(1, require('node:os').availableParallelism() - 1)): JobPool {
  const pool = new Piscina({ filename: path.join(__dirname, 'worker-entry.js'), maxThreads: threads, minThreads: 0, idleTimeout: 30_000 });
  return {
    run: <T>(task: Task) => pool.run(task) as Promise<T>,
    // A chunk already handed to a thread finishes; the run stops asking for more.
    discard: async () => {},
    width: threads,
    status: async () => ({ mode: 'threads', workers: threads }),
    close: () => pool.destroy(),
  };
}

/** Runs tasks on the calling thread: for tests and one-shot CLIs. */
export function createInlinePool(): JobPool {
  return {
    // Yield to the event loop first, so requests (a cancel, a progress poll) interleave with the work.
    run: async <T>(task: Task) => {
      await new Promise((resolve) => setImmediate(resolve));
      return runTask(task) as T;
    },
    discard: async () => {},
    width: 1,
    status: async () => ({ mode: 'threads', workers: 1 }),
    close: async () => {},
  };
}
