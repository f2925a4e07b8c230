import type { Express } from 'express';
import request from 'supertest';
import { auditDetailSchema } from '../../../lib/schemas/audit';
import { healthSchema } from '../../../lib/schemas/health';
import * as repo from '../../../server/audits/repo';
import { createBullmqPool } from '../../../server/jobs/bullmq-pool';
import { startQueueWorker } from '../../../server/jobs/bullmq-worker';
import type { Task } from '../../../server/jobs/tasks';
import { waitForSweep } from '../support/audits';
import { inProcessQueueSuite, queueWorld, startRingAudit, startRedis, testJobSettings, until } from './support';

/**
 * In bullmq mode a run moves only while a queue worker is connected. The
 * health answer and a running audit's detail say how many are, so a page can
 * tell "no worker" from "busy"; and when Redis cannot say, they answer with
 * null instead of failing or hanging.
 */
describe('bullmq mode: how many queue workers are connected', () => {
  const suite = inProcessQueueSuite();
  const { threads, cleanup, releases } = suite;

  async function server(redisUrl: string, queue: string) {
    const settings = testJobSettings(redisUrl, queue);
    const pool = await createBullmqPool(settings);
    const world = await queueWorld(pool);
    // A pool whose Redis has gone may wait on reconnects while closing: a few seconds, not the whole suite.
    const close = () => Promise.race([pool.close(), new Promise((r) => setTimeout(r, 3000))]);
    cleanup.push(() => world.db.destroy(), () => world.runner.idle(), close, async () => world.runner.stop());
    return { settings, pool, world };
  }

  /** A queue worker in this process; chunk computations wait for `gate` first. */
  async function worker(settings: ReturnType<typeof testJobSettings>, gate: Promise<void> = Promise.resolve()) {
    const running = await startQueueWorker({
      settings,
      compute: async (task: Task) => {
        if (task.kind === 'audit-chunk') await gate;
        return threads.run(task);
      },
    });
    cleanup.push(() => running.close());
    return running;
  }

  const health = async (world: { app: Express }) => {
    const res = await request(world.app).get('/api/v1/health');
    expect(res.status).toBe(200);
    return healthSchema.parse(res.body);
  };

  test('health reports no workers before one starts, one while it runs, and none again after it stops', async () => {
    const s = await server(suite.redis.url, 'health-count');
    expect((await health(s.world)).jobs).toEqual({ mode: 'queue', workers: 0 });

    const running = await worker(s.settings);
    // The count is cached for a couple of seconds, so the change shows on a later poll.
    await until(async () => (await health(s.world)).jobs.workers === 1, 'health to count the worker', 15_000);
    const second = await worker(s.settings);
    await until(async () => (await health(s.world)).jobs.workers === 2, 'health to count the second worker', 15_000);

    await second.close();
    await running.close();
    await until(async () => (await health(s.world)).jobs.workers === 0, 'health to see both workers gone', 15_000);
    expect((await health(s.world)).status).toBe('ok');
  }, 60_000);

  test('a queued or sweeping audit carries the count; a finished one does not', async () => {
    const s = await server(suite.redis.url, 'detail-count');
    const analyst = await s.world.analyst();
    const started = await startRingAudit(analyst, { name: 'Gannet Sound relay ring', nodes: 31 });
    const id: number = started.body.id;
    // The answer to the start itself already says nobody will compute it.
    expect(auditDetailSchema.parse(started.body).jobs).toEqual({ mode: 'queue', workers: 0 });

    const waiting = await analyst.get(`/api/v1/audits/${id}`);
    expect(['queued', 'sweeping']).toContain(waiting.body.state);
    expect(waiting.body.jobs).toEqual({ mode: 'queue', workers: 0 });
    // Nothing moves without a worker: no edge is stored.
    expect(waiting.body.progress.done).toBe(0);

    // A worker connects, but holds its chunks until the page has seen it.
    let release = () => {};
    const gate = new Promise<void>((resolve) => (release = resolve));
    releases.push(() => release());
    await worker(s.settings, gate);
    await until(
      async () => {
        const res = await analyst.get(`/api/v1/audits/${id}`);
        expect(['queued', 'sweeping']).toContain(res.body.state);
        return res.body.jobs?.workers === 1;
      },
      'the audit detail to count the worker',
      15_000,
    );

    release();
    const done = await waitForSweep(analyst, id, 60_000);
    expect(done.state).toBe('in-review');
    expect(done.progress.done).toBe(62);
    expect(done.jobs).toBeNull();
  }, 90_000);

  test('when Redis stops answering, health and a waiting audit still answer 200, with the count unknown', async () => {
    const own = await startRedis();
    cleanup.push(() => own.stop());
    const s = await server(own.url, 'redis-hangs');
    const id = await repo.insertAudit(s.world.db, { networkVersionId: 1, settingsJson: JSON.stringify({ ladder: { from: 2, to: 4, step: 1 }, signs: ['plus'], tolerance: 0.01 }), startedBy: 2, total: 3 });
    expect((await health(s.world)).jobs).toEqual({ mode: 'queue', workers: 0 });

    own.freeze();
    // Let it go before anything closes, so the pool's connections end cleanly.
    releases.push(() => own.thaw());
    await until(async () => (await health(s.world)).jobs.workers === null, 'health to report the count unknown', 15_000);
    const h = await health(s.world);
    expect(h).toMatchObject({ status: 'ok', database: { ok: true }, jobs: { mode: 'queue', workers: null } });

    const analyst = await s.world.analyst();
    const detail = await analyst.get(`/api/v1/audits/${id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.state).toBe('queued');
    expect(detail.body.jobs).toEqual({ mode: 'queue', workers: null });
  }, 60_000);

  test('a Redis that refuses CLIENT LIST (as some hosted ones do) gives an unknown count, not a made-up one', async () => {
    const locked = await startRedis(['--rename-command', 'CLIENT', '']);
    cleanup.push(() => locked.stop());
    const s = await server(locked.url, 'no-client-list');
    expect((await health(s.world)).jobs).toEqual({ mode: 'queue', workers: null });
  }, 60_000);
});
