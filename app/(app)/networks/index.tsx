import { ComingSoon } from '@/components/ui/coming-soon';
import { Screen } from '@/components/ui/screen';

export default function NetworksRoute() {
  return (
    <Screen kicker="Library" title="Networks">
      <ComingSoon what="Import CSV, TSV, JSON or GraphML edge lists, keep versions, and see each network's spectrum." />
    </Screen>
  );
}
