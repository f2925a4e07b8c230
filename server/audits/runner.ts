import type { Knex } from 'knex';
import { toEdgeRowFields } from '../../lib/audit/edge-row';
import type { JobsStatus } from '../../lib/schemas/health';
import type { EdgeResult, SpectralBaseline, SpectralNetwork, SpectralOptions } from '../../lib/spectral';
import { JobDiscardedError, type JobPool } from '../jobs/pool';
import { recordEvent } from '../trail/service';
import type { AuditNotifier } from './notify';
import * as repo from './repo';

/** Edges per pool task: small enough that cancelling and progress stay prompt. */
function chunkSize(nodes: number): number {
  if (nodes <= 30) return 16;
  if (nodes <= 80) return 4;
  if (nodes <= 120) return 1;
  // Large networks: the fast path needs ~2 ms an edge, while every chunk clones a baseline of ~2N²
  // numbers to its worker, so one-edge chunks would spend most of the run copying.
  return 16;
}

/**
 * Runs audit sweeps: the baseline once, then the edges in chunks on the
 * job pool (worker threads here, or queue workers in bullmq mode), each
 * chunk's rows stored with the progress count in one transaction. A run
 * interrupted by a stop resumes from the stored rows.
 */
export class AuditRunner {
  private running = new Map<number, Promise<void>>();
  private cancelled = new Set<number>();
  /** Set while the server shuts down: interrupted sweeps stay 'sweeping' and resume at the next start. */
  private stopping = false;

  constructor(
    private readonly db: Knex,
    private readonly pool: JobPool,
    private readonly notify: AuditNotifier,
    private readonly log: (msg: string, err?: unknown) => void,
    private readonly now: () => number = Date.now,
    /** Chunks kept in flight; by default as many as the pool is worth feeding. */
    private readonly parallel = pool.width,
  ) {}

  start(auditId: number): Promise<void> {
    const existing = this.running.get(auditId);
    if (existing) return existing;
    const job = this.run(auditId).finally(() => {
      this.running.delete(auditId);
      this.cancelled.delete(auditId);
    });
    this.running.set(auditId, job);
    return job;
  }

  /** Before the pool is destroyed on shutdown. */
  stop(): void {
    this.stopping = true;
  }

  /** Asks a running sweep to stop after its current chunk. */
  cancel(auditId: number): void {
    if (!this.running.has(auditId)) return;
    this.cancelled.add(auditId);
    // Chunks still queued are dropped; one already being computed finishes unread.
    void this.pool.discard(groupOf(auditId)).catch((err) => this.log(`audit ${auditId}: dropping its queued chunks failed`, err));
  }

  /** Resolves when this audit's sweep (if any) has stopped. */
  async settled(auditId: number): Promise<void> {
    await this.running.get(auditId)?.catch(() => {});
  }

  isRunning(auditId: number): boolean {
    return this.running.has(auditId);
  }

  /** At start-up: audits left queued or sweeping by a stop are resumed. */
  async resumeInterrupted(): Promise<number[]> {
    const ids = await repo.auditsInStates(this.db, ['queued', 'sweeping']);
    for (const id of ids) {
      await recordEvent(this.db, { actorId: null, action: 'audit.resumed', subjectType: 'audit', subjectId: id, reason: 'the server stopped during the sweep' }, this.now());
      void this.start(id);
    }
    return ids;
  }

  /** Who computes the sweeps: the health answer and a running audit's page report it. */
  jobsStatus(): Promise<JobsStatus> {
    return this.pool.status();
  }

  async idle(): Promise<void> {
    while (this.running.size > 0) await Promise.allSettled([...this.running.values()]);
  }

