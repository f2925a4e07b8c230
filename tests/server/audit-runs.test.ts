import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { createInlinePool } from '../../server/jobs/pool';
import { AuditRunner } from '../../server/audits/runner';
import { silentNotifier } from '../../server/audits/notify';
import { edgesCsv, neutraliseFormula } from '../../server/audits/export-csv';
import { accountsWorld, signedIn, type AccountsWorld } from './support/accounts';
import { startAndFinish } from './support/audits';
import { auditDetailSchema } from '../../lib/schemas/audit';

describe('audit runs: cancel, resume, trail check', () => {
  let w: AccountsWorld;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
  });
  afterAll(() => w.close());

  test('a run can be cancelled mid-sweep; it keeps what it stored and says why', async () => {
    const analyst = await signedIn(w, 'analyst');
    // A larger network with one edge per task keeps the sweep going long enough to cancel.
    const rows = ['source,target,weight'];
    for (let i = 0; i < 90; i++) rows.push(`p${i},p${(i + 1) % 90},1`, `p${i},p${(i + 7) % 90},0.5`);
    const imported = await analyst.post('/api/v1/networks/import').send({ name: 'Cancel me', format: 'csv', text: rows.join('\n') });
    expect(imported.status).toBe(201);
    const started = await analyst.post('/api/v1/audits').send({ networkId: imported.body.networkId, version: 1, settings: { ladder: { from: 2, to: 4, step: 1 }, signs: ['plus'] } });
    expect(started.status).toBe(201);
    // The answer is the audit's detail before its sweep begins: the page it opens can show the run at once.
    expect(auditDetailSchema.parse(started.body)).toMatchObject({ state: 'queued', progress: { done: 0, total: 180 }, lambda2: null });
    expect(started.body.allowed).toContain('cancel');
    const res = await analyst.post(`/api/v1/audits/${started.body.id}/cancel`).send({});
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('cancelled');
    expect(res.body.reason).toMatch(/cancelled/);
    expect(res.body.progress.done).toBeLessThan(res.body.progress.total);
    const stored = await w.db('audit_edges').where({ audit_id: started.body.id }).count({ n: '*' });
    expect(Number(stored[0].n)).toBe(res.body.progress.done);
  }, 120_000);

  test('a sweep cut short by a stop resumes from its stored rows and finishes with every edge once', async () => {
    const analyst = await signedIn(w, 'analyst');
    const done = await startAndFinish(w, analyst, 'Marrow Fen microgrid');
    const complete = await w.db('audit_edges').where({ audit_id: done.id }).orderBy('edge_index');
    // Make a second audit look like a crash left it: sweeping, with the first five rows stored.
    const [id] = await w.db('audits')
      .insert({ network_version_id: (await w.db('audits').where({ id: done.id }).first()).network_version_id, state: 'sweeping', settings_json: (await w.db('audits').where({ id: done.id }).first()).settings_json, started_by: 2, progress_total: complete.length, progress_done: 5 })
      .returning('id')
      .then((r) => r.map((x: { id: number } | number) => (typeof x === 'object' ? x.id : x)));
    await w.db('audit_edges').insert(complete.slice(0, 5).map((r) => ({ ...r, audit_id: id })));

    const runner = new AuditRunner(w.db, createInlinePool(), silentNotifier, () => {});
    expect(await runner.resumeInterrupted()).toEqual([id]);
    await runner.idle();
    const after = await w.db('audits').where({ id }).first();
    expect(after.state).toBe('in-review');
    const resumed = await w.db('audit_edges').where({ audit_id: id }).orderBy('edge_index');
    expect(resumed.map((r) => r.edge_index)).toEqual(complete.map((r) => r.edge_index));
    // Same engine, same input: the resumed rows equal an uninterrupted run's.
    expect(resumed.map((r) => [r.class, r.plus_exponent, r.tolerance])).toEqual(complete.map((r) => [r.class, r.plus_exponent, r.tolerance]));
    const events = await w.db('events').where({ subject_type: 'audit', subject_id: String(id) }).pluck('action');
    expect(events).toEqual(['audit.resumed', 'audit.sweep-finished']);
  }, 120_000);

  test('verify-trail passes on an intact trail and exits 1 once a row was edited behind the triggers', () => {
    const dbFile = (w.db.client.config.connection as { filename: string }).filename;
    const cli = (extraEnv: Record<string, string> = {}) =>
      spawnSync(path.resolve(__dirname, '../../node_modules/.bin/tsx'), ['server/cli/verify-trail.ts'], {
        cwd: path.resolve(__dirname, '../..'),
        env: { ...process.env, HAIRLINE_DATABASE: dbFile, HAIRLINE_SESSION_SECRET: 'x'.repeat(40), ...extraEnv },
        encoding: 'utf8',
      });
    const ok = cli();
    expect(ok.stdout).toMatch(/trail intact/);
    expect(ok.status).toBe(0);
    return (async () => {
      await w.db.raw('DROP TRIGGER events_no_update');
      const victim = await w.db('events').where({ action: 'audit.started' }).first('id');
      await w.db('events').where({ id: victim.id }).update({ reason: 'quietly rewritten' });
      const bad = cli();
      expect(bad.status).toBe(1);
      expect(bad.stderr).toMatch(new RegExp(`id ${victim.id}`));
    })();
  }, 60_000);
});

describe('CSV export safety', () => {
  test('cells a spreadsheet would run as formulas are neutralised', () => {
    expect(neutraliseFormula('=SUM(A1:A9)')).toBe("'=SUM(A1:A9)");
    expect(neutraliseFormula('+1')).toBe("'+1");
    expect(neutraliseFormula('@cmd')).toBe("'@cmd");
    expect(neutraliseFormula('mast-crest')).toBe('mast-crest');
    const csv = edgesCsv([
      { edgeIndex: 0, source: '=HYPERLINK("x")', target: 'b', weight: 1, class: 'linear', plusClass: 'linear', plusExponent: 1, minusClass: 'linear', minusExponent: 1, flags: [], tolerance: 0.1, toleranceRel: 0.1, sensitivity: 0.5, flagged: false, disposition: null },
    ]);
    expect(csv.split('\r\n')[1]).toMatch(/^0,"'=HYPERLINK\(""x""\)",b,1,/);
  });
});
