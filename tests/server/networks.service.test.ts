import type { Knex } from 'knex';
import { eigs } from 'mathjs';
import { createInlinePool } from '../../server/jobs/pool';
import { SummaryQueue } from '../../server/networks/summaries';
import { diffVersions, importNetwork, listNetworks, networkDetail, versionDetail, type NetworkDeps } from '../../server/networks/service';
import type { RequestUser } from '../../server/auth/require-roles';
import { importRequestSchema } from '../../lib/schemas/network';
import { HttpError } from '../../server/http/errors';
import { freshDatabase } from './support/test-db';

const analyst: RequestUser = { id: 2, email: 'analyst@gannet-sound.test', displayName: 'Demo Analyst', roles: ['analyst'], via: 'session' };
const csv = (rows: string[]) => ['source,target,weight', ...rows].join('\n');

async function counts(db: Knex) {
  const n = await db('networks').count({ c: '*' });
  const v = await db('network_versions').count({ c: '*' });
  return { networks: Number(n[0].c), versions: Number(v[0].c) };
}

describe('networks service', () => {
  let db: Knex;
  let deps: NetworkDeps;
  beforeAll(async () => {
    db = await freshDatabase({ seed: true });
    deps = { db, summaries: new SummaryQueue(db, createInlinePool()), limits: { maxNodes: 2000, maxEdges: 20000 } };
  });
  afterAll(() => db.destroy());

  const run = (fields: Record<string, unknown>, text: string) =>
    importNetwork(deps, analyst, importRequestSchema.parse({ format: 'csv', ...fields }), text);

  test('a new network is stored as version 1 and a re-import becomes version 2', async () => {
    const first = await run({ name: 'Korrin pump ring' }, csv(['p1,p2,1', 'p2,p3,1', 'p3,p1,1']));
    expect(first.version).toBe(1);
    const second = await run({ networkId: first.networkId }, csv(['p1,p2,1', 'p2,p3,2.5', 'p3,p4,1', 'p4,p1,1']));
    expect(second).toMatchObject({ networkId: first.networkId, version: 2 });
    const detail = await networkDetail(db, first.networkId);
    expect(detail.versions.map((v) => v.version)).toEqual([2, 1]);
  });

  test('the diff lists edges added, removed and re-weighted', async () => {
    const id = (await listNetworks(db, 'Korrin', 'name'))[0].id;
    const diff = await diffVersions(db, id, 1, 2);
    expect(diff.added).toEqual([
      { source: 'p3', target: 'p4', weight: 1 },
      { source: 'p4', target: 'p1', weight: 1 },
    ]);
    expect(diff.removed).toEqual([{ source: 'p3', target: 'p1', weight: 1 }]);
    expect(diff.reweighted).toEqual([{ source: 'p2', target: 'p3', before: 1, after: 2.5 }]);
  });

  test('a rejected import stores nothing and names every bad line', async () => {
    const before = await counts(db);
    let error: HttpError | undefined;
    try {
      await run({ name: 'Broken ring' }, csv(['a,b,1', 'b,c,abc', 'c,c,1', 'a,b,2']));
    } catch (e) {
      error = e as HttpError;
    }
    expect(error?.status).toBe(422);
    const problems = error!.problems as Array<{ code: string; line?: number; message: string }>;
    expect(problems.find((p) => p.code === 'not-a-number')?.line).toBe(3);
    expect(problems.find((p) => p.code === 'self-loop')?.line).toBe(4);
    expect(problems.find((p) => p.code === 'duplicate-edge')?.message).toMatch(/2.*5|5.*2/);
    expect(await counts(db)).toEqual(before);
  });

  test('a second network with the same name is refused with 409', async () => {
    await expect(run({ name: 'korrin PUMP ring' }, csv(['x,y,1']))).rejects.toMatchObject({ status: 409, code: 'name-taken' });
  });

  test('the stored summary of a symmetric network matches an outside eigen-solver (mathjs)', async () => {
    // Reference: mathjs eigs on the symmetric Laplacian (general-purpose library, not this project's code).
    const demo = (await listNetworks(db, 'Quarry Lane', 'name'))[0];
    await deps.summaries.schedule((await db('network_versions').where({ network_id: demo.id }).first('id')).id);
    const v = await versionDetail(db, demo.id, 1);
    expect(v.summaryState).toBe('ready');
    const index = new Map(v.nodes.map((n, i) => [n, i]));
    const L = v.nodes.map(() => v.nodes.map(() => 0));
    for (const e of v.edges) {
      const s = index.get(e.source)!;
      const t = index.get(e.target)!;
      L[t][t] += e.weight;
      L[t][s] -= e.weight;
    }
    const values = (eigs(L).values as unknown as number[]).slice().sort((a, b) => a - b);
    expect(v.summary!.lambda2.re).toBeCloseTo(values[1], 9);
    expect(v.summary!.rooted).toBe(true);
    expect(v.summary!.spectrum).toHaveLength(v.nodes.length);
  });

  test('a network with a cut-off part reports λ2 = 0 and names the cut-off nodes', async () => {
    // Two separate pairs: no node reaches every other, so 0 is a repeated eigenvalue (common practice, no source).
    const r = await run({ name: 'Split pair' }, csv(['a,b,1', 'c,d,1']));
    await deps.summaries.idle();
    const v = await versionDetail(db, r.networkId, 1);
    expect(v.summary!.rooted).toBe(false);
    expect(v.summary!.lambda2.re).toBe(0);
    expect(v.summary!.cutOff.length).toBeGreaterThan(0);
  });

  test('search matches name or description literally; sort by nodes puts the largest first', async () => {
    expect((await listNetworks(db, '%', 'name')).length).toBe(0);
    const byNodes = await listNetworks(db, undefined, 'nodes');
    const sizes = byNodes.map((n) => n.latest.nodeCount);
    expect(sizes).toEqual([...sizes].sort((a, b) => b - a));
    expect((await listNetworks(db, 'droop', 'name')).map((n) => n.name)).toEqual(['Marrow Fen microgrid']);
  });
});
