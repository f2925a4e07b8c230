import { firstLink } from '../../lib/schemas/outbox';
import { verifyTrail } from '../../server/trail/service';
import { accountsWorld, browser, signedIn, type AccountsWorld } from './support/accounts';

/** The token after `#token=` in the newest outbox message to `to`. */
async function linkTokenFor(w: AccountsWorld, to: string): Promise<{ link: string; token: string }> {
  const rows = await w.db('outbox').orderBy('id', 'desc').select('*');
  const row = rows.find((r) => JSON.parse(r.rcpt_to).includes(to));
  const link = firstLink(row.text_body)!;
  return { link, token: new URL(link).hash.replace('#token=', '') };
}

describe('invitations and password resets by e-mail', () => {
  let w: AccountsWorld;
  beforeAll(async () => {
    w = await accountsWorld();
  });
  afterAll(() => w.close());

  test('an admin invites; the mail fake stores the message; the outbox route shows it with its link', async () => {
    const admin = await signedIn(w, 'admin');
    const res = await admin.post('/api/v1/users').send({ email: 'Wren.Auditor@Gannet-Sound.test', displayName: 'Wren Halloway', roles: ['auditor'] });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'wren.auditor@gannet-sound.test', roles: ['auditor'], status: 'invited' });
    const outbox = await admin.get('/api/v1/outbox');
    expect(outbox.status).toBe(200);
    const msg = outbox.body.messages[0];
    expect(msg.to).toEqual(['wren.auditor@gannet-sound.test']);
    expect(msg.subject).toBe('Hairline: you have been invited');
    expect(firstLink(msg.text)).toMatch(/^http:\/\/hairline\.test\/invitation#token=[A-Za-z0-9_-]{43}$/);
    const stored = await w.db('account_links').orderBy('id', 'desc').first();
    expect(msg.text).not.toContain(stored.token_hash);
    const event = await w.db('events').where({ action: 'user.invited' }).first();
    expect(JSON.parse(event.new_value)).toEqual({ email: 'wren.auditor@gannet-sound.test', roles: ['auditor'] });
    expect((await admin.post('/api/v1/users').send({ email: 'wren.auditor@gannet-sound.test', displayName: 'W', roles: ['auditor'] })).status).toBe(409);
  });

  test('the link sets a password once; a second use is refused; then the person signs in', async () => {
    const { token } = await linkTokenFor(w, 'wren.auditor@gannet-sound.test');
    const first = await browser(w.app).post('/api/v1/auth/invitation/accept').send({ token, password: 'salt-marsh-lantern-77' });
    expect(first.status).toBe(200);
    expect(first.body).toEqual({ email: 'wren.auditor@gannet-sound.test' });
    const again = await browser(w.app).post('/api/v1/auth/invitation/accept').send({ token, password: 'another-password-88' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('link-used');
    const signIn = await browser(w.app).post('/api/v1/auth/sign-in').send({ email: 'wren.auditor@gannet-sound.test', password: 'salt-marsh-lantern-77' });
    expect(signIn.status).toBe(200);
    expect(signIn.body.roles).toEqual(['auditor']);
  });

  test('an expired invitation link is refused, and an unknown one is a 404', async () => {
    const admin = await signedIn(w, 'admin');
    await admin.post('/api/v1/users').send({ email: 'late@gannet-sound.test', displayName: 'Late Comer', roles: ['analyst'] });
    const { token } = await linkTokenFor(w, 'late@gannet-sound.test');
    w.clock.now += 72 * 3_600_000 + 1000;
    const res = await browser(w.app).post('/api/v1/auth/invitation/accept').send({ token, password: 'long-enough-password' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('link-expired');
    const unknown = await browser(w.app).post('/api/v1/auth/invitation/accept').send({ token: 'A'.repeat(43), password: 'long-enough-password' });
    expect(unknown.status).toBe(404);
    const short = await browser(w.app).post('/api/v1/auth/invitation/accept').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/12 characters/);
  });

  test('a reset request answers the same for unknown addresses and mails a link only to a real account', async () => {
    const before = Number((await w.db('outbox').count({ n: '*' }))[0].n);
    const unknown = await browser(w.app).post('/api/v1/auth/password-reset/request').send({ email: 'nobody@gannet-sound.test' });
    expect(unknown.status).toBe(202);
    expect(Number((await w.db('outbox').count({ n: '*' }))[0].n)).toBe(before);
    const known = await browser(w.app).post('/api/v1/auth/password-reset/request').send({ email: 'wren.auditor@gannet-sound.test' });
    expect(known.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    const { link, token } = await linkTokenFor(w, 'wren.auditor@gannet-sound.test');
    expect(link).toMatch(/\/reset-password#token=/);
    const session = browser(w.app);
    await session.post('/api/v1/auth/sign-in').send({ email: 'wren.auditor@gannet-sound.test', password: 'salt-marsh-lantern-77' });
    const done = await browser(w.app).post('/api/v1/auth/password-reset/complete').send({ token, password: 'new-tide-table-2027' });
    expect(done.status).toBe(200);
    expect((await session.get('/api/v1/auth/me')).status).toBe(401); // a reset ends open sessions
    expect((await browser(w.app).post('/api/v1/auth/password-reset/complete').send({ token, password: 'new-tide-table-2028' })).status).toBe(409);
    expect((await browser(w.app).post('/api/v1/auth/sign-in').send({ email: 'wren.auditor@gannet-sound.test', password: 'new-tide-table-2027' })).status).toBe(200);
  });

  test('role changes are recorded with old and new values; an admin cannot drop their own admin role', async () => {
    const admin = await signedIn(w, 'admin');
    const users = (await admin.get('/api/v1/users')).body.users as Array<{ id: number; email: string }>;
    const wren = users.find((u) => u.email === 'wren.auditor@gannet-sound.test')!;
    const res = await admin.put(`/api/v1/users/${wren.id}/roles`).send({ roles: ['auditor', 'approver'] });
    expect(res.status).toBe(200);
    expect(res.body.roles).toEqual(['approver', 'auditor']);
    const ev = await w.db('events').where({ action: 'user.roles-changed' }).orderBy('id', 'desc').first();
    expect([JSON.parse(ev.old_value), JSON.parse(ev.new_value)]).toEqual([['auditor'], ['approver', 'auditor']]);
    const me = (await admin.get('/api/v1/auth/me')).body;
    expect((await admin.put(`/api/v1/users/${me.id}/roles`).send({ roles: ['analyst'] })).status).toBe(409);
    expect((await admin.put(`/api/v1/users/${wren.id}/roles`).send({ roles: ['overlord'] })).status).toBe(400);
    expect((await admin.put('/api/v1/users/99999/roles').send({ roles: ['auditor'] })).status).toBe(404);
  });

  test('the trail is one intact hash chain, and the database refuses to edit or delete it', async () => {
    expect(await w.db('events').count({ n: '*' })).not.toEqual([{ n: 0 }]);
    expect(await verifyTrail(w.db)).toBe(-1);
    const { expectRefusal } = await import('./support/test-db');
    await expectRefusal(w.db('events').update({ reason: 'edited' }), /append-only/);
    await expectRefusal(w.db('events').del(), /append-only/);
  });
});
