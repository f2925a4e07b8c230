/**
 * `npm run backup` against a live server: a copy taken in the middle of a
 * sweep is a consistent snapshot whose trail verifies; a copy of an idle
 * server holds exactly the rows of every table; an existing file is never
 * overwritten; and the documented restore (stop, remove the WAL files, copy
 * the backup over the database, start) brings the server back on the copy,
 * resuming the sweep that was running when the copy was taken.
 */
import Database from 'better-sqlite3';
import { spawn } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { demoUser } from '../../seeds/data/demo';
import { defaultBackupFile } from '../../server/cli/backup';
import { korrinGrid } from '../support/korrin-grid';
import { repoRoot, serverEnv, Session, startChildServer, stopChildServer, tsxArgs, type ChildServer } from '../support/spawned';

const analystAccount = demoUser('analyst');
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Runs a CLI of server/cli with the server's environment, without blocking the event loop. */
function cli(script: string, env: Record<string, string>, args: string[] = []): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [...tsxArgs(script), ...args], { cwd: repoRoot, env: { ...process.env, ...env } });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('exit', (status) => resolve({ status, stdout, stderr }));
  });
}

function rowCounts(file: string): Record<string, number> {
  const db = new Database(file, { readonly: true });
  try {
    const tables = db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name").pluck().all() as string[];
    return Object.fromEntries(tables.map((t) => [t, db.prepare(`SELECT count(*) FROM "${t}"`).pluck().get() as number]));
  } finally {
    db.close();
  }
}

function auditState(file: string, id: number) {
  const db = new Database(file, { readonly: true });
  try {
    const audit = db.prepare('SELECT state, progress_done, progress_total FROM audits WHERE id = ?').get(id) as { state: string; progress_done: number; progress_total: number };
    const stored = db.prepare('SELECT count(*) FROM audit_edges WHERE audit_id = ?').pluck().get(id) as number;
    return { ...audit, stored };
  } finally {
    db.close();
  }
}

async function sweepState(session: Session, id: number) {
  return (await session.get(`/api/v1/audits/${id}`)).body as { state: string; progress: { done: number; total: number } };
}

describe('npm run backup and the documented restore', () => {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-backup-'));
  const dbFile = path.join(dir, 'hairline.sqlite3');
  const env = serverEnv(dbFile);
  let server: ChildServer | undefined;
  afterAll(async () => {
    if (server) await stopChildServer(server, 'SIGKILL');
  });

  test('names a default file by time, beside the database', () => {
    expect(defaultBackupFile('/srv/hairline/data/hairline.sqlite3', new Date('2026-12-02T09:15:30.250Z'))).toBe('/srv/hairline/data/backups/hairline-20261202T091530Z.sqlite3');
  });

  test('copies a live database mid-sweep and idle, refuses to overwrite, and restores', async () => {
    server = await startChildServer(env);
    const analyst = await Session.signIn(server.url, analystAccount.email, analystAccount.password);
    const imported = await analyst.send('POST', '/api/v1/networks/import', { name: 'Korrin backup grid', format: 'csv', text: korrinGrid(90, 3) });
    expect(imported.status).toBe(201);
    const runId = (await analyst.send('POST', '/api/v1/audits', { networkId: imported.body.networkId, version: 1 })).body.id as number;
    for (let i = 0; (await sweepState(analyst, runId)).progress.done < 10; i++) {
      if (i > 2000) throw new Error(`the sweep never got going; server output:\n${server?.output()}`);
      await pause(20);
    }

    // 1. While the sweep writes: a consistent snapshot.
    const live = await cli('server/cli/backup.ts', env);
    expect(live.stderr).toBe('');
    expect(live.status).toBe(0);
    const [, midFile, bytes] = /^backup written: (.+) \(([\d,]+) bytes\)\n$/.exec(live.stdout) ?? [];
    expect(path.dirname(midFile)).toBe(path.join(dir, 'backups'));
    expect(statSync(midFile).size).toBe(Number(bytes.replace(/,/g, '')));
    const snapshot = auditState(midFile, runId);
    expect(snapshot.state).toBe('sweeping');
    expect(snapshot.stored).toBe(snapshot.progress_done); // rows and progress from the same moment
    expect(snapshot.stored).toBeLessThan(snapshot.progress_total);
    const midTrail = await cli('server/cli/verify-trail.ts', { ...env, HAIRLINE_DATABASE: midFile });
    expect(midTrail.stdout).toMatch(/^trail intact/);
    expect(midTrail.status).toBe(0);

    // 2. Idle: the copy holds exactly the rows of every table.
    for (let i = 0; ['queued', 'sweeping'].includes((await sweepState(analyst, runId)).state); i++) {
      if (i > 3000) throw new Error(`the sweep never finished; server output:\n${server?.output()}`);
      await pause(50);
    }
    const named = path.join(dir, 'before-the-spring-retune.sqlite3');
    const idle = await cli('server/cli/backup.ts', env, [named]);
    expect(idle.status).toBe(0);
    expect(idle.stdout).toMatch(new RegExp(`^backup written: ${named.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')} \\(`));
    expect(rowCounts(named)).toEqual(rowCounts(dbFile));
    expect(auditState(named, runId)).toMatchObject({ state: 'in-review', stored: snapshot.progress_total });

    // 3. Never over an existing file.
    const again = await cli('server/cli/backup.ts', env, [named]);
    expect(again.status).toBe(1);
    expect(again.stderr).toMatch(/already exists; name a new file/);

    // 4. Restore the mid-sweep copy as README describes; the server resumes that sweep.
    expect(await stopChildServer(server)).toEqual({ code: 0, signal: null });
    for (const leftover of [`${dbFile}-wal`, `${dbFile}-shm`]) rmSync(leftover, { force: true });
    copyFileSync(midFile, dbFile);
    server = await startChildServer(env);
    const back = await Session.signIn(server.url, analystAccount.email, analystAccount.password);
    for (let i = 0; ['queued', 'sweeping'].includes((await sweepState(back, runId)).state); i++) {
      if (i > 3000) throw new Error(`the restored sweep never finished; server output:\n${server?.output()}`);
      await pause(50);
    }
    expect(await sweepState(back, runId)).toMatchObject({ state: 'in-review', progress: { done: snapshot.progress_total, total: snapshot.progress_total } });
    expect(await stopChildServer(server)).toEqual({ code: 0, signal: null });
    server = undefined;
    expect(existsSync(`${dbFile}-wal`)).toBe(false);
    const trail = await cli('server/cli/verify-trail.ts', env);
    expect(trail.status).toBe(0);
  }, 240_000);
});
