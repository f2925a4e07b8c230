/**
 * The real server as its own process, for the crash test and the load
 * script: configuration from the environment (as `npm start` reads it), a
 * seeded database, no web build. Run as `node --import tsx` so the process
 * that listens is the one a test kills: the `tsx` launcher would put a
 * second node process in between, which a SIGKILL does not reach.
 */
import { loadConfig } from '../../server/config';
import { startServer } from '../../server/index';

async function main(): Promise<void> {
  const running = await startServer(loadConfig(), { seed: true });
  console.log(`Hairline is serving on ${running.url}`);
  const stop = async () => {
    await running.close();
    process.exit(0);
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}

main().catch((err) => {
  console.error('child server failed to start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
