import type { Knex } from 'knex';
import { mkdtempSync, writeFileSync, mkdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { healthSchema } from '../../lib/schemas/health';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { freshDatabase } from './support/test-db';

const pkg = JSON.parse(readFileSync(path.resolve(__dirname, '../../package.json'), 'utf8'));

/** A tiny stand-in for the web export: the server's routing must not depend on the real build. */
function fakeWebRoot(): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-web-'));
  writeFileSync(path.join(dir, 'index.html'), '<p>overview page</p>');
  writeFileSync(path.join(dir, '+not-found.html'), '<p>no such page</p>');
  mkdirSync(path.join(dir, 'networks'));
  writeFileSync(path.join(dir, 'networks', 'index.html'), '<p>networks page</p>');
  writeFileSync(path.join(dir, 'networks', '[networkId].html'), '<p>one network</p>');
  mkdirSync(path.join(dir, '(app)'));
  writeFileSync(path.join(dir, '(app)', 'help.html'), '<p>help page</p>');
  return dir;
}

describe('health and routing', () => {
  let db: Knex;
  let app: ReturnType<typeof createApp>;
  const logged: string[] = [];

  beforeAll(async () => {
    db = await freshDatabase();
    const config = loadConfig({ HAIRLINE_DATABASE: ':memory:', HAIRLINE_WEB_ROOT: fakeWebRoot() }, os.tmpdir());
    app = createApp({ db, config, log: (m) => logged.push(m) });
  });
  afterAll(() => db.destroy());

  test('GET /api/v1/health answers 200 with the package version, a live database and who computes sweeps', async () => {
    const res = await request(app).get('/api/v1/health');
    expect(res.status).toBe(200);
    // The app without a runner sweeps on the calling thread: one "thread", never a queue.
    expect(res.body).toEqual({ status: 'ok', version: pkg.version, database: { ok: true }, jobs: { mode: 'threads', workers: 1 } });
    expect(healthSchema.parse(res.body)).toEqual(res.body);
  });

  test('an unknown API route gets a JSON 404 in the error envelope', async () => {
    const res = await request(app).post('/api/v1/no-such-thing').set('Host', 'hairline.test').set('Origin', 'http://hairline.test').send({});
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body).toEqual({ error: { code: 'not-found', message: 'No API route POST /api/v1/no-such-thing.' } });
  });

  test('a path under /api outside v1 is an API 404 too, not a web page', async () => {
    const res = await request(app).get('/api/v0/health');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not-found');
  });

  test('malformed JSON gets a 400 envelope, not a stack trace', async () => {
    const res = await request(app).post('/api/v1/health').set('Content-Type', 'application/json').send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad-json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts/);
  });

  test('exported pages are served by their route, groups and dynamic segments included', async () => {
    expect((await request(app).get('/')).text).toContain('overview page');
    expect((await request(app).get('/networks')).text).toContain('networks page');
    expect((await request(app).get('/networks/')).text).toContain('networks page');
    expect((await request(app).get('/networks/42')).text).toContain('one network');
    expect((await request(app).get('/help')).text).toContain('help page');
  });

  test('an unknown page gets the exported not-found page with status 404', async () => {
    const res = await request(app).get('/no/such/page');
    expect(res.status).toBe(404);
    expect(res.text).toContain('no such page');
  });

  test('health reports 503 when the database stops answering', async () => {
    const broken = await freshDatabase();
    await broken.destroy();
    const config = loadConfig({ HAIRLINE_DATABASE: ':memory:', HAIRLINE_WEB_ROOT: fakeWebRoot() }, os.tmpdir());
    const res = await request(createApp({ db: broken, config, log: () => {} })).get('/api/v1/health');
    expect(res.status).toBe(503);
    expect(res.body.database.ok).toBe(false);
  });
});
