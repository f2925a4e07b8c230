/**
 * Security evidence beside auth.test.ts (which covers HttpOnly, SameSite,
 * Secure behind a TLS proxy, the Origin check and throttling):
 * - the full set of security headers on every kind of response, API answers
 *   never cacheable;
 * - the session cookie's remaining flags: only issued by a sign-in, Path=/,
 *   expiring with the idle timeout, signed, cleared by sign-out;
 * - secrets never logged: the real server's whole output (stdout and stderr)
 *   through sign-ins with right and wrong passwords, an invitation, a
 *   password reset, a password change and API token use holds no password,
 *   link token, API token or session id — and neither do the trail, the
 *   sessions or the token tables.
 */
import Database from 'better-sqlite3';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { demoUser, demoUsers } from '../../seeds/data/demo';
import { serverEnv, Session, startChildServer, stopChildServer, type ChildServer } from '../support/spawned';
import { accountsWorld, browser, host, signedIn, type AccountsWorld } from './support/accounts';

const account = demoUser;

/** What helmet is set up to send (server/http/security-headers.ts), header by header. */
const expectedHeaders = {
  'cross-origin-opener-policy': 'same-origin',
  'cross-origin-resource-policy': 'same-origin',
  'origin-agent-cluster': '?1',
  'referrer-policy': 'no-referrer',
  'strict-transport-security': 'max-age=31536000; includeSubDomains',
  'x-content-type-options': 'nosniff',
  'x-dns-prefetch-control': 'off',
  'x-download-options': 'noopen',
  'x-frame-options': 'SAMEORIGIN',
  'x-permitted-cross-domain-policies': 'none',
  'x-xss-protection': '0',
};

function cspDirectives(header: string): Record<string, string> {
  return Object.fromEntries(header.split(';').map((d) => d.trim().split(/\s+/)).map(([name, ...values]) => [name, values.join(' ')]));
}

