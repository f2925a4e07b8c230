/**
 * `npm run backup [-- FILE]`: a consistent copy of the configured database,
 * taken with SQLite's online backup API, so the server may keep running
 * (and writing) meanwhile. Without FILE the copy goes to `backups/` beside
 * the database (data/backups/ for the default data/hairline.sqlite3), named
 * by the time it was taken. Prints the file and its size; refuses to
 * overwrite a file that exists. The copy is checked with SQLite's own
 * integrity check before the command reports success.
 *
 * Restore: stop the server, delete `<database>-wal` and `<database>-shm` if
 * they are there, copy the backup over HAIRLINE_DATABASE, start the server
 * (README, "Backups and restore").
 */
import Database from 'better-sqlite3';
import { existsSync, mkdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { loadConfigOrExit } from '../config';

export function defaultBackupFile(databaseFile: string, at = new Date()): string {
  const stamp = at.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z'); // 20261202T090000Z
  return path.join(path.dirname(databaseFile), 'backups', `${path.basename(databaseFile, path.extname(databaseFile))}-${stamp}.sqlite3`);
}

export async function backupDatabase(databaseFile: string, target: string): Promise<{ file: string; bytes: number }> {
  if (existsSync(target)) throw new Error(`${target} already exists; name a new file`);
  mkdirSync(path.dirname(target), { recursive: true });
  const source = new Database(databaseFile, { fileMustExist: true });
  try {
    source.pragma('busy_timeout = 5000');
    // Pages copied in steps; a write by the server between steps restarts the copy, so it is never torn.
    await source.backup(target);
  } finally {
    source.close();
  }
  const copy = new Database(target, { readonly: true });
  try {
    const check = copy.pragma('integrity_check', { simple: true });
    if (check !== 'ok') throw new Error(`the copy failed SQLite's integrity check: ${String(check)}`);
  } finally {
    copy.close();
  }
  return { file: target, bytes: statSync(target).size };
}

async function main(): Promise<number> {
  const config = loadConfigOrExit();
  if (config.databaseFile === ':memory:') {
    console.error('HAIRLINE_DATABASE is :memory:; there is no file to back up.');
    return 2;
  }
  if (!existsSync(config.databaseFile)) {
    console.error(`No database at ${config.databaseFile}; check HAIRLINE_DATABASE.`);
    return 2;
  }
  const target = process.argv[2] ? path.resolve(process.argv[2]) : defaultBackupFile(config.databaseFile);
  const { file, bytes } = await backupDatabase(config.databaseFile, target);
  console.log(`backup written: ${file} (${bytes.toLocaleString('en-US')} bytes)`);
  return 0;
}

if (require.main === module) {
  main().then(
    (code) => process.exit(code),
    (err) => {
      console.error('backup failed:', err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
