import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
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
        <EmptyState
          title={states.length ? 'No audits in these states' : 'No audits yet'}
          body={states.length ? 'Clear the state filter to see every audit.' : 'Open a network and choose “Start an audit” to sweep its edge weights.'}
          action={states.length ? undefined : <Button label="Go to networks" tone="secondary" onPress={() => router.push('/networks')} />}
        />
      ) : null}
      <View className="gap-3">
        {list.data?.audits.map((a) => <AuditCard key={a.id} audit={a} />)}
      </View>
    </Screen>
  );
}
