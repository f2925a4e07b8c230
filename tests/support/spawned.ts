/**
 * Starting the server as a child process on a free port, and a small HTTP
 * client that signs in and sends what a browser on that server would
 * (session cookie, Origin). Used by the crash test and the load script.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export const repoRoot = path.resolve(__dirname, '../..');

export interface ChildServer {
  url: string;
  pid: number;
  process: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far. */
  output(): string;
  /** Resolves with the exit code or signal once the process has ended. */
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/** A folder with only the not-found page: the API needs no web build. */
export function emptyWebRoot(): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-web-'));
  writeFileSync(path.join(dir, '+not-found.html'), '<p>no such page</p>');
  return dir;
}

/** The environment for a child server on `databaseFile`, on a free port. */
export function serverEnv(databaseFile: string, extra: Record<string, string> = {}): Record<string, string> {
  return {
    HAIRLINE_DATABASE: databaseFile,
    HAIRLINE_PORT: '0',
    HAIRLINE_HOST: '127.0.0.1',
    HAIRLINE_WEB_ROOT: emptyWebRoot(),
    HAIRLINE_SESSION_SECRET: 'gannet-sound-child-server-secret-0123456789',
    HAIRLINE_SIGN_IN_LIMIT: '10000',
    ...extra,
  };
}

/** Node with tsx's loader: one process, whose PID is the server's. */
export function tsxArgs(script: string): string[] {
  return ['--import', 'tsx', path.join(repoRoot, script)];
}

export async function startChildServer(env: Record<string, string>, timeoutMs = 60_000): Promise<ChildServer> {
  const child = spawn(process.execPath, tsxArgs('tests/support/child-server.ts'), {
    cwd: repoRoot,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the child server did not start within ${timeoutMs} ms:\n${output}`)), timeoutMs);
    const look = () => {
      const m = /Hairline is serving on (http:\/\/\S+)/.exec(output);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout!.on('data', look);
    void exited.then(({ code, signal }) => {
      clearTimeout(timer);
      reject(new Error(`the child server exited (${code ?? signal}) before serving:\n${output}`));
    });
  });
  return { url, pid: child.pid!, process: child, output: () => output, exited };
}

/** Stops a child server by its own PID and waits for it to end. */
export async function stopChildServer(server: ChildServer, signal: NodeJS.Signals = 'SIGTERM') {
  if (server.process.exitCode === null && server.process.signalCode === null) process.kill(server.pid, signal);
  return server.exited;
}

/** A signed-in session against a running server, as a browser on it would hold. */
export class Session {
  private cookie = '';
  constructor(readonly base: string) {}

  static async signIn(base: string, email: string, password: string): Promise<Session> {
    const s = new Session(base);
    const res = await s.send('POST', '/api/v1/auth/sign-in', { email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}`);
    return s;
  }

  /** The Cookie header this session sends (for tools that make their own requests). */
  get cookieHeader(): string {
    return this.cookie;
  }

  async send(method: string, path: string, body?: unknown): Promise<{ status: number; body: any }> {
    const res = await fetch(this.base + path, {
      method,
      headers: { Origin: this.base, ...(this.cookie ? { Cookie: this.cookie } : {}), ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const set = res.headers.get('set-cookie');
    if (set) {
      const m = /hairline\.sid=[^;]*/.exec(set);
      if (m) this.cookie = m[0];
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON: keep the text */
    }
    return { status: res.status, body: parsed };
  }

  get(path: string) {
    return this.send('GET', path);
  }
}
