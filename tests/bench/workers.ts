/**
 * Wall time of one large audit in bullmq mode with 1, 2 and 4 worker processes (one compute
 * thread each), beside the default in-process pool, on a throw-away redis-server and database.
 *
 *   npm run bench:workers
 *   npm run bench:workers -- --nodes 150 --edges-per-node 3 --seed 2 --workers 1,2,4 --repeat 3
 *
 * Needs Debian's redis-server. Each set-up runs `--repeat` audits and keeps the fastest (other
 * work on a shared machine only ever slows a run down); the table also gives the CPU seconds the
 * worker processes used per audit and the load average when the set-up began. Timings are printed,
 * not asserted; the stored rows of every run are compared with the first run's, and a difference
 * ends the script with exit code 1.
 */
import { readFileSync } from 'node:fs';
import os from 'node:os';
import { randomNetwork } from '@/lib/spectral';
import * as repo from '@/server/audits/repo';
import { createBullmqPool } from '@/server/jobs/bullmq-pool';
import { createWorkerPool, type JobPool } from '@/server/jobs/pool';
import { queueWorld, spawnWorker, startRedis, stopChild, storedEdges, testJobSettings } from '../server/bullmq/support';

function option(name: string): string | undefined {
  const argv = process.argv.slice(2);
  const i = argv.findIndex((a) => a === name || a.startsWith(`${name}=`));
  if (i < 0) return undefined;
  return argv[i].includes('=') ? argv[i].slice(argv[i].indexOf('=') + 1) : argv[i + 1];
}

const nodes = Number(option('--nodes') ?? 150);
const perNode = Number(option('--edges-per-node') ?? 3);
const seed = Number(option('--seed') ?? 2);
const counts = (option('--workers') ?? '1,2,4').split(',').map((s) => Number(s.trim()));
const repeat = Number(option('--repeat') ?? 1);
if (!Number.isInteger(nodes) || nodes < 2 || !(perNode > 0) || !Number.isFinite(seed) || counts.some((n) => !Number.isInteger(n) || n < 1) || !Number.isInteger(repeat) || repeat < 1) {
  process.stderr.write('usage: npm run bench:workers -- [--nodes 150] [--edges-per-node 3] [--seed 2] [--workers 1,2,4] [--repeat 1]\n');
  process.exit(2);
}

