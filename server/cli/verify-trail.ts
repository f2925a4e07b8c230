/**
 * `npm run verify-trail`: walks the hash-chained event trail and exits 1 at
 * the first entry that does not chain (an edited, inserted or removed row).
 */
import { loadConfigOrExit } from '../config';
import { openDatabase } from '../db/connection';
import { allEvents } from '../trail/repo';
import { verifyTrail } from '../trail/service';

async function main(): Promise<number> {
  const config = loadConfigOrExit();
  const db = openDatabase(config.databaseFile);
  try {
    const events = await allEvents(db);
    const broken = await verifyTrail(db);
    if (broken === -1) {
      console.log(`trail intact: ${events.length} entries chain from the first to the last (${config.databaseFile})`);
      return 0;
    }
    const e = events[broken];
    console.error(`trail BROKEN at entry ${broken + 1} of ${events.length} (id ${e?.id}, ${e?.action} at ${e?.at}): its hash does not match its content or its predecessor`);
    return 1;
  } finally {
    await db.destroy();
  }
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error('verify-trail failed:', err instanceof Error ? err.message : err);
    process.exit(2);
  },
);
