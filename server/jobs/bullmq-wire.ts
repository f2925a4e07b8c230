import { createHash } from 'node:crypto';
import v8 from 'node:v8';
import type { RedisOptions } from 'bullmq';
import type { SpectralNetwork, SpectralOptions } from '../../lib/spectral';
import type { Task } from './tasks';

/**
 * What the server and the queue workers agree on: the shape of a queued job,
 * where a run's shared input lives in Redis, and how values travel.
 *
 * Values travel as Node's structured-clone serialisation (base64 in the job's
 * JSON), exactly what a worker thread receives from the in-process pool, so a
 * NaN, an Infinity or a -0 in a result arrives as it left. Server and workers
 * should run the same Node major version.
 */

/** A run's network and options, stored once in Redis rather than in every chunk. */
export interface RunInput {
  network: SpectralNetwork;
  options: SpectralOptions;
}

export type WireJob =
  | { kind: 'audit-baseline'; input: string }
  | { kind: 'audit-chunk'; input: string; edges: number[] }
  /** Any other task, carried whole. */
  | { kind: 'task'; payload: string };

export const pack = (value: unknown): string => v8.serialize(value).toString('base64');
export const unpack = <T>(text: string): T => v8.deserialize(Buffer.from(text, 'base64')) as T;

const sha256 = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');

/** BullMQ's own key prefix; a run's input sits beside its queue's keys. */
export const QUEUE_PREFIX = 'bull';
/** How long a run's input stays in Redis; the server stores it again when half of that has passed. */
export const INPUT_TTL_S = 7 * 24 * 3600;

export function inputKey(queue: string, hash: string): string {
  return `${QUEUE_PREFIX}:${queue}:input:${hash}`;
}

export function serialiseInput(input: RunInput): { hash: string; bytes: Buffer } {
  const bytes = v8.serialize({ network: input.network, options: input.options });
  return { hash: sha256(bytes), bytes };
}

/**
 * A job id that depends only on the run, the chunk's edges and the input's
 * content: enqueueing the same chunk again (after a restart) joins the job
 * already in Redis instead of adding a second one. BullMQ ids may not hold ':'.
 */
export function jobIdFor(group: string, job: WireJob): string {
  switch (job.kind) {
    case 'audit-baseline':
      return `${group}-base-${job.input.slice(0, 16)}`;
    case 'audit-chunk':
      return `${group}-e${job.edges[0]}-${sha256(`${job.input}/${job.edges.join(',')}`).slice(0, 16)}`;
    case 'task':
      return `${group}-t-${sha256(job.payload).slice(0, 16)}`;
  }
}

/** The wire form of a task; audit tasks name their run's input by hash. */
export function wireJobFor(task: Task, inputHash: () => string): WireJob {
  switch (task.kind) {
    case 'audit-baseline':
      return { kind: 'audit-baseline', input: inputHash() };
    case 'audit-chunk':
      return { kind: 'audit-chunk', input: inputHash(), edges: task.edgeIndices };
    default:
      return { kind: 'task', payload: pack(task) };
  }
}

/** ioredis options from a redis:// or rediss:// URL; BullMQ wants commands to wait out reconnects. */
export function redisOptions(url: string): RedisOptions {
  const u = new URL(url);
  const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0;
  return {
    host: u.hostname,
    port: u.port ? Number(u.port) : 6379,
    username: u.username ? decodeURIComponent(u.username) : undefined,
    password: u.password ? decodeURIComponent(u.password) : undefined,
    db: Number.isInteger(db) ? db : 0,
    tls: u.protocol === 'rediss:' ? {} : undefined,
    maxRetriesPerRequest: null,
  };
}

/** The URL without its password, for messages. */
export function redactedUrl(url: string): string {
  try {
    const u = new URL(url);
    if (u.password) u.password = '***';
    return u.toString();
  } catch {
    return '(unparseable URL)';
  }
}
