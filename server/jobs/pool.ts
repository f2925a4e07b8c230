import path from 'node:path';
import Piscina from 'piscina';
import { runTask, type Task } from './tasks';

export interface JobPool {
  run<T>(task: Task): Promise<T>;
  close(): Promise<void>;
}

/**
 * The worker-thread pool for heavy numerical work. One thread per core but
 * one, so the event loop keeps a core for requests.
 */
export function createWorkerPool(threads = Math.max(1, require('node:os').availableParallelism() - 1)): JobPool {
  const pool = new Piscina({ filename: path.join(__dirname, 'worker-entry.js'), maxThreads: threads, minThreads: 0, idleTimeout: 30_000 });
  return {
    run: <T>(task: Task) => pool.run(task) as Promise<T>,
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
    close: async () => {},
  };
}
