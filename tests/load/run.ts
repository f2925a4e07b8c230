/**
 * `npm run load [-- --connections 50 --duration 30]`: a load run against a
 * local server this script starts itself (a child process on a free port,
 * a fresh seeded database in a temporary folder). Each connection is its own
 * signed-in session; they cycle through the read routes of the API while an
 * audit sweep runs on the worker pool (a new one is started whenever the
 * last one finishes). Prints requests/s, latency percentiles, errors and
 * status counts; exits 1 on any 5xx or connection error. Not part of
 * `npm test`: figures, not assertions.
 */
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { demoUser } from '../../seeds/data/demo';
import { korrinGrid } from '../support/korrin-grid';
import { serverEnv, Session, startChildServer, stopChildServer } from '../support/spawned';

interface Histogram {
  average: number;
  p50: number;
  p90: number;
  p99: number;
  max: number;
}
interface Result {
  requests: Histogram & { total: number };
  latency: Histogram;
  duration: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  statusCodeStats: Record<string, { count: number }>;
}
interface Client {
  setRequests(requests: { method: string; path: string; headers: Record<string, string> }[]): void;
}
// autocannon ships no type declarations.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (options: object) => Promise<Result>;

function option(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  const value = i >= 0 ? Number(process.argv[i + 1]) : fallback;
  if (!Number.isFinite(value) || value <= 0) throw new Error(`--${name} needs a positive number`);
  return value;
}

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));
const account = demoUser;

async function main(): Promise<number> {
  const connections = option('connections', 50);
  const duration = option('duration', 30);
  const dbFile = path.join(mkdtempSync(path.join(os.tmpdir(), 'hairline-load-')), 'hairline.sqlite3');
  console.log(`Starting a server on a fresh database (${dbFile})…`);
  const server = await startChildServer(serverEnv(dbFile, { HAIRLINE_SIGN_IN_LIMIT: '10000' }));
  try {
    const analyst = await Session.signIn(server.url, account('analyst').email, account('analyst').password);
    const imported = await analyst.send('POST', '/api/v1/networks/import', { name: 'Korrin load grid', format: 'csv', text: korrinGrid(120, 6) });
    if (imported.status !== 201) throw new Error(`import answered ${imported.status}`);
    const networkId = imported.body.networkId as number;
    const startAudit = async () => {
      const res = await analyst.send('POST', '/api/v1/audits', { networkId, version: 1 });
      if (res.status !== 201) throw new Error(`starting an audit answered ${res.status}`);
      return res.body.id as number;
    };
    let auditId = await startAudit();
    const firstAudit = auditId;

    // One signed-in session per connection, spread over the four roles.
    console.log(`Signing in ${connections} sessions…`);
    const roles = ['analyst', 'auditor', 'approver', 'admin'];
    const cookies: string[] = [];
    for (let i = 0; i < connections; i++) {
      const role = roles[i % roles.length];
      cookies.push((await Session.signIn(server.url, account(role).email, account(role).password)).cookieHeader);
    }

    // Keep a sweep running for the whole run.
    let sweeps = 1;
    let loading = true;
    const keepSweeping = (async () => {
      while (loading) {
        const state = (await analyst.get(`/api/v1/audits/${auditId}`)).body.state;
        if (!['queued', 'sweeping'].includes(state)) {
          auditId = await startAudit();
          sweeps += 1;
        }
        await pause(500);
      }
    })();

    const demoNetwork = (await analyst.get('/api/v1/networks?q=Gannet')).body.networks[0].id as number;
    const readPaths = [
      '/api/v1/auth/me',
      '/api/v1/networks',
      `/api/v1/networks/${networkId}`,
      `/api/v1/networks/${demoNetwork}/versions/1`,
      '/api/v1/audits',
      `/api/v1/audits/${firstAudit}`,
      `/api/v1/audits/${firstAudit}/edges?page=1&pageSize=50`,
      `/api/v1/audits/${firstAudit}/trail`,
      '/api/v1/health',
    ];
    let next = 0;
    console.log(`Load: ${connections} connections for ${duration} s over ${readPaths.length} read routes, while audit ${auditId} sweeps…\n`);
    const result = await autocannon({
      url: server.url,
      connections,
      duration,
      setupClient: (client: Client) => {
        const cookie = cookies[next++ % cookies.length];
        client.setRequests(readPaths.map((p) => ({ method: 'GET', path: p, headers: { cookie, origin: server.url } })));
      },
    });
    loading = false;
    await keepSweeping;
    const progress = (await analyst.get(`/api/v1/audits/${firstAudit}`)).body.progress;

    const byStatus = Object.entries(result.statusCodeStats)
      .map(([code, s]) => `${code}: ${s.count}`)
      .join(', ');
    const fiveHundreds = Object.entries(result.statusCodeStats).reduce((n, [code, s]) => (Number(code) >= 500 ? n + Number(s.count) : n), 0);
    const serverErrors = server.output().split('\n').filter((l) => l.startsWith('[hairline]'));
    console.log('── Hairline load run ─────────────────────────────────');
    console.log(`connections ${connections}, duration ${result.duration} s, requests ${result.requests.total}`);
    console.log(`requests/s  average ${result.requests.average.toFixed(1)}, p50 ${result.requests.p50}, max ${result.requests.max}`);
    console.log(`latency ms  p50 ${result.latency.p50}, p90 ${result.latency.p90}, p99 ${result.latency.p99}, max ${result.latency.max}, average ${result.latency.average.toFixed(1)}`);
    console.log(`errors ${result.errors} (timeouts ${result.timeouts}), non-2xx ${result.non2xx}, 5xx ${fiveHundreds}`);
    console.log(`status codes ${byStatus}`);
    console.log(`sweeps during the run: ${sweeps} started; the first at ${progress.done}/${progress.total} edges`);
    console.log(`server error log lines: ${serverErrors.length}`);
    for (const line of serverErrors.slice(0, 10)) console.log(`  ${line}`);
    return fiveHundreds > 0 || result.errors > 0 ? 1 : 0;
  } finally {
    await stopChildServer(server);
  }
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error('load run failed:', err instanceof Error ? err.message : err);
    process.exit(2);
  },
);
