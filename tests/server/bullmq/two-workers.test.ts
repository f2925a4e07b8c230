import { QueueEvents } from 'bullmq';
import * as repo from '../../../server/audits/repo';
import { AuditRunner } from '../../../server/audits/runner';
import { silentNotifier } from '../../../server/audits/notify';
import { createBullmqPool, type BullmqPool } from '../../../server/jobs/bullmq-pool';
import { redisOptions } from '../../../server/jobs/bullmq-wire';
import { createWorkerPool, type JobPool } from '../../../server/jobs/pool';
import { waitForSweep } from '../support/audits';
import { queueWorld, startRingAudit, spawnWorker, startRedis, stopChild, storedEdges, testJobSettings, until, type LocalRedis, type WorkerProcess } from './support';

/**
 * The acceptance run of bullmq mode: one audit on two `npm run worker`
 * processes, one of them SIGKILLed mid-run while it holds a chunk. BullMQ
 * must hand that chunk to the other worker, and the stored results must
 * equal those of the default in-process pool on the same network.
 */
describe('bullmq mode with two worker processes', () => {
  let redis: LocalRedis | undefined;
  let pool: BullmqPool | undefined;
  let events: QueueEvents | undefined;
  let world: Awaited<ReturnType<typeof queueWorld>> | undefined;
  const workers: WorkerProcess[] = [];
  let openGate = () => {};

  beforeAll(async () => {
    redis = await startRedis();
  }, 30_000);

  afterAll(async () => {
    openGate();
    for (const w of workers) await stopChild(w.child);
    await events?.close();
    world?.runner.stop();
    await pool?.close();
    await world?.runner.idle();
    await world?.db.destroy();
    await redis?.stop();
  }, 30_000);

  test('a worker killed mid-chunk leaves the chunk to the other, and the results equal the in-process pool', async () => {
    const settings = testJobSettings(redis!.url, 'two-workers');
    pool = await createBullmqPool(settings);
    // The server side as it runs, but able to hold back new chunks mid-run, so the run cannot
    // end before the second worker is up, however fast the engine is.
    let chunksBack = 0;
    let gate: Promise<void> | null = null;
    const bullmq = pool;
    const paced: JobPool = {
      width: 4,
      discard: (group) => bullmq.discard(group),
      status: () => bullmq.status(),
      close: () => bullmq.close(),
      async run<T>(task: Parameters<JobPool['run']>[0], ticket?: Parameters<JobPool['run']>[1]): Promise<T> {
        if (gate) await gate;
        const result = await bullmq.run<T>(task, ticket);
        if (task.kind === 'audit-chunk' && ++chunksBack === 3) gate = new Promise<void>((resolve) => (openGate = resolve));
        return result;
      },
    };
    world = await queueWorld(paced);
    const { db } = world;
    events = new QueueEvents(settings.queue, { connection: redisOptions(redis!.url) });
    await events.waitUntilReady();
    const stalled: string[] = [];
    events.on('stalled', ({ jobId }) => stalled.push(jobId));

    // The survivor starts the run alone.
    const survivor = spawnWorker(settings);
    workers.push(survivor);
    await survivor.waitForLine(/ready: queue two-workers/);

    const analyst = await world.analyst();
    const started = await startRingAudit(analyst, { name: 'Ring of sixty', nodes: 60, ladderTo: 5 });
    const id: number = started.body.id;
    const total: number = started.body.progress.total;
    expect(total).toBe(120);

    // Mid-run: a few chunks stored, the rest held back until the second worker is up.
    const progress = async () => Number((await db('audits').where({ id }).first('progress_done')).progress_done);
    await until(async () => gate !== null, 'the first chunks to come back', 120_000);
    await until(async () => (await pool!.queue.getActiveCount()) + (await pool!.queue.getWaitingCount()) === 0, 'the chunks in flight to finish', 60_000);
    const victim = spawnWorker(settings);
    workers.push(victim);
    await victim.waitForLine(/ready: queue two-workers/);
    openGate();

    // Freeze the victim as it starts a chunk, check the chunk is still in its hands, then SIGKILL it.
    // Its first chunk also boots its compute thread and the run's baseline, so the first try holds
    // unless this process is starved; later tries cover that.
    let killedJob: string | null = null;
    let from = 0;
    for (let tries = 0; tries < 20 && !killedJob; tries++) {
      const { line, index } = await victim.waitForLine(/^started /, from);
      from = index + 1;
      victim.child.kill('SIGSTOP');
      const jobId = line.slice('started '.length);
      if ((await pool.queue.getJobState(jobId)) === 'active') {
        victim.child.kill('SIGKILL');
        killedJob = jobId;
      } else {
        victim.child.kill('SIGCONT');
      }
    }
    expect(killedJob).not.toBeNull();
    const doneAtKill = await progress();
    expect(doneAtKill).toBeGreaterThanOrEqual(3 * 4);
    expect(doneAtKill).toBeLessThan(total);
    const survivorLinesAtKill = survivor.lines.length;

    const finished = await waitForSweep(analyst, id, 120_000).catch(async (err) => {
      const counts = await pool!.queue.getJobCounts();
      throw new Error(
        `${err.message}; killed ${killedJob}; stalled ${JSON.stringify(stalled)}; queue ${JSON.stringify(counts)}; progress ${await progress()}/${total}\n` +
          `survivor's last lines:\n${survivor.lines.slice(-6).join('\n')}\nlogged: ${world!.logged.join('\n')}`,
      );
    });
    expect(finished.state).toBe('in-review');
    expect(finished.progress).toMatchObject({ done: total, total });

    // BullMQ found the dead worker's chunk by its lapsed lock, and the survivor computed it after the kill.
    expect(stalled).toContain(killedJob);
    expect(survivor.lines.slice(survivorLinesAtKill)).toContain(`finished ${killedJob}`);
    expect(victim.lines).not.toContain(`finished ${killedJob}`);

    // Every edge stored once; nothing left in the queue.
    const rows = await storedEdges(db, id);
    expect(rows.map((r) => r.edge_index)).toEqual(Array.from({ length: total }, (_, i) => i));
    const counts = await pool.queue.getJobCounts('waiting', 'active', 'delayed', 'failed');
    expect(counts).toMatchObject({ waiting: 0, active: 0, delayed: 0, failed: 0 });

    // The same audit in the default mode: worker threads inside the server.
    const audit = (await repo.findAudit(db, id))!;
    const refId = await repo.insertAudit(db, { networkVersionId: audit.network_version_id, settingsJson: audit.settings_json, startedBy: audit.started_by, total });
    const threads = createWorkerPool(1);
    try {
      await new AuditRunner(db, threads, silentNotifier, () => {}).start(refId);
    } finally {
      await threads.close();
    }
    const reference = (await repo.findAudit(db, refId))!;
    expect(reference.state).toBe('in-review');
    expect(audit.baseline_json).toBe(reference.baseline_json);
    const expected = await storedEdges(db, refId);
    expect(expected).toHaveLength(total);
    // Whole rows: class, exponents and tolerance of every edge, and the plot data besides.
    expect(rows.map((r) => [r.class, r.plus_exponent, r.minus_exponent, r.tolerance])).toEqual(expected.map((r) => [r.class, r.plus_exponent, r.minus_exponent, r.tolerance]));
    expect(rows).toEqual(expected);
  }, 240_000);
});
