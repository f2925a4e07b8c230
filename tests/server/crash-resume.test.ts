/**
 * Crash test: the real server as a child process (worker-thread pool, file
 * database in WAL mode) is killed with SIGKILL in the middle of a sweep and
 * started again on the same database. The sweep must resume from its stored
 * rows and finish (or fail with a reason), a sealed audit must be exactly as
 * it was, and `verify-trail` must find the trail intact.
 */
import Database from 'better-sqlite3';
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { demoUser } from '../../seeds/data/demo';
import { korrinGrid } from '../support/korrin-grid';
import { repoRoot, serverEnv, Session, startChildServer, stopChildServer, tsxArgs, type ChildServer } from '../support/spawned';

const account = demoUser;
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function signIn(server: ChildServer, role: 'analyst' | 'auditor' | 'approver') {
  return Session.signIn(server.url, account(role).email, account(role).password);
}

/** Polls until `probe` gives a value; on giving up, says what it last saw and what the server printed. */
async function waitUntil<T>(what: string, probe: () => Promise<{ done?: T; seen: unknown }>, server: () => ChildServer | undefined, timeoutMs = 90_000, everyMs = 40): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const { done, seen } = await probe();
    if (done !== undefined) return done;
    if (Date.now() > until) throw new Error(`gave up waiting for ${what}; last seen ${JSON.stringify(seen)}; server output:\n${server()?.output() ?? ''}`);
    await pause(everyMs);
  }
}

/** Every stored row of one audit, as the database holds it. */
function auditRows(dbFile: string, auditId: number) {
  const db = new Database(dbFile);
  try {
    return {
      audit: db.prepare('SELECT * FROM audits WHERE id = ?').get(auditId),
      edges: db.prepare('SELECT * FROM audit_edges WHERE audit_id = ? ORDER BY edge_index').all(auditId),
      dispositions: db.prepare('SELECT * FROM audit_dispositions WHERE audit_id = ? ORDER BY edge_index').all(auditId),
    };
  } finally {
    db.close();
  }
}

