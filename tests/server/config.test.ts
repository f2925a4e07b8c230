import { mkdtempSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ConfigError, loadConfig } from '../../server/config';

const tmp = () => mkdtempSync(path.join(os.tmpdir(), 'hairline-config-'));

describe('configuration from the environment', () => {
  test('defaults give a loopback server on port 4321 with the fake mail relay', () => {
    const c = loadConfig({}, tmp());
    expect(c.port).toBe(4321);
    expect(c.host).toBe('127.0.0.1');
    expect(c.mail.mode).toBe('fake');
  });

  test('a bad port is refused with a message naming the variable', () => {
    expect(() => loadConfig({ HAIRLINE_PORT: 'eighty' }, tmp())).toThrow(ConfigError);
    try {
      loadConfig({ HAIRLINE_PORT: '70000' }, tmp());
    } catch (e) {
      expect((e as ConfigError).message).toMatch(/HAIRLINE_PORT/);
    }
    expect.assertions(2);
  });

  test('every problem is listed at once', () => {
    try {
      loadConfig({ HAIRLINE_PORT: '-1', HAIRLINE_MAIL: 'pigeon', HAIRLINE_SESSION_SECRET: 'short' }, tmp());
      throw new Error('expected a ConfigError');
    } catch (e) {
      const problems = (e as ConfigError).problems.join('\n');
      expect(problems).toMatch(/HAIRLINE_PORT/);
      expect(problems).toMatch(/HAIRLINE_MAIL/);
      expect(problems).toMatch(/HAIRLINE_SESSION_SECRET/);
    }
  });

  test('smtp mode needs a relay URL', () => {
    expect(() => loadConfig({ HAIRLINE_MAIL: 'smtp' }, tmp())).toThrow(/HAIRLINE_SMTP_URL/);
    const c = loadConfig({ HAIRLINE_MAIL: 'smtp', HAIRLINE_SMTP_URL: 'smtp://relay.invalid:2525' }, tmp());
    expect(c.mail).toMatchObject({ mode: 'smtp', url: 'smtp://relay.invalid:2525' });
  });

  test('a missing session secret is generated once and kept beside the database', () => {
    const dir = tmp();
    const env = { HAIRLINE_DATABASE: 'store/h.sqlite3' };
    const first = loadConfig(env, dir).sessionSecret;
    const second = loadConfig(env, dir).sessionSecret;
    expect(first).toHaveLength(64);
    expect(second).toBe(first);
    expect(readFileSync(path.join(dir, 'store', 'session-secret'), 'utf8').trim()).toBe(first);
  });
});
