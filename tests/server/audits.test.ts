import Papa from 'papaparse';
import { accountsWorld, signedIn, type AccountsWorld } from './support/accounts';
import { startAndFinish, type Agent } from './support/audits';
import { expectRefusal } from './support/test-db';

/**
 * The audit workflow through the API on the demo network "Gannet Sound buoy
 * relay": its four relay masts form the 4-cycle 1→2→3→4→1 with chords 1→3
 * and 1→4 (unit weights), whose λ = 2 is one Jordan block of size 3, and
 * the buoys only listen downstream with in-degrees above 2, so the block
 * stays λ2 of the whole network (block-triangular Laplacian). By the
 * Lidskii–Vishik–Lyusternik theory (Moro, Burke & Overton, SIAM J. Matrix
 * Anal. Appl. 18, 1997) edges 1→2 and 1→3 then respond like |ε|^(1/3).
 */
describe('audit workflow', () => {
  let w: AccountsWorld;
  let analyst: Agent, auditor: Agent, approver: Agent;
  let audit: { id: number; state: string; flaggedCount: number };

  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    [analyst, auditor, approver] = await Promise.all([signedIn(w, 'analyst'), signedIn(w, 'auditor'), signedIn(w, 'approver')]);
    audit = await startAndFinish(w, analyst, 'Gannet Sound buoy relay');
  }, 120_000);
  afterAll(() => w.close());

  test('the sweep finishes ready for review, with every edge stored and progress complete', async () => {
    expect(audit.state).toBe('in-review');
    const res = await auditor.get(`/api/v1/audits/${audit.id}`);
    expect(res.body.progress).toMatchObject({ done: 17, total: 17 });
    expect(res.body.lambda2.re).toBeCloseTo(2, 6);
    expect(res.body.cluster.size).toBe(3);
    expect(res.body.allowed).toEqual(expect.arrayContaining(['dispose', 'submit', 'return']));
  });

  test('the Jordan-3 core edges are cube-root and flagged; the trail says who started it', async () => {
    const res = await auditor.get(`/api/v1/audits/${audit.id}/edges?class=cube-root&pageSize=100`);
    const names = res.body.rows.map((r: { source: string; target: string }) => `${r.source}→${r.target}`);
    expect(names).toEqual(expect.arrayContaining(['mast-crest→mast-ledge', 'mast-crest→mast-spit']));
    expect(res.body.rows.every((r: { flagged: boolean }) => r.flagged)).toBe(true);
    const trail = await auditor.get(`/api/v1/audits/${audit.id}/trail`);
    expect(trail.body.verified).toBe(true);
    expect(trail.body.entries[0]).toMatchObject({ action: 'audit.started', actor: 'Demo Analyst' });
  });

  test('the auditors were told by e-mail that the audit is ready', async () => {
    // Mail leaves after the state change; give the local relay a moment.
    let mail: Array<{ rcpt_to: string }> = [];
    for (let i = 0; i < 100 && mail.length === 0; i++) {
      mail = await w.db('outbox').where('subject', 'like', `%audit ${audit.id} is ready%`);
      if (mail.length === 0) await new Promise((r) => setTimeout(r, 50));
    }
    expect(mail.map((m) => m.rcpt_to).join(' ')).toMatch(/auditor@gannet-sound\.test/);
  });

  test('filters combine, sort works on a column, and the CSV holds exactly the filtered rows', async () => {
    const q = 'class=cube-root,square-root&sort=tolerance&dir=asc';
    const page = await auditor.get(`/api/v1/audits/${audit.id}/edges?${q}&pageSize=500`);
    const tolerances = page.body.rows.map((r: { tolerance: number }) => r.tolerance);
    expect(tolerances).toEqual([...tolerances].sort((a, b) => a - b));
    const csv = await auditor.get(`/api/v1/audits/${audit.id}/edges.csv?${q}`);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(csv.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.data.map((r) => Number(r.edge))).toEqual(page.body.rows.map((r: { edgeIndex: number }) => r.edgeIndex));
    expect(parsed.data.map((r) => r.class)).toEqual(page.body.rows.map((r: { class: string }) => r.class));
  });

  test('submission is refused while a flagged edge has no disposition, naming the edges', async () => {
    const res = await auditor.post(`/api/v1/audits/${audit.id}/submit`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('undisposed');
    expect(res.body.error.problems).toHaveLength(audit.flaggedCount);
  });

  test('an analyst may not record dispositions; an auditor may, and a change is in the trail with its old value', async () => {
    const flagged = await auditor.get(`/api/v1/audits/${audit.id}/edges?flagged=yes&pageSize=500`);
    const first = flagged.body.rows[0].edgeIndex;
    expect((await analyst.put(`/api/v1/audits/${audit.id}/edges/${first}/disposition`).send({ kind: 'accept', note: 'fine by me' })).status).toBe(403);
    await auditor.put(`/api/v1/audits/${audit.id}/edges/${first}/disposition`).send({ kind: 'monitor', note: 'watch the calibration' }).expect(200);
    for (const row of flagged.body.rows) {
      const res = await auditor.put(`/api/v1/audits/${audit.id}/edges/${row.edgeIndex}/disposition`).send({ kind: 'mitigate', note: `trim ${row.source} link gain` });
      expect(res.status).toBe(200);
      expect(res.body.disposition).toMatchObject({ kind: 'mitigate', by: 'Demo Auditor' });
    }
    const trail = await auditor.get(`/api/v1/audits/${audit.id}/trail`);
    const change = trail.body.entries.filter((e: { action: string; newValue: string }) => e.action === 'audit.disposition' && e.newValue.includes(`"edge":${first}`));
    expect(JSON.parse(change[1].oldValue)).toMatchObject({ kind: 'monitor' });
  });

  test('submit → sent back by the approver with a comment → reopened by the analyst → submitted again', async () => {
    await auditor.post(`/api/v1/audits/${audit.id}/submit`).send({ comment: 'all flagged edges disposed' }).expect(200);
    expect((await analyst.post(`/api/v1/audits/${audit.id}/lock`).send({ comment: 'nope' })).status).toBe(403);
    const back = await approver.post(`/api/v1/audits/${audit.id}/return`).send({ comment: 'state the calibration interval for the masts' });
    expect(back.body.state).toBe('sent-back');
    expect(back.body.lastComment).toMatchObject({ text: 'state the calibration interval for the masts', action: 'returned' });
    const mail = await w.db('outbox').where('subject', 'like', `%audit ${audit.id} was sent back%`);
    expect(mail.map((m) => m.rcpt_to).join(' ')).toMatch(/analyst@gannet-sound\.test/);
    expect((await auditor.post(`/api/v1/audits/${audit.id}/submit`).send({})).status).toBe(409);
    await analyst.post(`/api/v1/audits/${audit.id}/reopen`).send({ comment: 'interval added to the notes' }).expect(200);
    const again = await auditor.post(`/api/v1/audits/${audit.id}/submit`).send({});
    expect(again.body.state).toBe('awaiting-sign-off');
  });

  test('sealing needs a comment; the seal records who, when, meaning and a hash that verifies', async () => {
    expect((await approver.post(`/api/v1/audits/${audit.id}/lock`).send({ comment: '' })).status).toBe(400);
    const res = await approver.post(`/api/v1/audits/${audit.id}/lock`).send({ comment: 'Approved for the spring deployment.' });
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('sealed');
    expect(res.body.lock).toMatchObject({ by: { name: 'Demo Approver' }, meaning: 'approved', comment: 'Approved for the spring deployment.' });
    expect(res.body.lock.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(res.body.hashCheck).toEqual({ recomputed: res.body.lock.hash, matches: true });
  });

  test('after sealing, the API refuses every write', async () => {
    const edge = (await auditor.get(`/api/v1/audits/${audit.id}/edges?pageSize=1`)).body.rows[0].edgeIndex;
    const writes = [
      auditor.put(`/api/v1/audits/${audit.id}/edges/${edge}/disposition`).send({ kind: 'accept', note: 'changed my mind' }),
      auditor.post(`/api/v1/audits/${audit.id}/return`).send({ comment: 'reopen please' }),
      approver.post(`/api/v1/audits/${audit.id}/lock`).send({ comment: 'seal twice' }),
      analyst.post(`/api/v1/audits/${audit.id}/reopen`).send({}),
    ];
    for (const res of await Promise.all(writes)) {
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('sealed');
    }
  });

  test('after sealing, the database refuses every change too (triggers)', async () => {
    await expectRefusal(w.db('audit_edges').where({ audit_id: audit.id }).update({ class: 'linear' }), /sealed/);
    await expectRefusal(w.db('audit_dispositions').where({ audit_id: audit.id }).del(), /sealed/);
    await expectRefusal(w.db('audit_dispositions').insert({ audit_id: audit.id, edge_index: 0, kind: 'accept', note: 'x', by_user: 1, at: 'now' }), /sealed/);
    await expectRefusal(w.db('audits').where({ id: audit.id }).update({ state: 'in-review' }), /sealed/);
  });

  test('an edit made behind the triggers shows as a seal that no longer matches', async () => {
    await w.db.raw('DROP TRIGGER audit_edges_sealed_no_update');
    await w.db('audit_edges').where({ audit_id: audit.id, edge_index: 0 }).update({ tolerance: 123 });
    const res = await auditor.get(`/api/v1/audits/${audit.id}`);
    expect(res.body.hashCheck.matches).toBe(false);
  });

  test('the PDF report downloads', async () => {
    const res = await approver.get(`/api/v1/audits/${audit.id}/report.pdf`).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect((res.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });
});

describe('four-eyes rule', () => {
  test('an approver who started the audit may not seal it', async () => {
    const w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    try {
      const approverUser = await w.db('users').where({ email: 'approver@gannet-sound.test' }).first('id');
      await w.db('user_roles').insert({ user_id: approverUser.id, role: 'analyst' });
      const both = await signedIn(w, 'approver');
      const auditor = await signedIn(w, 'auditor');
      const a = await startAndFinish(w, both, 'Marrow Fen microgrid');
      const flagged = await auditor.get(`/api/v1/audits/${a.id}/edges?flagged=yes&pageSize=500`);
      for (const row of flagged.body.rows) await auditor.put(`/api/v1/audits/${a.id}/edges/${row.edgeIndex}/disposition`).send({ kind: 'accept', note: 'within margin' }).expect(200);
      await auditor.post(`/api/v1/audits/${a.id}/submit`).send({}).expect(200);
      const res = await both.post(`/api/v1/audits/${a.id}/lock`).send({ comment: 'my own work looks fine' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('four-eyes');
    } finally {
      await w.close();
    }
  }, 120_000);
});
