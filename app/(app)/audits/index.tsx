import { ComingSoon } from '@/components/ui/coming-soon';
import { Screen } from '@/components/ui/screen';

export default function AuditsRoute() {
  return (
    <Screen kicker="Review" title="Audits">
      <ComingSoon what="Run a per-edge sweep, triage the fragile edges, record dispositions and lock the audit." />
    </Screen>
  );
}
