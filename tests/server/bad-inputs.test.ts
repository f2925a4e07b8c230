/**
 * The bad-input corpus (tests/fixtures/bad-inputs) against the running app:
 * every refused input answers with its exact status, code and message, lists
 * its exact problems, stores nothing (no table gains or loses a row) and logs
 * no server error; inputs that only look hostile are stored exactly as
 * written and leave the CSV export neutralised.
 */
import type { Knex } from 'knex';
import Papa from 'papaparse';
import { listRoutes } from '../../server/http/route-list';
import { acceptedCases, importCases, type Expected, type Message, type Send } from '../fixtures/bad-inputs/cases';
import { wrongShapes, type Caller, type WorldIds } from '../fixtures/bad-inputs/wrong-shapes';
import { accountsWorld, browser, signedIn, type AccountsWorld } from './support/accounts';
import { startAndFinish, waitForSweep, type Agent } from './support/audits';

/** Rows in every table of the database, by table name. */
async function tableCounts(db: Knex): Promise<Record<string, number>> {
  const tables: string[] = await db('sqlite_master').where({ type: 'table' }).andWhere('name', 'not like', 'sqlite_%').orderBy('name').pluck('name');
  const counts: Record<string, number> = {};
  for (const table of tables) counts[table] = Number((await db(table).count({ n: '*' }))[0].n);
  return counts;
}

const matches = (m: Message) => (typeof m === 'string' ? m : expect.stringMatching(m));
const pairs = (problems: { code: string; message: string }[]) => problems.map((p) => [p.code, p.message]);

function sendImport(agent: Agent, send: Send) {
  const req = agent.post('/api/v1/networks/import');
  switch (send.kind) {
    case 'json':
      return req.send(send.body() as object);
    case 'raw':
      return req.set('Content-Type', send.contentType).send(send.body());
    case 'upload': {
      for (const [k, v] of Object.entries(send.fields ?? {})) req.field(k, v);
      for (const f of send.files) {
        const content = f.content();
        req.attach(f.field, Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), f.fileName);
      }
      return req;
    }
  }
}

