/**
 * `npm start`: checks the configuration, builds the web export when its
 * sources changed, migrates, seeds the demo team and networks on an empty
 * database, prints where to sign in, and serves.
 */
import { loadConfigOrExit } from '../config';
import { startServer } from '../index';
import { demoUsers } from '../../seeds/data/demo';
import { buildWebIfStale } from './build-web';

async function main(): Promise<void> {
  const config = loadConfigOrExit();
  await buildWebIfStale(config.webRoot);
  const running = await startServer(config, { seed: true });
  console.log(`\nHairline is serving on ${running.url}`);
  console.log(`Database: ${config.databaseFile}`);
  console.log('\nDemo accounts (local demonstration only):');
  for (const u of demoUsers) console.log(`  ${u.roles.join(',').padEnd(9)} ${u.email.padEnd(28)} ${u.password}`);
  console.log('\nPress Ctrl+C to stop.');
  const stop = async () => {
    await running.close();
    process.exit(0);
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((err) => {
  console.error('Hairline failed to start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
