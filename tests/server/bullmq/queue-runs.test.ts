import net from 'node:net';
import * as repo from '../../../server/audits/repo';
import { AuditRunner } from '../../../server/audits/runner';
import { silentNotifier } from '../../../server/audits/notify';
import { createBullmqPool, type BullmqPool } from '../../../server/jobs/bullmq-pool';
import { startQueueWorker, type QueueWorker } from '../../../server/jobs/bullmq-worker';
import type { Task } from '../../../server/jobs/tasks';
import { toEdgeRowFields } from '../../../lib/audit/edge-row';
import { waitForSweep } from '../support/audits';
import { inProcessQueueSuite, queueWorld, ringCsv, storedEdges, testJobSettings, until } from './support';

/**
 * Failure handling in bullmq mode, with a queue worker inside the test so
 * each chunk's computation can be made to fail or wait: bounded retries that
 * fail the run with a reason, cancelling that drops the queued chunks, and a
 * restart that collects finished chunks instead of computing them again.
 * 31 nodes and two edges each: 62 edges in 16 chunks of four.
 */
describe('bullmq mode: failures, cancelling and restarts', () => {
  const suite = inProcessQueueSuite();
  const { threads, cleanup, releases } = suite;

  /** The server side on a bullmq pool, with a fresh seeded database and a network imported. */
  async function server(queue: string, overrides: Parameters<typeof testJobSettings>[2] = {}, parallel?: number) {
    const settings = testJobSettings(suite.redis.url, queue, overrides);
    const pool = await createBullmqPool(settings);
    const world = await queueWorld(pool, parallel);
    cleanup.push(() => world.db.destroy(), () => world.runner.idle(), () => pool.close(), async () => world.runner.stop());
    const analyst = await world.analyst();
    const imported = await analyst.post('/api/v1/networks/import').send({ name: `Ring for ${queue}`, format: 'csv', text: ringCsv(31) });
    if (imported.status !== 201) throw new Error(`import answered ${imported.status}`);
    const start = async () => {
      const res = await analyst
        .post('/api/v1/audits')
        .send({ networkId: imported.body.networkId, version: 1, settings: { ladder: { from: 2, to: 4, step: 1 }, signs: ['plus'] } });
      if (res.status !== 201) throw new Error(`start answered ${res.status}`);
      return res.body.id as number;
    };
    return { settings, pool, world, analyst, start };
  }

  /** A queue worker in this process whose chunk computations pass through `hook` first. */
  async function worker(settings: ReturnType<typeof testJobSettings>, hook: (edges: number[]) => Promise<void> | void) {
    const computed: string[] = [];
    const running: QueueWorker = await startQueueWorker({
      settings,
      compute: async (task: Task) => {
        if (task.kind === 'audit-chunk') {
          computed.push(task.edgeIndices.join(','));
          await hook(task.edgeIndices);
        }
        return threads.run(task);
      },
    });
    cleanup.push(() => running.close());
    return { running, computed };
  }

  test('a chunk that keeps failing is tried the set number of times, then fails the run with its reason', async () => {
    // Two chunks in flight, so the failing chunk's retries come round quickly.
    const s = await server('keeps-failing', { attempts: 3, backoffMs: 50 }, 2);
    // The other chunks take a while, so the retries end well before the run would.
    const { computed } = await worker(s.settings, async (edges) => {
      if (edges.includes(8)) throw new Error('the solver gave up on edge 8');
      await new Promise((r) => setTimeout(r, 150));
    });
    const id = await s.start();
    const done = await waitForSweep(s.analyst, id, 60_000);
    expect(done.state).toBe('failed');
    expect(done.reason).toMatch(/the chunk of edges 8–11 failed after 3 attempts: the solver gave up on edge 8/);
    expect(computed.filter((c) => c === '8,9,10,11')).toHaveLength(3);
    // The run stopped asking for chunks, and none of its jobs stay queued.
    expect(computed.length).toBeLessThan(16);
    await until(async () => (await s.pool.queue.getActiveCount()) === 0, 'the chunk in hand to finish');
    expect(await s.pool.queue.getJobCounts('waiting', 'delayed')).toMatchObject({ waiting: 0, delayed: 0 });
    const stored = await s.world.db('audit_edges').where({ audit_id: id }).count({ n: '*' });
    expect(Number(stored[0].n)).toBe(done.progress.done);
    expect(done.progress.done).toBeLessThan(done.progress.total);
    const trail = await s.world.db('events').where({ subject_type: 'audit', subject_id: String(id) }).pluck('action');
    expect(trail).toContain('audit.failed');
  }, 90_000);

  test('cancelling a run removes its queued chunks; the chunk a worker holds finishes unread', async () => {
    const s = await server('cancel');
    let release = () => {};
    const held = new Promise<void>((resolve) => (release = resolve));
    releases.push(() => release());
    const { computed } = await worker(s.settings, () => held);
    const id = await s.start();
    await until(async () => computed.length === 1, 'the worker to take the first chunk');
    await until(async () => (await s.pool.queue.getWaitingCount()) === 15, 'the other fifteen chunks to be queued');

    const res = await s.analyst.post(`/api/v1/audits/${id}/cancel`).send({});
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('cancelled');
    expect(await s.pool.queue.getJobCounts('waiting', 'delayed', 'active')).toMatchObject({ waiting: 0, delayed: 0, active: 1 });

    release();
    await until(async () => (await s.pool.queue.getJobCounts('active', 'completed')).active === 0, 'the held chunk to finish');
    await until(async () => (await s.pool.queue.getCompletedCount()) === 0, 'the unread result to be removed');
    expect(computed).toHaveLength(1);
    const after = await s.world.db('audits').where({ id }).first();
    expect(after.state).toBe('cancelled');
    expect(after.progress_done).toBe(0);
    expect(await s.world.db('audit_edges').where({ audit_id: id }).count({ n: '*' })).toEqual([{ n: 0 }]);
  }, 90_000);

  test('after a server restart, chunks the workers finished meanwhile are collected, not computed again', async () => {
    const settings = testJobSettings(suite.redis.url, 'restart');
    const first = await createBullmqPool(settings);
    const world = await queueWorld(first);
    cleanup.push(() => world.db.destroy(), () => first.close());
    const analyst = await world.analyst();
    const imported = await analyst.post('/api/v1/networks/import').send({ name: 'Ring that restarts', format: 'csv', text: ringCsv(31) });
    expect(imported.status).toBe(201);

    // The worker holds every chunk from edge 16 on until the server has stopped.
    let release = () => {};
    const held = new Promise<void>((resolve) => (release = resolve));
    releases.push(() => release());
    const { computed } = await worker(settings, (edges) => (edges[0] >= 16 ? held : undefined));
    const started = await analyst.post('/api/v1/audits').send({ networkId: imported.body.networkId, version: 1, settings: { ladder: { from: 2, to: 4, step: 1 }, signs: ['plus'] } });
    const id: number = started.body.id;
    await until(async () => Number((await world.db('audits').where({ id }).first()).progress_done) === 16, 'the first four chunks to be stored');

    // Stop the server side as startServer's close does.
    world.runner.stop();
    await first.close();
    await world.runner.idle();
    expect((await world.db('audits').where({ id }).first()).state).toBe('sweeping');

    // The worker goes on; its results wait in Redis.
    const second = await createBullmqPool(settings);
    cleanup.push(() => second.close());
    release();
    await until(async () => (await second.queue.getCompletedCount()) === 12, 'the worker to finish the other twelve chunks', 60_000);

    const runner = new AuditRunner(world.db, second, silentNotifier, () => {});
    expect(await runner.resumeInterrupted()).toEqual([id]);
    await runner.idle();
    const after = await world.db('audits').where({ id }).first();
    expect(after.state).toBe('in-review');
    expect(after.progress_done).toBe(62);
    const rows = await storedEdges(world.db, id);
    expect(rows.map((r) => r.edge_index)).toEqual(Array.from({ length: 62 }, (_, i) => i));
    // Sixteen chunks, each computed once; and Redis keeps none of their results.
    expect(computed).toHaveLength(16);
    expect(new Set(computed).size).toBe(16);
    expect(await second.queue.getJobCounts('waiting', 'active', 'completed', 'failed')).toMatchObject({ waiting: 0, active: 0, completed: 0, failed: 0 });
  }, 120_000);

  test('storing a chunk twice keeps one row per edge and counts progress from the table', async () => {
    const s = await server('store-twice');
    const id = await repo.insertAudit(s.world.db, { networkVersionId: 1, settingsJson: '{}', startedBy: 2, total: 3 });
    const network = { nodes: ['a', 'b', 'c'], edges: [{ source: 'a', target: 'b', weight: 1 }, { source: 'b', target: 'c', weight: 1 }, { source: 'c', target: 'a', weight: 1 }] };
    const baseline = await threads.run<never>({ kind: 'audit-baseline', network, options: {} });
    const results = await threads.run<Parameters<typeof toEdgeRowFields>[0][]>({ kind: 'audit-chunk', network, baseline, options: {}, edgeIndices: [0, 1] });
    const rows = results.map(toEdgeRowFields);
    expect(await repo.storeChunk(s.world.db, id, rows)).toBe(2);
    expect(await repo.storeChunk(s.world.db, id, rows)).toBe(2);
    expect(await repo.storeChunk(s.world.db, id, rows.slice(1))).toBe(2);
    expect((await s.world.db('audits').where({ id }).first()).progress_done).toBe(2);
    expect((await storedEdges(s.world.db, id)).map((r) => r.edge_index)).toEqual([0, 1]);
  }, 60_000);

  test('in bullmq mode the server will not start without its Redis, and says which URL failed', async () => {
    const closed = await new Promise<number>((resolve) => {
      const srv = net.createServer();
      srv.listen(0, '127.0.0.1', () => {
        const { port } = srv.address() as net.AddressInfo;
        srv.close(() => resolve(port));
      });
    });
    const settings = testJobSettings(`redis://:secret@127.0.0.1:${closed}`, 'nowhere');
    let message = '';
    await createBullmqPool(settings, () => {}, 1500).then(
      (p: BullmqPool) => p.close(),
      (err: Error) => (message = err.message),
    );
    expect(message).toMatch(new RegExp(`cannot reach Redis at redis://:\\*\\*\\*@127\\.0\\.0\\.1:${closed}`));
    expect(message).toMatch(/HAIRLINE_REDIS_URL/);
    expect(message).not.toMatch(/secret/);
  }, 30_000);
});
