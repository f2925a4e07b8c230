/** Runs the audit CLI in a child process (outside jest's module sandbox, where the solver is much slower). */
import { spawnSync } from 'node:child_process';
import path from 'node:path';

export const REPO = path.resolve(__dirname, '../../..');

export function runAudit(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const tsx = path.join(REPO, 'node_modules', '.bin', 'tsx');
  const run = spawnSync(tsx, [path.join(REPO, 'server', 'cli', 'audit.ts'), ...args], {
    cwd: REPO,
    encoding: 'utf8',
    maxBuffer: 256 * 1024 * 1024,
    timeout: 120_000,
  });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}
