import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { isRunning, useAudit } from '@/lib/api/audits';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { AuditHeader, AuditSummaryFigures, showsResults, SweepProgress } from './audit-status';
import { AuditTrail } from './audit-trail';
import { Caution } from './caution';
import { filtersFromParams, paramsFromFilters, undisposedFilters, type EdgeFilters } from './edge-query-url';
import { EdgesSection } from './edges-section';
import { LockRecord } from './lock-record';
import { stateLook } from './looks';
import { ReviewPanel } from './review-panel';

/** `/audits/:id?<filters>&edge=`: the whole audit, its table, review and record. */
export function AuditScreen() {
  const params = useLocalSearchParams<Record<string, string>>();
  const id = Number(params.auditId);
  const router = useRouter();
  const audit = useAudit(id);
  const filters = filtersFromParams(params);
  const selected = params.edge !== undefined && /^\d+$/.test(params.edge) ? Number(params.edge) : undefined;
  const setFilters = (f: EdgeFilters) => router.setParams(paramsFromFilters(f));
  const select = (edge: number | undefined) => router.setParams({ edge: edge === undefined ? undefined : String(edge) });

  if (audit.isPending) return <Screen kicker="Audit" title={`Audit #${params.auditId}`}><Loading what="the audit" /></Screen>;
  if (audit.isError) return <Screen kicker="Audit" title={`Audit #${params.auditId}`}><ErrorState message={audit.error.message} onRetry={() => audit.refetch()} /></Screen>;
  const a = audit.data;
  const results = showsResults(a);

  return (
    <Screen kicker={`Audit #${a.id} · version ${a.version}`} title={a.networkName}>
      <AuditHeader audit={a} />
      <Caution />
      {isRunning(a.state) ? (
        <Card title="Sweep in progress">
          <SweepProgress audit={a} />
        </Card>
      ) : null}
      {a.state === 'failed' || a.state === 'cancelled' ? (
        <Card title={a.state === 'failed' ? 'The sweep failed' : 'The sweep was cancelled'}>
          <Text className="text-sm leading-5 text-ink-soft">{stateLook[a.state].glyph} {a.reason ?? 'No reason was recorded.'} No results are shown for an unfinished sweep.</Text>
        </Card>
      ) : null}
      {results ? (
        <>
          <Card title="Summary">
            <AuditSummaryFigures audit={a} />
          </Card>
          <Card title={a.state === 'sealed' ? 'Sealed' : 'Review'}>
            <View className="gap-4">
              <ReviewPanel audit={a} onShowUndisposed={() => setFilters(undisposedFilters)} />
              <LockRecord audit={a} />
            </View>
          </Card>
          <EdgesSection audit={a} filters={filters} onFilters={setFilters} selected={selected} onSelect={select} />
        </>
      ) : null}
      <Card title="Trail">
        <AuditTrail auditId={a.id} />
      </Card>
    </Screen>
  );
}
