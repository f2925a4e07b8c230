import type { Knex } from 'knex';
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { loadConfig } from '../../../server/config';
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp';
import { smtpMailer } from '../../../server/mail/mailer';
import { demoUsers } from '../../../seeds/data/demo';
import { freshDatabase } from './test-db';

/** supertest's default Host is 127.0.0.1:<port>; requests name the same origin. */
export const demo = Object.fromEntries(demoUsers.map((u) => [u.roles[0], u])) as Record<
  'admin' | 'analyst' | 'auditor' | 'approver',
  (typeof demoUsers)[number]
>;

export interface AccountsWorld {
  db: Knex;
  app: ReturnType<typeof createApp>;
  smtp: FakeSmtp;
  clock: { now: number };
  logged: string[];
  close(): Promise<void>;
}

function emptyWebRoot(): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-web-'));
  writeFileSync(path.join(dir, '+not-found.html'), '<p>no such page</p>');
  return dir;
}

/**
 * A seeded database, the app with a movable clock, and the local mail fake
 * on a free loopback port feeding the outbox.
 */
export async function accountsWorld(env: Record<string, string> = {}): Promise<AccountsWorld> {
  const db = await freshDatabase({ seed: true });
  const clock = { now: Date.parse('2026-12-02T09:00:00Z') };
  const smtp = await startFakeSmtp(db, { now: () => clock.now });
  const config = loadConfig(
    { HAIRLINE_DATABASE: ':memory:', HAIRLINE_WEB_ROOT: emptyWebRoot(), HAIRLINE_SESSION_SECRET: 'x'.repeat(40), ...env },
    os.tmpdir(),
  );
  const logged: string[] = [];
  const app = createApp({ db, config, mailer: smtpMailer(config, smtp.port), now: () => clock.now, log: (m, e) => logged.push(`${m} ${String(e)}`) });
  return {
    db,
    app,
    smtp,
    clock,
    logged,
    async close() {
      await smtp.close();
      await db.destroy();
    },
  };
}

export const host = 'hairline.test';
export const origin = `http://${host}`;

/** A cookie jar whose requests name this server in Host and Origin, as a browser on it would. */
export function browser(app: AccountsWorld['app']) {
  return request.agent(app).set('Host', host).set('Origin', origin);
}

/** A browser agent already signed in as the demo user of `role`. */
export async function signedIn(world: AccountsWorld, role: keyof typeof demo) {
  const agent = browser(world.app);
  const res = await agent.post('/api/v1/auth/sign-in').send({ email: demo[role].email, password: demo[role].password });
  if (res.status !== 200) throw new Error(`sign-in as ${role} answered ${res.status}`);
  return agent;
}

export function sessionIdOf(res: request.Response): string | null {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const c = cookies.find((x) => x.startsWith('hairline.sid='));
  return c ? decodeURIComponent(c.split(';')[0].slice('hairline.sid='.length)) : null;
}
