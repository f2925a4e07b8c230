import type { AuditDetail } from '@/lib/schemas/audit';
import { Text } from '../ui/text';
import { CautionBox } from './caution';

/**
 * In queue mode a run moves only while an `npm run worker` process is
 * connected to the queue. Without one the page would show "waiting for a free
 * worker" for ever; this says why, and what to start. Thread mode always has
 * its threads, so it says nothing there.
 */
export function WorkerNotice({ jobs }: { jobs: AuditDetail['jobs'] }) {
  if (!jobs || jobs.mode !== 'queue') return null;
  if (jobs.workers === 0) {
    return (
      // An alert: the run is stuck until someone acts, and the page is otherwise only a still bar.
      <CautionBox role="alert" label="No queue worker" glyph="!">
        <Text className="text-sm font-medium leading-5 text-ink">No queue worker is connected, so this run cannot move on.</Text>
        <Text className="text-sm leading-5 text-ink">
          Start one on a machine that can reach the queue’s Redis: <Text className="font-mono text-sm text-ink">npm run worker</Text>. The run
          continues by itself once a worker connects; nothing here needs restarting.
        </Text>
      </CautionBox>
    );
  }
  if (jobs.workers === null) {
    return (
      <CautionBox role="note" label="Queue workers unknown" glyph="?">
        <Text className="text-sm leading-5 text-ink">
          The number of connected queue workers could not be read from Redis just now. If the run does not move, check that Redis answers and that
          a worker (<Text className="font-mono text-sm text-ink">npm run worker</Text>) is running.
        </Text>
      </CautionBox>
    );
  }
  return null;
}
