import type { Knex } from 'knex';
import type { NetworkSummary } from '../../lib/spectral';
import type { JobPool } from '../jobs/pool';
import { findVersionById, pendingSummaryIds, storeSummary } from './repo';

/**
 * Computes version summaries on the worker pool, one at a time per version,
 * and stores the outcome. A summary that fails is stored as failed with the
 * reason, never left pending; pending ones are picked up again at start.
 */
export class SummaryQueue {
  private inFlight = new Map<number, Promise<void>>();
  /** Set on shutdown: a summary cut short stays pending and is computed at the next start. */
  private stopping = false;

  constructor(
    private readonly db: Knex,
    private readonly pool: JobPool,
    private readonly log: (msg: string, err?: unknown) => void = () => {},
  ) {}

  schedule(versionId: number): Promise<void> {
    const running = this.inFlight.get(versionId);
    if (running) return running;
    const job = this.compute(versionId).finally(() => this.inFlight.delete(versionId));
    this.inFlight.set(versionId, job);
    return job;
  }

  async resumePending(): Promise<number> {
    const ids = await pendingSummaryIds(this.db);
    for (const id of ids) void this.schedule(id);
    return ids.length;
  }

  stop(): void {
    this.stopping = true;
  }

  /** Resolves when every scheduled summary has been stored (tests, shutdown). */
  async idle(): Promise<void> {
    while (this.inFlight.size > 0) await Promise.allSettled([...this.inFlight.values()]);
  }

  private async compute(versionId: number): Promise<void> {
    const row = await findVersionById(this.db, versionId);
    if (!row) return;
    try {
      const network = JSON.parse(row.edges_json);
      const summary = await this.pool.run<NetworkSummary>({ kind: 'summary', network, convention: row.convention });
      await storeSummary(this.db, versionId, {
        state: 'ready',
        summaryJson: JSON.stringify(summary),
        lambda2Re: summary.lambda2.re,
      });
    } catch (err) {
      if (this.stopping) return;
      this.log(`summary of network version ${versionId} failed`, err);
      const reason = err instanceof Error ? err.message : String(err);
      await storeSummary(this.db, versionId, { state: 'failed', error: reason.slice(0, 500) }).catch(() => {});
    }
  }
}