describe('security headers on every kind of response', () => {
  let w: AccountsWorld;
  let auditId: number;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    const analyst = await signedIn(w, 'analyst');
    const net = (await analyst.get('/api/v1/networks?q=Marrow')).body.networks[0];
    auditId = (await analyst.post('/api/v1/audits').send({ networkId: net.id, version: 1 })).body.id;
  });
  afterAll(() => w.close());

  const cases: [string, (w: AccountsWorld) => Promise<request.Response>, number, boolean][] = [
    ['an API answer', async (w) => (await signedIn(w, 'analyst')).get('/api/v1/networks'), 200, true],
    ['a refusal for no session', (w) => request(w.app).get('/api/v1/audits'), 401, true],
    ['an unknown API route', (w) => request(w.app).get('/api/v1/no-such-thing'), 404, true],
    ['an invalid body', (w) => browser(w.app).post('/api/v1/auth/sign-in').send({ email: 'x' }), 400, true],
    ['an oversized body', (w) => browser(w.app).post('/api/v1/auth/sign-in').set('Content-Type', 'application/json').send(`{"email":"${'x'.repeat(1_100_000)}"}`), 413, true],
    ['a CSV export', async (w) => (await signedIn(w, 'auditor')).get(`/api/v1/audits/${auditId}/edges.csv`), 200, true],
    ['a page of the web app', (w) => request(w.app).get('/no-such-page'), 404, false],
  ];

  test.each(cases)('%s', async (_label, send, status, isApi) => {
    const res = await send(w);
    expect(res.status).toBe(status);
    for (const [name, value] of Object.entries(expectedHeaders)) expect([name, res.headers[name]]).toEqual([name, value]);
    expect(res.headers['x-powered-by']).toBeUndefined();
    const csp = cspDirectives(res.headers['content-security-policy']);
    expect(csp).toMatchObject({ 'default-src': "'self'", 'object-src': "'none'", 'frame-ancestors': "'self'", 'base-uri': "'self'", 'form-action': "'self'", 'script-src-attr': "'none'", 'connect-src': "'self'" });
    expect(csp['script-src']).toMatch(/^'self' 'sha256-[A-Za-z0-9+/]+=*'$/); // no 'unsafe-inline', no 'unsafe-eval'
    // Account data and records never land in a browser or proxy cache.
    if (isApi) expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('the session cookie', () => {
  let w: AccountsWorld;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
  });
  afterAll(() => w.close());

  const cookiesOf = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []);

  test('is set by a sign-in only: not for visitors, refusals or failed attempts', async () => {
    expect(cookiesOf(await request(w.app).get('/api/v1/health'))).toEqual([]);
    expect(cookiesOf(await request(w.app).get('/api/v1/networks'))).toEqual([]);
    expect(cookiesOf(await browser(w.app).post('/api/v1/auth/sign-in').send({ email: account('admin').email, password: 'tideline-wrong-0000' }))).toEqual([]);
    expect(cookiesOf(await browser(w.app).post('/api/v1/auth/password-reset/request').send({ email: account('admin').email }))).toEqual([]);
  });

  test('is scoped to the whole site, expires with the idle timeout and carries its flags on every renewal', async () => {
    const agent = browser(w.app);
    const signIn = await agent.post('/api/v1/auth/sign-in').send({ email: account('auditor').email, password: account('auditor').password });
    const renewed = await agent.get('/api/v1/audits');
    for (const res of [signIn, renewed]) {
      const [cookie] = cookiesOf(res);
      expect(cookie.split('; ').slice(1).sort()).toEqual(['Expires=' + /Expires=([^;]+)/.exec(cookie)![1], 'HttpOnly', 'Path=/', 'SameSite=Lax'].sort());
      // Default idle timeout: 30 minutes after this response.
      const lifetime = Date.parse(/Expires=([^;]+)/.exec(cookie)![1]) - Date.parse(res.headers.date);
      expect(lifetime).toBeGreaterThanOrEqual(30 * 60_000 - 1000);
      expect(lifetime).toBeLessThanOrEqual(30 * 60_000 + 1000);
    }
  });

  test('is signed: a session id with its signature altered is refused', async () => {
    const agent = browser(w.app);
    const res = await agent.post('/api/v1/auth/sign-in').send({ email: account('approver').email, password: account('approver').password });
    const value = /hairline\.sid=([^;]+)/.exec(cookiesOf(res)[0])![1];
    expect(decodeURIComponent(value)).toMatch(/^s:[\w-]+\.[\w+/]+$/);
    const forged = value.slice(0, -3) + (value.endsWith('AAA') ? 'BBB' : 'AAA');
    expect((await request(w.app).get('/api/v1/auth/me').set('Host', host).set('Cookie', `hairline.sid=${forged}`)).status).toBe(401);
    expect((await request(w.app).get('/api/v1/auth/me').set('Host', host).set('Cookie', `hairline.sid=${value}`)).status).toBe(200);
  });

  test('is cleared by sign-out', async () => {
    const agent = await signedIn(w, 'analyst');
    const res = await agent.post('/api/v1/auth/sign-out');
    expect(cookiesOf(res)).toEqual(['hairline.sid=; Path=/; Expires=Thu, 01 Jan 1970 00:00:00 GMT']);
  });
});

