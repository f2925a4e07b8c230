import os from 'node:os';
import v8 from 'node:v8';
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import type { SpectralBaseline } from '../../lib/spectral';
import { inputKey, pack, redactedUrl, redisOptions, unpack, type RunInput, type WireJob } from './bullmq-wire';
import { createWorkerPool, type JobPool } from './pool';
import { loadJobsSettings, type JobsSettings } from './settings';
import type { Task } from './tasks';
import { withTimeout } from './timeout';

/**
 * A queue worker for bullmq mode (`npm run worker`; run any number, on any
 * machine that reaches the Redis). It computes with the same task code as the
 * server's pool — on worker threads of its own, so the main thread stays free
 * to renew BullMQ's hold on the chunk it is computing — and hands results back
 * through the queue. It never opens the database.
 */

export interface QueueWorkerOptions {
  settings: JobsSettings;
  /** How a task is computed; by default on a worker-thread pool of `settings.workerThreads`. */
  compute?: (task: Task) => Promise<unknown>;
  /** Told `started <job id>` and `finished <job id>` per job. */
  onJob?: (line: string) => void;
  name?: string;
}

export interface QueueWorker {
  worker: Worker<WireJob, string>;
  /** Lets the jobs in hand finish, then disconnects. */
  close(): Promise<void>;
}

interface LoadedInput extends RunInput {
  baseline: Promise<SpectralBaseline> | null;
}

/** Runs kept decoded in memory: a worker usually serves one or two runs at a time. */
const CACHED_INPUTS = 4;

export async function startQueueWorker(opts: QueueWorkerOptions): Promise<QueueWorker> {
  const { settings } = opts;
  if (!settings.redisUrl) throw new Error('HAIRLINE_REDIS_URL: required for a queue worker (e.g. redis://127.0.0.1:6379)');
  let pool: JobPool | null = null;
  const compute =
    opts.compute ??
    ((task: Task) => {
      pool ??= createWorkerPool(settings.workerThreads);
      return pool.run(task);
    });

  const inputs = new Map<string, Promise<LoadedInput>>();
  let worker: Worker<WireJob, string>;

  const loadInput = (hash: string): Promise<LoadedInput> => {
    let entry = inputs.get(hash);
    if (entry) {
      inputs.delete(hash); // re-insert: most recently used last
      inputs.set(hash, entry);
      return entry;
    }
    entry = (async () => {
      const client = await worker.client;
      const text = await client.get(inputKey(settings.queue, hash));
      if (!text) throw new UnrecoverableError(`the run's network is no longer in Redis (key ${inputKey(settings.queue, hash)}); start the audit again`);
      const input = v8.deserialize(Buffer.from(text, 'base64')) as RunInput;
      return { ...input, baseline: null };
    })();
    entry.catch(() => inputs.delete(hash));
    inputs.set(hash, entry);
    while (inputs.size > CACHED_INPUTS) inputs.delete(inputs.keys().next().value!);
    return entry;
  };

  const baselineOf = (hash: string, input: LoadedInput): Promise<SpectralBaseline> => {
    // Each worker computes a run's baseline once: the same code on the same input gives the server's.
    input.baseline ??= compute({ kind: 'audit-baseline', network: input.network, options: input.options }) as Promise<SpectralBaseline>;
    input.baseline.catch(() => {
      input.baseline = null;
      inputs.delete(hash);
    });
    return input.baseline;
  };

  const processor = async (job: Job<WireJob, string>): Promise<string> => {
    opts.onJob?.(`started ${job.id}`);
    const wire = job.data;
    let result: unknown;
    if (wire.kind === 'task') {
      result = await compute(unpack<Task>(wire.payload));
    } else {
      const input = await loadInput(wire.input);
      const baseline = await baselineOf(wire.input, input);
      result =
        wire.kind === 'audit-baseline'
          ? baseline
          : await compute({ kind: 'audit-chunk', network: input.network, baseline, options: input.options, edgeIndices: wire.edges });
    }
    opts.onJob?.(`finished ${job.id}`);
    return pack(result);
  };

  worker = new Worker<WireJob, string>(settings.queue, processor, {
    connection: redisOptions(settings.redisUrl),
    concurrency: settings.workerThreads,
    lockDuration: settings.lockMs,
    stalledInterval: settings.stallCheckMs,
    maxStalledCount: settings.maxStalls,
    name: opts.name,
    autorun: false,
  });
  let lastError = '';
  worker.on('error', (err) => {
    if (err.message !== lastError) console.error(`[hairline worker] ${err.message}`);
    lastError = err.message;
  });
  try {
    await withTimeout(worker.waitUntilReady(), 10_000);
  } catch (err) {
    // A worker that never connected may not finish closing: do not wait long for it.
    await Promise.race([worker.close(true).catch(() => {}), new Promise((r) => setTimeout(r, 1000).unref())]);
    throw new Error(`cannot reach Redis at ${redactedUrl(settings.redisUrl)} (HAIRLINE_REDIS_URL): ${err instanceof Error ? err.message : String(err)}`);
  }
  void worker.run().catch((err) => console.error(`[hairline worker] stopped: ${err instanceof Error ? err.message : String(err)}`));
  return {
    worker,
    async close() {
      await worker.close();
      await (pool as JobPool | null)?.close();
    },
  };
}

async function main(): Promise<void> {
  const verbose = process.argv.includes('--verbose');
  const { settings, problems } = loadJobsSettings(process.env);
  if (!settings || !settings.redisUrl) {
    const all = settings ? ['HAIRLINE_REDIS_URL: required for a queue worker (e.g. redis://127.0.0.1:6379)'] : problems;
    console.error(`Hairline's worker cannot start; fix these settings:\n${all.map((p) => `  - ${p}`).join('\n')}`);
    process.exit(2);
  }
  const name = `${os.hostname()}:${process.pid}`;
  let running: QueueWorker;
  try {
    running = await startQueueWorker({ settings, name, onJob: verbose ? (line) => console.log(line) : undefined });
  } catch (err) {
    console.error(`Hairline's worker cannot start: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  }
  console.log(
    `hairline worker ${name} ready: queue ${settings.queue} on ${redactedUrl(settings.redisUrl)}, ${settings.workerThreads} thread${settings.workerThreads === 1 ? '' : 's'}`,
  );
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) process.exit(1); // a second signal: leave now; the chunk in hand is retried elsewhere
    stopping = true;
    console.log(`hairline worker ${name}: ${signal}, finishing the chunk in hand`);
    // Without Redis the goodbye cannot be said: give up after a while; BullMQ retries the chunk elsewhere.
    setTimeout(() => process.exit(1), settings.lockMs + 10_000).unref();
    void running.close().then(() => process.exit(0), () => process.exit(1));
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

if (require.main === module) void main();