describe('crash test: SIGKILL mid-sweep, restart on the same database', () => {
  const dbFile = path.join(mkdtempSync(path.join(os.tmpdir(), 'hairline-crash-')), 'hairline.sqlite3');
  const env = serverEnv(dbFile);
  let first: ChildServer | undefined;
  let second: ChildServer | undefined;
  afterAll(async () => {
    for (const s of [first, second]) if (s) await stopChildServer(s, 'SIGKILL');
  });

  test('the sweep resumes and finishes, the sealed audit is untouched, the trail verifies', async () => {
    first = await startChildServer(env);
    const [analyst, auditor, approver] = [await signIn(first, 'analyst'), await signIn(first, 'auditor'), await signIn(first, 'approver')];

    // 1. Seal an audit of a demo network: sweep, dispositions, submit, lock.
    const networks = (await analyst.get('/api/v1/networks?q=Gannet')).body.networks;
    const demo = networks.find((n: { name: string }) => n.name === 'Gannet Sound buoy relay');
    const sealedId = (await analyst.send('POST', '/api/v1/audits', { networkId: demo.id, version: 1 })).body.id as number;
    await waitUntil('the demo sweep', async () => {
      const d = (await analyst.get(`/api/v1/audits/${sealedId}`)).body;
      return { done: d.state === 'in-review' ? true : undefined, seen: [d.state, d.progress] };
    }, () => first);
    const flagged = (await auditor.get(`/api/v1/audits/${sealedId}/edges?flagged=yes&pageSize=100`)).body.rows as { edgeIndex: number }[];
    expect(flagged.length).toBeGreaterThan(0);
    for (const row of flagged) {
      expect((await auditor.send('PUT', `/api/v1/audits/${sealedId}/edges/${row.edgeIndex}/disposition`, { kind: 'monitor', note: 'log the drift at each Gannet Sound service visit' })).status).toBe(200);
    }
    expect((await auditor.send('POST', `/api/v1/audits/${sealedId}/submit`, {})).status).toBe(200);
    const locked = await approver.send('POST', `/api/v1/audits/${sealedId}/lock`, { comment: 'Approved for the Korrin winter season.' });
    expect(locked.status).toBe(200);
    expect(locked.body.state).toBe('sealed');
    const sealedBefore = auditRows(dbFile, sealedId);

    // 2. Start a long sweep and kill the server while it runs.
    const imported = await analyst.send('POST', '/api/v1/networks/import', { name: 'Korrin relay grid', format: 'csv', text: korrinGrid(90, 6) });
    expect(imported.status).toBe(201);
    const started = await analyst.send('POST', '/api/v1/audits', { networkId: imported.body.networkId, version: 1 });
    expect(started.status).toBe(201);
    const runId = started.body.id as number;
    const midRun = await waitUntil('the sweep to be under way', async () => {
      const d = (await analyst.get(`/api/v1/audits/${runId}`)).body;
      if (d.state !== 'sweeping' && d.state !== 'queued') throw new Error(`the sweep ended (${d.state}) before it could be interrupted`);
      return { done: d.progress.done >= 25 ? d.progress : undefined, seen: [d.state, d.progress] };
    }, () => first);
    expect((await stopChildServer(first, 'SIGKILL')).signal).toBe('SIGKILL');
    expect(midRun.done).toBeLessThan(midRun.total);

    // What the crash left: still sweeping, and the progress count agrees with the rows stored.
    const crashed = auditRows(dbFile, runId);
    expect(crashed.audit).toMatchObject({ state: 'sweeping' });
    const doneAtCrash = (crashed.audit as { progress_done: number }).progress_done;
    expect(crashed.edges).toHaveLength(doneAtCrash);
    expect(doneAtCrash).toBeLessThan(540);

    // 3. Start again on the same database: the sweep resumes from its stored rows and finishes.
    second = await startChildServer(env);
    const analystAgain = await signIn(second, 'analyst');
    const finished = await waitUntil('the resumed sweep', async () => {
      const d = (await analystAgain.get(`/api/v1/audits/${runId}`)).body;
      return { done: ['queued', 'sweeping'].includes(d.state) ? undefined : d, seen: [d.state, d.progress] };
    }, () => second, 120_000, 200);
    if (finished.state === 'failed') expect(finished.reason).toEqual(expect.any(String));
    else expect(finished.state).toBe('in-review');
    const after = auditRows(dbFile, runId);
    if (finished.state === 'in-review') {
      expect(after.edges.map((r) => (r as { edge_index: number }).edge_index)).toEqual([...Array(540).keys()]);
      expect(finished.progress).toMatchObject({ done: 540, total: 540 });
    }
    // Rows stored before the crash were kept as they were, not recomputed or duplicated.
    const keptIndices = new Set(crashed.edges.map((r) => (r as { edge_index: number }).edge_index));
    expect(after.edges.filter((r) => keptIndices.has((r as { edge_index: number }).edge_index))).toEqual(crashed.edges);
    const trail = (await analystAgain.get(`/api/v1/audits/${runId}/trail`)).body.entries.map((e: { action: string }) => e.action);
    expect(trail).toEqual(expect.arrayContaining(['audit.started', 'audit.resumed']));

    // 4. The sealed audit is exactly as it was, and its seal still checks.
    expect(auditRows(dbFile, sealedId)).toEqual(sealedBefore);
    const sealedDetail = (await analystAgain.get(`/api/v1/audits/${sealedId}`)).body;
    expect(sealedDetail.state).toBe('sealed');
    expect(sealedDetail.lock.hash).toBe(locked.body.lock.hash);
    expect(sealedDetail.hashCheck).toEqual({ recomputed: locked.body.lock.hash, matches: true });

    // 5. Stopped cleanly, the trail verifies from the first entry to the last.
    expect(await stopChildServer(second)).toEqual({ code: 0, signal: null });
    const verify = spawnSync(process.execPath, tsxArgs('server/cli/verify-trail.ts'), { cwd: repoRoot, env: { ...process.env, ...env }, encoding: 'utf8' });
    expect(verify.stdout).toMatch(/^trail intact: \d+ entries/);
    expect(verify.status).toBe(0);
  }, 240_000);
});
