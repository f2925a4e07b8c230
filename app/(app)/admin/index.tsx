import { ComingSoon } from '@/components/ui/coming-soon';
import { Screen } from '@/components/ui/screen';

export default function AdminRoute() {
  return (
    <Screen kicker="People" title="Admin">
      <ComingSoon what="Invite people, set their roles, and read the outgoing mail log." />
    </Screen>
  );
}
