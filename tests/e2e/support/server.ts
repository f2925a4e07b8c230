import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '../../../server/config';
import { startServer, type RunningServer } from '../../../server';

/**
 * Starts the real server in-process on a free loopback port with a fresh
 * seeded database, against the exported web build in dist/.
 */
export async function startTestServer(): Promise<RunningServer & { cleanup(): Promise<void> }> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-e2e-'));
  const config = loadConfig({
    HAIRLINE_PORT: '0',
    HAIRLINE_DATABASE: path.join(dir, 'hairline.sqlite3'),
    HAIRLINE_WEB_ROOT: path.resolve(__dirname, '../../../dist'),
  });
  const running = await startServer(config, { seed: true });
  return {
    ...running,
    async cleanup() {
      await running.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
