import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { useMe } from '@/lib/api/account';
import { useAudits } from '@/lib/api/audits';
import { auditStates, type AuditState } from '@/lib/schemas/audit';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, Loading } from '../ui/states';
import { AuditCard } from './audit-card';
import { toggleIn } from './edge-query-url';
import { stateLook } from './looks';
import { ChipRow, ToggleChip } from './toggle-chip';

/** Parses `?state=a,b` into known states, in their canonical order. */
export function statesFromParam(v: string | string[] | undefined): AuditState[] {
  const raw = (Array.isArray(v) ? v.join(',') : (v ?? '')).split(',');
  return auditStates.filter((s) => raw.includes(s));
}

export function AuditListScreen() {
  const params = useLocalSearchParams<{ state?: string }>();
  const router = useRouter();
  const states = statesFromParam(params.state);
  const list = useAudits(states);
  const canStart = useMe().data?.roles.includes('analyst') ?? false;
  const toggle = (s: AuditState) => {
    const next = toggleIn(states, s, auditStates);
    router.setParams({ state: next.length ? next.join(',') : undefined });
  };
  return (
    <Screen kicker="Review" title="Audits">
      <ChipRow label="Show states">
        {auditStates.map((s) => (
          <ToggleChip key={s} label={stateLook[s].label} glyph={stateLook[s].glyph} on={states.includes(s)} onPress={() => toggle(s)} />
        ))}
      </ChipRow>
      {list.isPending ? <Loading what="audits" /> : null}
      {list.isError ? <ErrorState message={list.error.message} onRetry={() => list.refetch()} /> : null}
      {list.data && list.data.audits.length === 0 ? (
        states.length ? (
          <EmptyState title="No audits in these states" body="Clear the state filter to see every audit." />
        ) : canStart ? (
          <EmptyState
            title="No audits yet"
            body="Open a network and choose “Start an audit” to sweep its edge weights."
            action={<Button label="Go to networks" tone="secondary" onPress={() => router.push('/networks')} />}
          />
        ) : (
          // Only analysts start audits: the others are told who will, not sent to a button they lack.
          <EmptyState title="No audits yet" body="Audits appear here once an analyst starts one; this list then follows each run to sign-off." />
        )
      ) : null}
      <View className="gap-3">
        {list.data?.audits.map((a) => <AuditCard key={a.id} audit={a} />)}
      </View>
    </Screen>
  );
}
