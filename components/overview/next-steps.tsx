import { Link } from 'expo-router';
import { Pressable, View } from 'react-native';
import { useMe } from '@/lib/api/account';
import { useAudits } from '@/lib/api/audits';
import type { Role } from '@/lib/schemas/roles';
import { Text } from '../ui/text';

interface Step {
  key: string;
  text: string;
  href: string;
  /** A live count that makes the step urgent ("3 waiting"). */
  count?: number;
}

/**
 * What to do next, per role, from live data: the demo team's first run is
 * guided step by step, and later visits show what is waiting for you.
 */
export function useNextSteps(): { roles: Role[]; steps: Step[] } {
  const me = useMe();
  const roles = (me.data?.roles ?? []) as Role[];
  const audits = useAudits([]);
  const list = audits.data?.audits ?? [];
  const count = (state: string) => list.filter((a) => a.state === state).length;
  const steps: Step[] = [];
  if (roles.includes('analyst')) {
    const back = count('sent-back');
    if (back) steps.push({ key: 'back', text: 'Audits sent back to you: read the comment, fix, and reopen', href: '/audits?state=sent-back', count: back });
    steps.push({ key: 'import', text: 'Import a network (CSV, TSV, JSON or GraphML) — or try the demo files', href: '/networks/import' });
    steps.push({ key: 'run', text: list.length ? 'Open a network and start another audit' : 'Open “Gannet Sound buoy relay” and start its first audit', href: '/networks' });
  }
  if (roles.includes('auditor')) {
    const n = count('in-review');
    steps.push({ key: 'review', text: n ? 'Audits ready for review: filter to the root-type edges and record dispositions' : 'No audit is waiting for review yet', href: '/audits?state=in-review', count: n });
  }
  if (roles.includes('approver')) {
    const n = count('awaiting-sign-off');
    steps.push({ key: 'seal', text: n ? 'Audits awaiting your sign-off: read the summary and seal, or send back' : 'No audit awaits sign-off yet', href: '/audits?state=awaiting-sign-off', count: n });
  }
  if (roles.includes('admin')) {
    steps.push({ key: 'people', text: 'Invite the team and give each person their roles', href: '/admin' });
    steps.push({ key: 'outbox', text: 'Read the outgoing mail (invitations, resets, notifications)', href: '/admin/outbox' });
  }
  steps.push({ key: 'help', text: 'What square-root and cube-root responses mean for a tolerance', href: '/help' });
  return { roles, steps };
}

export function NextSteps({ compact = false }: { compact?: boolean }) {
  const { roles, steps } = useNextSteps();
  return (
    <View className="gap-2" accessibilityLabel="Next steps">
      {!compact && roles.length ? <Text className="text-sm text-ink-soft">Signed in as {roles.join(' and ')}.</Text> : null}
      {steps.map((s, i) => (
        <Link key={s.key} href={s.href as never} asChild>
          <Pressable accessibilityRole="link" accessibilityLabel={s.text} className="flex-row items-start gap-3 rounded-md border border-rule bg-paper-card px-3 py-2.5 hover:border-ink-faint">
            <Text className="w-5 font-mono text-sm text-ink-faint">{i + 1}</Text>
            <Text className="flex-1 text-sm leading-5 text-ink">{s.text}</Text>
            {s.count ? <Text className="rounded-full bg-rust px-2 font-mono text-xs leading-5 text-paper-card">{s.count}</Text> : <Text className="text-ink-faint">›</Text>}
          </Pressable>
        </Link>
      ))}
    </View>
  );
}