function expectAnswer(res: { status: number; body: { error?: { code: string; message: string; problems?: { code: string; message: string }[] } } }, e: Expected) {
  expect({ status: res.status, code: res.body.error?.code, message: res.body.error?.message }).toEqual({ status: e.status, code: e.code, message: matches(e.message) });
  const problems = res.body.error?.problems ?? [];
  if (e.problems) expect(pairs(problems)).toEqual(e.problems.map(([c, m]) => [c, matches(m)]));
  if (e.problemCount !== undefined) expect(problems).toHaveLength(e.problemCount);
  if (e.someProblems) expect(pairs(problems)).toEqual(expect.arrayContaining(e.someProblems.map(([c, m]) => [c, matches(m)])));
  // No stack frames or file paths reach a client.
  expect(JSON.stringify(res.body)).not.toMatch(/\.ts:\d+|node_modules|at [A-Za-z.]+ \(/);
}

describe('bad-input corpus: imports', () => {
  let w: AccountsWorld;
  let analyst: Agent;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    analyst = await signedIn(w, 'analyst');
  });
  afterAll(() => w.close());

  test('the corpus holds at least 40 named cases, each name once', () => {
    const names = [...importCases, ...acceptedCases].map((c) => c.name);
    expect(names.length + Object.keys(wrongShapes).length).toBeGreaterThanOrEqual(40);
    expect(new Set(names).size).toBe(names.length);
  });

  test.each(importCases.map((c) => [c.name, c] as const))('%s is refused and stores nothing', async (_name, c) => {
    const before = await tableCounts(w.db);
    const res = await sendImport(analyst, c.send);
    expectAnswer(res, c.expect);
    expect(await tableCounts(w.db)).toEqual(before);
    expect(w.logged).toEqual([]); // nothing reached the 500 handler
  }, 60_000);

  test.each(acceptedCases.map((c) => [c.name, c] as const))('%s is stored exactly as written', async (_name, c) => {
    const res = await sendImport(analyst, c.send);
    expect(res.status).toBe(201);
    const version = await analyst.get(`/api/v1/networks/${res.body.networkId}/versions/${res.body.version}`);
    expect(version.status).toBe(200);
    expect(version.body.nodes).toEqual(c.nodes);
    for (const e of version.body.edges) expect(c.nodes).toEqual(expect.arrayContaining([e.source, e.target]));
    // A "__proto__" key in a file is data, never a way into Object.prototype.
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

describe('bad-input corpus: formula-looking names in the CSV export', () => {
  let w: AccountsWorld;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
  });
  afterAll(() => w.close());

  test('GET edges.csv neutralises every name and note a spreadsheet would run', async () => {
    const analyst = await signedIn(w, 'analyst');
    const auditor = await signedIn(w, 'auditor');
    const formulaCase = acceptedCases.find((c) => c.name === 'ok-formula-names')!;
    const imported = await sendImport(analyst, formulaCase.send);
    expect(imported.status).toBe(201);
    const started = await analyst.post('/api/v1/audits').send({ networkId: imported.body.networkId, version: 1 });
    expect(started.status).toBe(201);
    const audit = await waitForSweep(analyst, started.body.id);
    expect(audit.state).toBe('in-review');
    const note = '=HYPERLINK("http://198.51.100.7/","review")';
    await auditor.put(`/api/v1/audits/${audit.id}/edges/0/disposition`).send({ kind: 'monitor', note }).expect(200);

    const res = await auditor.get(`/api/v1/audits/${audit.id}/edges.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const stored = (await analyst.get(`/api/v1/networks/${imported.body.networkId}/versions/1`)).body.edges as { source: string; target: string }[];
    expect(parsed.data).toHaveLength(stored.length);
    const escaped = (name: string) => (/^[=+\-@]/.test(name) ? `'${name}` : name);
    expect(parsed.data.map((r) => [r.source, r.target])).toEqual(stored.map((e) => [escaped(e.source), escaped(e.target)]));
    expect(parsed.data[0].disposition_note).toBe(`'${note}`);
    for (const row of parsed.data) {
      for (const column of ['source', 'target', 'disposition_note', 'disposition_by', 'class', 'flags']) expect(row[column]).not.toMatch(/^[=+\-@\t\r]/);
    }
  }, 120_000);
});

describe('bad-input corpus: a JSON body of the wrong shape on every write route', () => {
  let w: AccountsWorld;
  const agents = {} as Record<Caller, Agent>;
  let ids: WorldIds;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    agents.anonymous = browser(w.app);
    for (const role of ['admin', 'analyst', 'auditor', 'approver'] as const) agents[role] = await signedIn(w, role);
    const token = await agents.analyst.post('/api/v1/tokens').send({ name: 'Korrin relay script' });
    const audit = await startAndFinish(w, agents.analyst, 'Marrow Fen microgrid');
    expect(audit.state).toBe('in-review');
    ids = { userId: (await agents.approver.get('/api/v1/auth/me')).body.id, tokenId: token.body.id, auditId: audit.id };
    // The audit's "ready for review" mail reaches the outbox through the local SMTP fake a moment later.
    for (let i = 0; i < 200 && Number((await w.db('outbox').count({ n: '*' }))[0].n) === 0; i++) await new Promise((r) => setTimeout(r, 50));
  }, 120_000);
  afterAll(() => w.close());

  test('every write route the server answers has a case, and every case a route', () => {
    const writes = listRoutes((w.app as unknown as { router: Parameters<typeof listRoutes>[0] }).router)
      .filter((r) => r.path.startsWith('/api/') && ['POST', 'PUT', 'PATCH', 'DELETE'].includes(r.method))
      .map((r) => `${r.method} ${r.path}`);
    expect(writes.filter((r) => !(r in wrongShapes))).toEqual([]);
    expect(Object.keys(wrongShapes).filter((r) => !writes.includes(r))).toEqual([]);
  });

  test.each(Object.entries(wrongShapes))('%s', async (route, c) => {
    const [method, pattern] = route.split(' ');
    const before = await tableCounts(w.db);
    const m = method.toLowerCase() as 'post' | 'put' | 'delete';
    const res = await agents[c.as][m](c.path ? c.path(ids) : pattern).set('Content-Type', 'application/json').send(c.body);
    expect(res.status).toBe(c.expect.status);
    if (c.expect.code) expect(res.body.error.code).toBe(c.expect.code);
    if (c.expect.message) expect(res.body.error.message).toEqual(matches(c.expect.message));
    expect(await tableCounts(w.db)).toEqual(before);
    expect(w.logged).toEqual([]);
  });
});