describe('secrets never reach the logs', () => {
  const dbFile = path.join(mkdtempSync(path.join(os.tmpdir(), 'hairline-secrets-')), 'hairline.sqlite3');
  let server: ChildServer | undefined;
  afterAll(async () => {
    if (server) await stopChildServer(server, 'SIGKILL');
  });

  /** The token in the newest link e-mailed to `to` (links carry it after #token=). */
  async function linkToken(admin: Session, to: string): Promise<string> {
    for (let i = 0; i < 200; i++) {
      const messages = (await admin.get('/api/v1/outbox')).body.messages as { to: string[]; text: string }[];
      const mine = messages.find((m) => m.to.includes(to));
      const token = mine && /#token=([A-Za-z0-9_-]+)/.exec(mine.text)?.[1];
      if (token) return token;
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error(`no link e-mailed to ${to}`);
  }

  test('sign-ins, an invitation, a reset, a password change and API tokens leave no secret in the output, trail or tables', async () => {
    server = await startChildServer(serverEnv(dbFile));
    const secrets: string[] = demoUsers.map((u) => u.password);
    const wrongPasswords = ['tideline-analyst-3908', 'Korrin-guess-1!'];
    secrets.push(...wrongPasswords);

    const admin = await Session.signIn(server.url, account('admin').email, account('admin').password);
    const analyst = await Session.signIn(server.url, account('analyst').email, account('analyst').password);
    for (const wrong of wrongPasswords) expect((await new Session(server.url).send('POST', '/api/v1/auth/sign-in', { email: account('analyst').email, password: wrong })).status).toBe(401);
    expect((await new Session(server.url).send('POST', '/api/v1/auth/sign-in', { email: 'nobody@korrin.test', password: wrongPasswords[1] })).status).toBe(401);

    // Invitation: the link token and the password chosen with it.
    const invited = 'tern.watch@gannet-sound.test';
    expect((await admin.send('POST', '/api/v1/users', { email: invited, displayName: 'Tern Watch', roles: ['auditor'] })).status).toBe(201);
    const invitation = await linkToken(admin, invited);
    const invitedPassword = 'shingle-beacon-lamp-5521';
    secrets.push(invitation, invitedPassword);
    expect((await new Session(server.url).send('POST', '/api/v1/auth/invitation/accept', { token: invitation, password: invitedPassword })).status).toBe(200);
    await Session.signIn(server.url, invited, invitedPassword);

    // Password reset for the auditor, then sign-in with the new password.
    expect((await new Session(server.url).send('POST', '/api/v1/auth/password-reset/request', { email: account('auditor').email })).status).toBe(202);
    const reset = await linkToken(admin, account('auditor').email);
    const resetPassword = 'ebb-tide-ledger-3390';
    secrets.push(reset, resetPassword);
    expect((await new Session(server.url).send('POST', '/api/v1/auth/password-reset/complete', { token: reset, password: resetPassword })).status).toBe(200);
    await Session.signIn(server.url, account('auditor').email, resetPassword);

    // A password change by the analyst, with a wrong current password first.
    const changed = 'quay-lantern-survey-8812';
    secrets.push(changed);
    expect((await analyst.send('PUT', '/api/v1/auth/password', { currentPassword: wrongPasswords[0], newPassword: changed })).status).not.toBe(204);
    const again = await Session.signIn(server.url, account('analyst').email, account('analyst').password);
    expect((await again.send('PUT', '/api/v1/auth/password', { currentPassword: account('analyst').password, newPassword: changed })).status).toBe(204);
    const analystNow = await Session.signIn(server.url, account('analyst').email, changed);

    // An API token, used once, and a wrong one.
    const created = await analystNow.send('POST', '/api/v1/tokens', { name: 'Korrin relay script' });
    expect(created.status).toBe(201);
    const token = created.body.secret as string;
    expect(token).toMatch(/^hl_/);
    secrets.push(token);
    const bearer = (value: string) => fetch(`${server!.url}/api/v1/networks`, { headers: { Authorization: `Bearer ${value}` } });
    expect((await bearer(token)).status).toBe(200);
    expect((await bearer(`${token.slice(0, -4)}zzzz`)).status).toBe(401);

    // Session ids are secrets too.
    for (const s of [admin, analyst, again, analystNow]) secrets.push(decodeURIComponent(s.cookieHeader.replace('hairline.sid=', '')).replace(/^s:/, '').split('.')[0]);

    expect(await stopChildServer(server)).toEqual({ code: 0, signal: null });
    const output = server.output();
    server = undefined;
    expect(output).toMatch(/Hairline is serving on/); // the capture works
    for (const secret of secrets) expect({ secret, inLog: output.includes(secret) }).toEqual({ secret, inLog: false });

    const db = new Database(dbFile, { readonly: true });
    try {
      const dump = (table: string) => JSON.stringify(db.prepare(`SELECT * FROM "${table}"`).all());
      for (const table of ['events', 'sessions', 'api_tokens', 'account_links', 'users']) {
        const text = dump(table);
        for (const secret of secrets) {
          // A session row is keyed by its own id; nothing else may hold a secret.
          if (table === 'sessions' && !demoUsers.some((u) => u.password === secret) && /^[\w-]{32}$/.test(secret)) continue;
          expect({ table, secret, stored: text.includes(secret) }).toEqual({ table, secret, stored: false });
        }
      }
    } finally {
      db.close();
    }
  }, 120_000);
});
