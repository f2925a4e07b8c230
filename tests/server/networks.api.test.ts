import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { accountsWorld, signedIn, type AccountsWorld } from './support/accounts';

const fixture = (name: string) => path.resolve(__dirname, '../fixtures/formats', name);

async function rowCounts(db: Knex) {
  const [n] = await db('networks').count({ c: '*' });
  const [v] = await db('network_versions').count({ c: '*' });
  return { networks: Number(n.c), versions: Number(v.c) };
}

describe('networks API', () => {
  let w: AccountsWorld;
  let analyst: Awaited<ReturnType<typeof signedIn>>;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    analyst = await signedIn(w, 'analyst');
  });
  afterAll(() => w.close());

  test('a CSV upload creates a network and answers 201 with its first version', async () => {
    const res = await analyst
      .post('/api/v1/networks/import')
      .field('name', 'Korrin relays')
      .field('convention', 'in')
      .attach('file', fixture('korrin-relays.csv'));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ version: 1 });
    const detail = await analyst.get(`/api/v1/networks/${res.body.networkId}`);
    expect(detail.body.name).toBe('Korrin relays');
    expect(detail.body.versions).toHaveLength(1);
  });

  test('a TSV upload into the same network becomes version 2, and the diff is served', async () => {
    const list = await analyst.get('/api/v1/networks?q=Korrin');
    const id = list.body.networks[0].id;
    const res = await analyst.post('/api/v1/networks/import').field('networkId', String(id)).attach('file', fixture('korrin-relays.tsv'));
    expect(res.status).toBe(201);
    expect(res.body.version).toBe(2);
    const diff = await analyst.get(`/api/v1/networks/${id}/diff?from=1&to=2`);
    expect(diff.status).toBe(200);
    expect(Object.keys(diff.body).sort()).toEqual(['added', 'from', 'removed', 'reweighted', 'to']);
  });

  test('GraphML needs its weight key chosen; with it, the upload is stored', async () => {
    const without = await analyst.post('/api/v1/networks/import').field('name', 'Pump ring').attach('file', fixture('pump-ring-directed.graphml'));
    expect(without.status).toBe(422);
    expect(without.body.error.problems[0].code).toBe('missing-weight-key');
    const withKey = await analyst
      .post('/api/v1/networks/import')
      .field('name', 'Pump ring')
      .field('options', JSON.stringify({ graphmlWeightKey: 'coupling' }))
      .attach('file', fixture('pump-ring-directed.graphml'));
    expect(withKey.status).toBe(201);
  });

  test('pasted JSON text imports like a file', async () => {
    const text = readFileSync(fixture('pump-ring.json'), 'utf8');
    const res = await analyst.post('/api/v1/networks/import').send({ name: 'Pump ring pasted', format: 'json', text });
    expect(res.status).toBe(201);
  });

  test('a refused import answers 422 with every problem and its line, and stores nothing', async () => {
    const before = await rowCounts(w.db);
    const text = ['source,target,weight', 'a,b,1', 'b,c,NaN', 'c,a,-2', 'd,d,1', 'c,d,Infinity'].join('\n');
    const res = await analyst.post('/api/v1/networks/import').send({ name: 'Bad weights', format: 'csv', text });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('import-rejected');
    const byLine = Object.fromEntries(res.body.error.problems.map((p: { line: number; code: string }) => [p.line, p.code]));
    expect(byLine).toMatchObject({ 3: 'not-a-number', 4: 'weight-not-positive', 5: 'self-loop', 6: 'not-finite' });
    expect(await rowCounts(w.db)).toEqual(before);
  });

  test('an upload over the size limit answers 413 and stores nothing', async () => {
    const before = await rowCounts(w.db);
    const big = Buffer.alloc(17 * 1024 * 1024, 'a');
    const res = await analyst.post('/api/v1/networks/import').field('name', 'Too big').attach('file', big, 'huge.csv');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too-large');
    expect(await rowCounts(w.db)).toEqual(before);
  });

  test('neither a file nor text is a 400 naming the missing file', async () => {
    const res = await analyst.post('/api/v1/networks/import').send({ name: 'Empty' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('file');
  });

  test('a version answers with its edges, convention and (once computed) summary', async () => {
    const list = await analyst.get('/api/v1/networks?q=Marrow');
    const id = list.body.networks[0].id;
    const v = await analyst.get(`/api/v1/networks/${id}/versions/1`);
    expect(v.status).toBe(200);
    expect(v.body.convention).toBe('in');
    expect(v.body.edges).toHaveLength(14);
    expect(['pending', 'ready']).toContain(v.body.summaryState);
  });

  test('an auditor may read networks but not import them', async () => {
    const auditor = await signedIn(w, 'auditor');
    expect((await auditor.get('/api/v1/networks')).status).toBe(200);
    const res = await auditor.post('/api/v1/networks/import').send({ name: 'Nope', format: 'csv', text: 'source,target,weight\na,b,1' });
    expect(res.status).toBe(403);
  });
});

describe('import limits from the configuration', () => {
  test('HAIRLINE_MAX_NODES refuses a larger network with a problem saying so', async () => {
    const w = await accountsWorld({ HAIRLINE_MAX_NODES: '3' });
    try {
      const analyst = await signedIn(w, 'analyst');
      const text = ['source,target,weight', 'a,b,1', 'b,c,1', 'c,d,1'].join('\n');
      const res = await analyst.post('/api/v1/networks/import').send({ name: 'Four nodes', format: 'csv', text });
      expect(res.status).toBe(422);
      expect(res.body.error.problems[0].code).toBe('too-many-nodes');
      expect(res.body.error.problems[0].message).toMatch(/3/);
    } finally {
      await w.close();
    }
  });
});
