/**
 * Exports the web app with `expo export` unless the export already matches
 * its sources (a content hash kept in the output folder), so `npm start` and
 * `npm test` pay the ~90 s export only when the client changed.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');
const sourceDirs = ['app', 'components', 'lib', 'assets'];
const sourceFiles = ['app.json', 'babel.config.js', 'metro.config.js', 'tailwind.config.js', 'global.css', 'package-lock.json'];

function hashSources(): string {
  const hash = createHash('sha256');
  const visit = (p: string) => {
    const st = statSync(p);
    if (st.isDirectory()) {
      for (const name of readdirSync(p).sort()) visit(path.join(p, name));
    } else {
      hash.update(path.relative(root, p));
      hash.update(readFileSync(p));
    }
  };
  for (const d of sourceDirs) if (existsSync(path.join(root, d))) visit(path.join(root, d));
  for (const f of sourceFiles) if (existsSync(path.join(root, f))) visit(path.join(root, f));
  return hash.digest('hex');
}

export async function buildWebIfStale(outDir = path.join(root, 'dist'), force = false): Promise<void> {
  const stamp = path.join(outDir, '.source-hash');
  const wanted = hashSources();
  if (!force && existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === wanted) {
    console.log('Web build is up to date.');
    return;
  }
  console.log('Exporting the web app (about a minute and a half on a cold cache)…');
  const started = Date.now();
  const result = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', outDir], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1', EXPO_OFFLINE: '1' },
  });
  if (result.status !== 0) throw new Error(`expo export failed with exit code ${result.status}`);
  writeFileSync(stamp, wanted + '\n');
  console.log(`Web export done in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
}

if (require.main === module) {
  buildWebIfStale(undefined, process.argv.includes('--force')).catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
