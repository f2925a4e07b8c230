import { Job, Queue, QueueEvents } from 'bullmq';
import type { SpectralNetwork, SpectralOptions } from '../../lib/spectral';
import { JobDiscardedError, type JobPool, type JobTicket } from './pool';
import type { JobsSettings } from './settings';
import type { Task } from './tasks';
import { withTimeout } from './timeout';
import { INPUT_TTL_S, inputKey, jobIdFor, redactedUrl, redisOptions, serialiseInput, unpack, wireJobFor, type WireJob } from './bullmq-wire';

/** Tasks one run keeps queued at once: enough to feed many workers, few enough to cancel quickly. */
const WIDTH = 256;
/** A safety net under the completion events: pending jobs are also looked up this often. */
const RECHECK_MS = 5000;
/**
 * The worker count is asked of Redis (CLIENT LIST, which walks every
 * connection) at most this often, however many pages poll a queued audit.
 */
const WORKER_COUNT_TTL_MS = 2000;
/** A health check or an audit page waits no longer than this for the count; then it says "unknown". */
const WORKER_COUNT_WAIT_MS = 1000;

interface Waiter {
  resolve(value: unknown): void;
  reject(err: Error): void;
  group: string;
  label: string;
}

export interface BullmqPool extends JobPool {
  readonly queue: Queue<WireJob, string>;
}

/**
 * The server's side of bullmq mode: tasks become jobs on a Redis queue and
 * their results come back through BullMQ's completion events. Workers
 * (`npm run worker`) only compute; this process stays the only writer to the
 * database. Retries (bounded, with exponential backoff) and the recovery of
 * chunks whose worker died are BullMQ's own.
 */
