import { ComingSoon } from '@/components/ui/coming-soon';
import { Screen } from '@/components/ui/screen';

export default function HelpRoute() {
  return (
    <Screen kicker="Reference" title="Help">
      <ComingSoon what="What linear, square-root and cube-root responses mean for a weight tolerance." />
    </Screen>
  );
}
