import request from 'supertest';
import { verifyTrail } from '../../server/trail/service';
import { accountsWorld, browser, demo, host, origin, sessionIdOf, signedIn, type AccountsWorld } from './support/accounts';

describe('sign-in, sessions and request defences', () => {
  let w: AccountsWorld;
  beforeAll(async () => {
    w = await accountsWorld();
  });
  afterAll(() => w.close());

  test('the right password signs in, sets an httpOnly SameSite=Lax cookie (not Secure over HTTP) and /me answers', async () => {
    const agent = browser(w.app);
    const res = await agent.post('/api/v1/auth/sign-in').send({ email: demo.auditor.email, password: demo.auditor.password });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: demo.auditor.email, displayName: 'Demo Auditor', roles: ['auditor'] });
    const cookie = ([] as string[]).concat(res.headers['set-cookie'])[0];
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/);
    const me = await agent.get('/api/v1/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.roles).toEqual(['auditor']);
  });

  test('behind a TLS-terminating proxy on loopback the cookie is Secure', async () => {
    const res = await request(w.app)
      .post('/api/v1/auth/sign-in')
      .set('Host', host)
      .set('X-Forwarded-Proto', 'https')
      .set('Origin', `https://${host}`)
      .send({ email: demo.approver.email, password: demo.approver.password });
    expect(res.status).toBe(200);
    expect(([] as string[]).concat(res.headers['set-cookie'])[0]).toMatch(/; Secure/);
  });

  test('a wrong password is a 401 with one message for every cause, recorded in the trail without the password', async () => {
    const wrong = await browser(w.app).post('/api/v1/auth/sign-in').send({ email: demo.analyst.email, password: 'not-the-password' });
    const unknown = await browser(w.app).post('/api/v1/auth/sign-in').send({ email: 'nobody@gannet-sound.test', password: 'whatever-it-is' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('wrong-credentials');
    expect(sessionIdOf(wrong)).toBeNull();
    const events = await w.db('events').where({ action: 'sign-in.failed' }).select('*');
    expect(events.map((e) => e.reason)).toEqual(expect.arrayContaining(['wrong password', 'unknown address']));
    expect(JSON.stringify(events)).not.toContain('not-the-password');
    expect(await verifyTrail(w.db)).toBe(-1);
  });

  test('sign-in issues a new session id: a session id held before sign-in is worthless after it', async () => {
    const agent = browser(w.app);
    const first = await agent.post('/api/v1/auth/sign-in').send({ email: demo.auditor.email, password: demo.auditor.password });
    const before = sessionIdOf(first)!;
    const second = await agent.post('/api/v1/auth/sign-in').send({ email: demo.analyst.email, password: demo.analyst.password });
    const after = sessionIdOf(second)!;
    expect(before).toBeTruthy();
    expect(after).toBeTruthy();
    expect(after).not.toBe(before);
    const old = await request(w.app).get('/api/v1/auth/me').set('Cookie', `hairline.sid=${encodeURIComponent(before)}`);
    expect(old.status).toBe(401);
    expect((await agent.get('/api/v1/auth/me')).body.email).toBe(demo.analyst.email);
  });

  test('sign-out ends the session on the server', async () => {
    const agent = await signedIn(w, 'approver');
    expect((await agent.get('/api/v1/auth/me')).status).toBe(200);
    expect((await agent.post('/api/v1/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/v1/auth/me')).status).toBe(401);
  });

  test('sessions end after the idle timeout and after the absolute timeout', async () => {
    const idle = await signedIn(w, 'auditor');
    w.clock.now += 31 * 60_000; // default idle limit: 30 minutes
    expect((await idle.get('/api/v1/auth/me')).status).toBe(401);

    const busy = await signedIn(w, 'auditor');
    for (let i = 0; i < 25; i += 1) {
      w.clock.now += 29 * 60_000; // never idle, but 12 h 5 min in all
      const res = await busy.get('/api/v1/auth/me');
      expect(res.status).toBe(i < 24 ? 200 : 401);
    }
  });

  test('a state-changing request without Origin, or from another site, is refused; a GET is not', async () => {
    const none = await request(w.app).post('/api/v1/auth/sign-in').set('Host', host).send({ email: demo.admin.email, password: demo.admin.password });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('bad-origin');
    const foreign = await request(w.app)
      .post('/api/v1/auth/sign-in')
      .set('Host', host)
      .set('Origin', 'http://elsewhere.test')
      .send({ email: demo.admin.email, password: demo.admin.password });
    expect(foreign.status).toBe(403);
    const viaReferer = await request(w.app)
      .post('/api/v1/auth/sign-in')
      .set('Host', host)
      .set('Referer', `${origin}/sign-in`)
      .send({ email: demo.admin.email, password: demo.admin.password });
    expect(viaReferer.status).toBe(200);
    expect((await request(w.app).get('/api/v1/health').set('Host', host)).status).toBe(200);
  });

  test('an oversize body is a 413 in the envelope, malformed JSON a 400, an invalid field a 400 naming it', async () => {
    const big = await browser(w.app)
      .post('/api/v1/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: demo.admin.email, password: 'x'.repeat(1_100_000) }));
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too-large');
    const broken = await browser(w.app).post('/api/v1/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(broken.status).toBe(400);
    const invalid = await browser(w.app).post('/api/v1/auth/sign-in').send({ email: 'not-an-address', password: 'x', extra: 1 });
    expect(invalid.status).toBe(400);
    expect(Object.keys(invalid.body.error.fields)).toEqual(expect.arrayContaining(['email']));
    for (const res of [big, broken, invalid]) expect(JSON.stringify(res.body)).not.toMatch(/\.ts:\d+|node_modules|at [A-Za-z]+ \(/);
  });

  test('helmet headers are on every response', async () => {
    const res = await request(w.app).get('/api/v1/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/script-src 'self' 'sha256-/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  test('a deactivated account cannot sign in, and its open session ends', async () => {
    const admin = await signedIn(w, 'admin');
    const victim = await signedIn(w, 'approver');
    const id = (await victim.get('/api/v1/auth/me')).body.id;
    const res = await admin.post(`/api/v1/users/${id}/deactivate`).send({ reason: 'left the Gannet Sound team' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('deactivated');
    expect(await w.db('sessions').whereRaw("json_extract(sess, '$.userId') = ?", [id]).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect((await victim.get('/api/v1/auth/me')).status).toBe(401);
    const again = await browser(w.app).post('/api/v1/auth/sign-in').send({ email: demo.approver.email, password: demo.approver.password });
    expect(again.status).toBe(401);
    const reason = await w.db('events').where({ action: 'sign-in.failed', subject_id: demo.approver.email }).orderBy('id', 'desc').first();
    expect(reason.reason).toBe('account deactivated');
  });
});

describe('throttling', () => {
  test('more sign-in attempts than the per-address limit get 429 in the envelope', async () => {
    const w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '3' });
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 4; i += 1) {
        const res = await browser(w.app).post('/api/v1/auth/sign-in').send({ email: demo.admin.email, password: demo.admin.password });
        statuses.push(res.status);
        if (res.status === 429) expect(res.body.error.code).toBe('too-many-attempts');
      }
      expect(statuses).toEqual([200, 200, 200, 429]);
    } finally {
      await w.close();
    }
  });

  test('an address pauses after five failures in a row, even for the right password, and the pause doubles', async () => {
    const w = await accountsWorld();
    try {
      const attempt = (password: string) => browser(w.app).post('/api/v1/auth/sign-in').send({ email: demo.analyst.email, password });
      for (let i = 0; i < 5; i += 1) expect((await attempt('wrong-guess-' + i)).status).toBe(401);
      const paused = await attempt(demo.analyst.password);
      expect(paused.status).toBe(429);
      expect(paused.body.error.code).toBe('sign-in-paused');
      w.clock.now += 31_000;
      expect((await attempt('wrong-again')).status).toBe(401); // sixth failure: a 60 s pause
      w.clock.now += 31_000;
      expect((await attempt(demo.analyst.password)).status).toBe(429);
      w.clock.now += 30_000;
      expect((await attempt(demo.analyst.password)).status).toBe(200);
      // success clears the count: one failure does not pause
      expect((await attempt('one-slip')).status).toBe(401);
      expect((await attempt(demo.analyst.password)).status).toBe(200);
    } finally {
      await w.close();
    }
  });
});
