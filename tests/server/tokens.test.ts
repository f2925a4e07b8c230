import request from 'supertest';
import { accountsWorld, demo, signedIn, type AccountsWorld } from './support/accounts';

describe('personal API tokens', () => {
  let w: AccountsWorld;
  beforeAll(async () => {
    w = await accountsWorld();
  });
  afterAll(() => w.close());

  test('an analyst creates a token: the secret is shown once and stored only as a hash', async () => {
    const analyst = await signedIn(w, 'analyst');
    const res = await analyst.post('/api/v1/tokens').send({ name: 'design pipeline' });
    expect(res.status).toBe(201);
    expect(res.body.secret).toMatch(/^hl_[A-Za-z0-9_-]{43}$/);
    const row = await w.db('api_tokens').where({ id: res.body.token.id }).first();
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(res.body.secret);
    const list = await analyst.get('/api/v1/tokens');
    expect(list.body.tokens).toHaveLength(1);
    expect(JSON.stringify(list.body)).not.toContain(res.body.secret);
    expect(list.body.tokens[0].lastUsedAt).toBeNull();
    expect(await w.db('events').where({ action: 'token.created' }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  test('the token authenticates without a cookie or Origin, and its last use is recorded', async () => {
    const analyst = await signedIn(w, 'analyst');
    const secret = (await analyst.post('/api/v1/tokens').send({ name: 'curl' })).body.secret;
    const me = await request(w.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`);
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(demo.analyst.email);
    const post = await request(w.app).post('/api/v1/networks/import').set('Authorization', `Bearer ${secret}`).send({});
    expect([401, 403]).not.toContain(post.status); // past identity and Origin checks, into validation
    const listed = (await analyst.get('/api/v1/tokens')).body.tokens.find((t: { name: string }) => t.name === 'curl');
    expect(listed.lastUsedAt).toBe(new Date(w.clock.now).toISOString());
  });

  test('a token cannot manage tokens or accounts; an unknown token is a 401, not anonymous', async () => {
    const analyst = await signedIn(w, 'analyst');
    const secret = (await analyst.post('/api/v1/tokens').send({ name: 'limited' })).body.secret;
    const mint = await request(w.app).post('/api/v1/tokens').set('Authorization', `Bearer ${secret}`).send({ name: 'another' });
    expect(mint.status).toBe(403);
    expect(mint.body.error.code).toBe('session-required');
    const bogus = await request(w.app).get('/api/v1/networks').set('Authorization', 'Bearer hl_not-a-real-token');
    expect(bogus.status).toBe(401);
    expect(bogus.body.error.code).toBe('bad-token');
  });

  test('revoking ends the token at once and is recorded; another person cannot revoke it', async () => {
    const analyst = await signedIn(w, 'analyst');
    const created = (await analyst.post('/api/v1/tokens').send({ name: 'to revoke' })).body;
    const admin = await signedIn(w, 'admin');
    expect((await admin.delete(`/api/v1/tokens/${created.token.id}`)).status).toBe(403); // admins hold no tokens
    expect((await analyst.delete(`/api/v1/tokens/${created.token.id}`)).status).toBe(204);
    const after = await request(w.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${created.secret}`);
    expect(after.status).toBe(401);
    expect(await w.db('events').where({ action: 'token.revoked', subject_id: String(created.token.id) }).count({ n: '*' })).toEqual([{ n: 1 }]);
    expect((await analyst.delete('/api/v1/tokens/99999')).status).toBe(404);
  });

  test('a deactivated analyst’s tokens stop working', async () => {
    const analyst = await signedIn(w, 'analyst');
    const secret = (await analyst.post('/api/v1/tokens').send({ name: 'orphan' })).body.secret;
    const admin = await signedIn(w, 'admin');
    const id = (await analyst.get('/api/v1/auth/me')).body.id;
    expect((await admin.post(`/api/v1/users/${id}/deactivate`).send({ reason: 'moved to another district' })).status).toBe(200);
    expect((await request(w.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`)).status).toBe(401);
  });
});