async function main(): Promise<void> {
  const network = randomNetwork({ nodes, seed, edgesPerNode: perNode });
  const csv = ['source,target,weight', ...network.edges.map((e) => `${e.source},${e.target},${e.weight}`)].join('\n');
  const redis = await startRedis();
  const settings = testJobSettings(redis.url, 'bench', { lockMs: 30_000, stallCheckMs: 15_000 });
  const bullmq = await createBullmqPool(settings);
  // The runner's pool is swapped per run: the bullmq pool, or the default worker threads.
  let current: JobPool = bullmq;
  const switching: JobPool = {
    get width() {
      return current.width;
    },
    run: (task, ticket) => current.run(task, ticket),
    discard: (group) => current.discard(group),
    status: () => current.status(),
    close: async () => {},
  };
  const world = await queueWorld(switching);
  const analyst = await world.analyst();
  const imported = await analyst.post('/api/v1/networks/import').send({ name: 'Bench network', format: 'csv', text: csv });
  if (imported.status !== 201) throw new Error(`import answered ${imported.status}: ${JSON.stringify(imported.body)}`);
  const networkId: number = imported.body.networkId;

  console.log(
    `bench:workers — ${network.nodes.length} nodes, ${network.edges.length} edges (seed ${seed}), default ladder, both signs; ${os.availableParallelism()} cores; best of ${repeat}`,
  );

  const audit = async (): Promise<{ id: number; seconds: number }> => {
    const t0 = performance.now();
    const res = await analyst.post('/api/v1/audits').send({ networkId, version: 1 });
    if (res.status !== 201) throw new Error(`start answered ${res.status}`);
    const id: number = res.body.id;
    for (;;) {
      const row = await repo.findAudit(world.db, id);
      if (row && !['queued', 'sweeping'].includes(row.state)) {
        if (row.state !== 'in-review') throw new Error(`audit ${id} ended ${row.state}: ${row.reason}`);
        return { id, seconds: (performance.now() - t0) / 1000 };
      }
      await new Promise((r) => setTimeout(r, 20));
    }
  };

  const results: Array<{ label: string; workers: number; seconds: number; id: number; cpu: number | null; load: number }> = [];
  const best = async (cpuNow: () => number | null) => {
    const load = os.loadavg()[0];
    const cpu0 = cpuNow();
    let fastest: { id: number; seconds: number } | null = null;
    for (let i = 0; i < repeat; i++) {
      const r = await audit();
      if (!fastest || r.seconds < fastest.seconds) fastest = r;
    }
    const cpu1 = cpuNow();
    return { ...fastest!, load, cpu: cpu0 === null || cpu1 === null ? null : (cpu1 - cpu0) / repeat };
  };
  try {
    for (const n of counts) {
      const workers = Array.from({ length: n }, () => spawnWorker(settings));
      try {
        await Promise.all(workers.map((w) => w.waitForLine(/ready: queue bench/)));
        current = bullmq;
        const r = await best(() => cpuSeconds(workers.map((w) => w.child.pid!)));
        results.push({ label: 'bullmq', workers: n, ...r });
        process.stderr.write(`  ${n} worker process${n === 1 ? '' : 'es'}: ${r.seconds.toFixed(1)} s\n`);
      } finally {
        for (const w of workers) await stopChild(w.child);
      }
    }
    const threads = createWorkerPool();
    try {
      current = threads;
      // The pool's threads belong to this process: its CPU time stands in (it includes the server's share).
      const r = await best(() => {
        const u = process.cpuUsage();
        return (u.user + u.system) / 1e6;
      });
      results.push({ label: 'pool (default)', workers: threads.width, ...r });
      process.stderr.write(`  in-process pool: ${r.seconds.toFixed(1)} s\n`);
    } finally {
      await threads.close();
    }

    const base = results.find((r) => r.label === 'bullmq')?.seconds ?? results[0].seconds;
    console.log('mode            workers  wall (s)  edges/s  vs 1 worker  CPU s/audit  load avg');
    for (const r of results) {
      const threadsNote = r.label === 'bullmq' ? `${r.workers}` : `${r.workers} thr`;
      console.log(
        `${r.label.padEnd(16)}${threadsNote.padStart(7)}  ${r.seconds.toFixed(1).padStart(8)}  ${(network.edges.length / r.seconds).toFixed(1).padStart(7)}  ${(base / r.seconds).toFixed(2).padStart(10)}×  ${(r.cpu === null ? '–' : r.cpu.toFixed(1)).padStart(11)}  ${r.load.toFixed(1).padStart(8)}`,
      );
    }
    const first = await storedEdges(world.db, results[0].id);
    let same = true;
    for (const r of results.slice(1)) same &&= JSON.stringify(await storedEdges(world.db, r.id)) === JSON.stringify(first);
    console.log(`stored results identical across runs: ${same ? 'yes' : 'NO'}`);
    if (!same) process.exitCode = 1;
  } finally {
    world.runner.stop();
    await bullmq.close();
    await world.runner.idle();
    await world.db.destroy();
    await redis.stop();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

/** User + system CPU seconds of these processes so far (Linux /proc), or null where unreadable. */
function cpuSeconds(pids: number[]): number | null {
  try {
    const tick = 100; // USER_HZ on Linux
    return pids.reduce((sum, pid) => {
      const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
      return sum + (Number(fields[11]) + Number(fields[12])) / tick;
    }, 0);
  } catch {
    return null;
  }
}