export async function createBullmqPool(
  settings: JobsSettings,
  log: (msg: string, err?: unknown) => void = () => {},
  connectTimeoutMs = 5000,
): Promise<BullmqPool> {
  if (!settings.redisUrl) throw new Error('HAIRLINE_REDIS_URL is required in bullmq mode');
  const connection = redisOptions(settings.redisUrl);
  const queue = new Queue<WireJob, string>(settings.queue, {
    connection,
    defaultJobOptions: {
      attempts: settings.attempts,
      backoff: { type: 'exponential', delay: settings.backoffMs },
      // Results are removed once received; these only bound what a long stop leaves behind.
      removeOnComplete: { age: 24 * 3600 },
      removeOnFail: { age: 7 * 24 * 3600 },
    },
  });
  let closed = false;
  let lastError = '';
  const onError = (err: Error) => {
    if (err.message !== lastError) log('job queue: Redis connection problem', err);
    lastError = err.message;
  };
  queue.on('error', onError);
  const unreachable = (err: unknown) =>
    new Error(
      `cannot reach Redis at ${redactedUrl(settings.redisUrl!)} (HAIRLINE_REDIS_URL): ${err instanceof Error ? err.message : String(err)}. Start redis-server or fix the URL.`,
    );
  try {
    await withTimeout(queue.waitUntilReady(), connectTimeoutMs);
  } catch (err) {
    await queue.close().catch(() => {});
    throw unreachable(err);
  }
  // Only once Redis answers: a QueueEvents that never connected cannot be closed.
  const events = new QueueEvents(settings.queue, { connection });
  events.on('error', onError);
  try {
    await withTimeout(events.waitUntilReady(), connectTimeoutMs);
  } catch (err) {
    void events.close().catch(() => {});
    await queue.close().catch(() => {});
    throw unreachable(err);
  }

  /** The last count Redis gave (null: it did not), and the question still out, so only one is. */
  let counted: { at: number; workers: number | null } | null = null;
  let asking: Promise<number | null> | null = null;
  const askWorkerCount = (): Promise<number | null> => {
    asking ??= queue
      .getWorkers()
      // A Redis that refuses CLIENT LIST gets one placeholder entry from BullMQ, with no address: no count.
      .then((list) => (list.some((c) => !c.addr) ? null : list.length), () => null)
      .then((workers) => {
        counted = { at: Date.now(), workers };
        return workers;
      })
      .finally(() => (asking = null));
    return asking;
  };
  const workerCount = async (): Promise<number | null> => {
    if (closed) return null;
    if (counted && Date.now() - counted.at < WORKER_COUNT_TTL_MS) return counted.workers;
    return withTimeout(askWorkerCount(), WORKER_COUNT_WAIT_MS).catch(() => {
      // Redis is slow or away: say so for a while rather than make every caller wait again.
      counted = { at: Date.now(), workers: null };
      return null;
    });
  };

  const workers = await workerCount();
  if (workers === 0) log(`job queue ${settings.queue}: no worker is connected yet; audits wait until one is (npm run worker)`);

  const waiters = new Map<string, Waiter[]>();
  const groups = new Map<string, Set<string>>();
  /** Jobs dropped while a worker held them: removed when they finish. */
  const orphans = new Set<string>();
  const hashes = new WeakMap<SpectralNetwork, Map<SpectralOptions, string>>();
  /** When this process last stored each run input in Redis, and the write (callers wait for it). */
  const stored = new Map<string, { at: number; write: Promise<void> }>();

  const settle = (id: string, outcome: { value: string } | { error: Error }) => {
    const list = waiters.get(id);
    if (!list) return;
    waiters.delete(id);
    const group = list[0].group;
    groups.get(group)?.delete(id);
    if (groups.get(group)?.size === 0) groups.delete(group);
    // The result now lives with the caller, who writes it; Redis need not keep it.
    void queue.remove(id).catch(() => {});
    for (const w of list) {
      if ('error' in outcome) w.reject(outcome.error);
      else {
        try {
          w.resolve(unpack(outcome.value));
        } catch (err) {
          w.reject(new Error(`${w.label}: its result could not be read (${err instanceof Error ? err.message : String(err)})`));
        }
      }
    }
  };

  const failure = async (id: string, reason: string): Promise<Error> => {
    const label = waiters.get(id)?.[0].label ?? id;
    const job = await Job.fromId(queue, id).catch(() => undefined);
    const tries = job ? `after ${job.attemptsMade} attempt${job.attemptsMade === 1 ? '' : 's'}` : 'for good';
    return new Error(`${label} failed ${tries}: ${reason || 'no reason given'}`);
  };

  events.on('completed', ({ jobId, returnvalue }) => {
    if (orphans.delete(jobId)) void queue.remove(jobId).catch(() => {});
    settle(jobId, { value: String(returnvalue) });
  });
  events.on('failed', ({ jobId, failedReason }) => {
    if (orphans.delete(jobId)) void queue.remove(jobId).catch(() => {});
    if (!waiters.has(jobId)) return;
    void failure(jobId, failedReason).then((error) => settle(jobId, { error }));
  });

  /** Looks a job up directly: for a job that already existed when added, and for any missed event. */
  const check = async (id: string, justAdded: boolean) => {
    const job = await Job.fromId<WireJob, string>(queue, id);
    if (!job || !waiters.has(id)) return;
    if (job.finishedOn && job.failedReason) {
      // A failure left from before a restart is retried once more; a fresh one ends the wait.
      if (justAdded) await job.retry('failed');
      else settle(id, { error: await failure(id, job.failedReason) });
    } else if (job.finishedOn && job.returnvalue != null) {
      settle(id, { value: String(job.returnvalue) });
    }
  };
  const recheck = setInterval(() => {
    for (const id of waiters.keys()) void check(id, false).catch(() => {});
  }, RECHECK_MS);
  recheck.unref();

  const inputHashOf = (network: SpectralNetwork, options: SpectralOptions): string => {
    let byOptions = hashes.get(network);
    if (!byOptions) hashes.set(network, (byOptions = new Map()));
    let hash = byOptions.get(options);
    if (!hash) {
      hash = serialiseInput({ network, options }).hash;
      byOptions.set(options, hash);
    }
    return hash;
  };

  /** Puts a run's input in Redis, again when the copy there is half-way to expiring. */
  const storeInput = async (hash: string, network: SpectralNetwork, options: SpectralOptions) => {
    const last = stored.get(hash);
    if (last && Date.now() - last.at < (INPUT_TTL_S * 1000) / 2) return last.write;
    const write = (async () => {
      const client = await queue.client;
      await client.set(inputKey(settings.queue, hash), serialiseInput({ network, options }).bytes.toString('base64'), { EX: INPUT_TTL_S });
    })();
    stored.set(hash, { at: Date.now(), write });
    write.catch(() => stored.delete(hash));
    return write;
  };

  return {
    queue,
    width: WIDTH,

    async status() {
      return { mode: 'queue', workers: await workerCount() };
    },

    async run<T>(task: Task, ticket?: JobTicket): Promise<T> {
      if (closed) throw new JobDiscardedError('the job queue is closed');
      const group = ticket?.group ?? 'adhoc';
      const { network, options } = task as { network: SpectralNetwork; options: SpectralOptions };
      const wire = wireJobFor(task, () => inputHashOf(network, options));
      // Without a ticket, two equal tasks may share one job: they have one answer.
      const id = jobIdFor(group, wire);
      const label = wire.kind === 'audit-chunk' ? `the chunk of edges ${span(wire.edges)}` : wire.kind === 'audit-baseline' ? 'the baseline' : `task ${id}`;
      const result = new Promise<unknown>((resolve, reject) => {
        const list = waiters.get(id) ?? [];
        list.push({ resolve, reject, group, label });
        waiters.set(id, list);
      });
      if (!groups.has(group)) groups.set(group, new Set());
      groups.get(group)!.add(id);
      try {
        if ('input' in wire) await storeInput(wire.input, network, options);
        if (!waiters.has(id)) return result as Promise<T>; // dropped meanwhile
        await queue.add(wire.kind, wire, { jobId: id });
        if (!waiters.has(id)) {
          // Dropped while it was being added: take it back out.
          if ((await queue.remove(id).catch(() => 0)) !== 1) orphans.add(id);
          return result as Promise<T>;
        }
        await check(id, true);
      } catch (err) {
        settle(id, { error: err instanceof Error ? err : new Error(String(err)) });
      }
      return result as Promise<T>;
    },

    async discard(group: string): Promise<void> {
      const ids = [...(groups.get(group) ?? [])];
      groups.delete(group);
      for (const id of ids) {
        const list = waiters.get(id) ?? [];
        waiters.delete(id);
        for (const w of list) w.reject(new JobDiscardedError(`${w.label} was dropped: the run was cancelled or failed`));
        // Waiting or delayed jobs go at once; one a worker holds is removed when it finishes.
        const removed = await queue.remove(id).catch(() => 0);
        if (removed !== 1) orphans.add(id);
      }
    },

    async close(): Promise<void> {
      if (closed) return;
      closed = true;
      clearInterval(recheck);
      for (const [id, list] of waiters) {
        waiters.delete(id);
        for (const w of list) w.reject(new JobDiscardedError('the job queue closed'));
      }
      // Jobs stay in Redis: workers finish them, and a restarted server collects the results.
      await Promise.allSettled([events.close(), queue.close()]);
    },
  };
}

function span(edges: number[]): string {
  if (edges.length === 1) return String(edges[0]);
  return `${edges[0]}–${edges[edges.length - 1]}`;
}
