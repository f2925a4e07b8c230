import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { randomNetwork } from '../../lib/spectral';
import { startServer, type RunningServer } from '../../server';
import { loadConfig } from '../../server/config';
import { demo } from './support/accounts';

/**
 * The real server with its real worker threads: a large import's spectrum
 * summary (one dense eigen-solve, tens of seconds here) must not hold up an
 * audit of a small network started after it. Before summaries had a thread
 * of their own, the audit's chunks queued behind the solve.
 */
describe('import summaries and audit sweeps run on separate threads', () => {
  let running: RunningServer;
  let dir: string;

  beforeAll(async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-lanes-'));
    const config = loadConfig({ HAIRLINE_PORT: '0', HAIRLINE_DATABASE: path.join(dir, 'hairline.sqlite3'), HAIRLINE_WEB_ROOT: dir });
    running = await startServer(config, { seed: true });
  }, 60_000);

  afterAll(async () => {
    await running?.close();
    rmSync(dir, { recursive: true, force: true });
  }, 60_000);

  test('an audit of the 17-edge demo relay finishes while a 900-node summary is still being computed', async () => {
    const url = new URL(running.url);
    const agent = request.agent(running.url).set('Origin', url.origin);
    expect((await agent.post('/api/v1/auth/sign-in').send({ email: demo.analyst.email, password: demo.analyst.password })).status).toBe(200);

    const big = randomNetwork({ nodes: 900, edgesPerNode: 5, seed: 11 });
    const text = ['source,target,weight', ...big.edges.map((e) => `${e.source},${e.target},${e.weight}`)].join('\n');
    const imported = await agent.post('/api/v1/networks/import').send({ name: 'Wide sensor field', format: 'csv', text });
    expect(imported.status).toBe(201);
    const bigSummary = async () => (await agent.get(`/api/v1/networks/${imported.body.networkId}/versions/1`)).body.summaryState as string;

    const started = await agent.post('/api/v1/audits').send({ networkId: 1, version: 1, settings: { ladder: { from: 2, to: 4, step: 1 }, signs: ['plus'] } });
    expect(started.status).toBe(201);
    let state = started.body.state as string;
    for (let i = 0; i < 600 && ['queued', 'sweeping'].includes(state); i++) {
      await new Promise((r) => setTimeout(r, 100));
      state = (await agent.get(`/api/v1/audits/${started.body.id}`)).body.state;
    }
    expect(state).toBe('in-review');
    // The large summary is still on its own thread when the audit is done.
    expect(await bigSummary()).toBe('pending');
  }, 120_000);
});