  private async run(auditId: number): Promise<void> {
    const audit = await repo.findAudit(this.db, auditId);
    if (!audit) return;
    try {
      const version = await this.db('network_versions').where({ id: audit.network_version_id }).first('edges_json');
      if (!version) throw new Error('the network version is gone');
      const network: SpectralNetwork = JSON.parse(version.edges_json);
      const settings = JSON.parse(audit.settings_json);
      const options: SpectralOptions = { convention: audit.convention, ladder: settings.ladder, signs: settings.signs, tolerance: settings.tolerance };
      const done = await repo.doneEdgeIndices(this.db, auditId);
      await repo.updateAudit(this.db, auditId, { state: 'sweeping', segment_started_ms: this.now(), segment_done_at_start: done.size, reason: null });

      const ticket = { group: groupOf(auditId) };
      let baseline: SpectralBaseline;
      try {
        baseline = await this.pool.run<SpectralBaseline>({ kind: 'audit-baseline', network, options }, ticket);
      } catch (err) {
        if (err instanceof JobDiscardedError && this.cancelled.has(auditId)) {
          await this.finish(auditId, 'cancelled', 'cancelled by the analyst before the sweep finished');
          return;
        }
        throw err;
      }
      if (!audit.baseline_json) {
        await repo.updateAudit(this.db, auditId, {
          baseline_json: JSON.stringify({ lambda2: baseline.lambda2, cluster: { size: baseline.cluster.size, spread: baseline.cluster.spread }, spectrum: baseline.spectrum, rooted: baseline.rooted, cutOff: baseline.cutOff }),
          lambda2_re: baseline.lambda2.re,
          lambda2_im: baseline.lambda2.im,
        });
      }

      // Chunk boundaries depend on the edge index alone, so a resumed run asks for the same chunks again.
      const size = chunkSize(network.nodes.length);
      const chunks: number[][] = [];
      for (let i = 0; i < network.edges.length; i++) {
        if (done.has(i)) continue;
        const last = chunks[chunks.length - 1];
        if (last && Math.floor(last[0] / size) === Math.floor(i / size)) last.push(i);
        else chunks.push([i]);
      }

      // Keep `parallel` chunks in flight; rows are written as each returns.
      let next = 0;
      let failure: unknown = null;
      const halted = () => failure !== null || this.cancelled.has(auditId) || this.stopping;
      const worker = async () => {
        while (next < chunks.length && !halted()) {
          const chunk = chunks[next++];
          let results: EdgeResult[];
          try {
            results = await this.pool.run<EdgeResult[]>({ kind: 'audit-chunk', network, baseline, options, edgeIndices: chunk }, ticket);
          } catch (err) {
            if (halted()) return;
            // The first failure ends the run; the chunks still queued are dropped.
            failure = err;
            await this.pool.discard(ticket.group).catch(() => {});
            return;
          }
          if (halted()) return;
          if (results.length !== chunk.length || results.some((r, k) => r.index !== chunk[k])) {
            failure = new Error(`the results for the chunk from edge ${chunk[0]} do not match the edges asked for`);
            await this.pool.discard(ticket.group).catch(() => {});
            return;
          }
          await repo.storeChunk(this.db, auditId, results.map(toEdgeRowFields));
        }
      };
      await Promise.all(Array.from({ length: Math.max(1, Math.min(this.parallel, chunks.length)) }, worker));
      if (failure !== null && !this.stopping && !this.cancelled.has(auditId)) throw failure;

      if (this.stopping) return;
      if (this.cancelled.has(auditId)) {
        await this.finish(auditId, 'cancelled', 'cancelled by the analyst before the sweep finished');
        return;
      }
      await this.finish(auditId, 'in-review', null);
      await this.notify.toRole('auditor', `Hairline: audit ${auditId} is ready for review`, `The sweep of ${audit.network_name} version ${audit.version} has finished. Open audit ${auditId} in Hairline to review its flagged edges.`);
    } catch (err) {
      if (this.stopping) return;
      this.log(`audit ${auditId} failed`, err);
      const reason = `the sweep stopped with an error: ${err instanceof Error ? err.message : String(err)}`.slice(0, 500);
      await this.finish(auditId, 'failed', reason).catch(() => {});
    }
  }

  private async finish(auditId: number, state: 'in-review' | 'failed' | 'cancelled', reason: string | null): Promise<void> {
    const at = new Date(this.now()).toISOString();
    await this.db.transaction(async (trx) => {
      await repo.updateAudit(trx, auditId, { state, reason, finished_at: at });
      await recordEvent(trx, { actorId: null, action: `audit.${state === 'in-review' ? 'sweep-finished' : state}`, subjectType: 'audit', subjectId: auditId, oldValue: 'sweeping', newValue: state, reason }, this.now());
    });
  }
}

/** The job-pool group of an audit's tasks, so its queued chunks can be dropped together. */
function groupOf(auditId: number): string {
  return `audit-${auditId}`;
}
