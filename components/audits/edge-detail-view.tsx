import { View } from 'react-native';
import { useAuditEdge } from '@/lib/api/audits';
import type { AuditDetail } from '@/lib/schemas/audit';
import { Card } from '../ui/card';
import { fmt } from '../ui/format';
import { ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { DispositionSection } from './disposition-form';
import { EdgeFigures } from './edge-figures';
import { classLook } from './looks';
import { ResponsePlot } from './response-plot';
import { ClassTag } from './tags';

/** One edge: its response plot, figures and disposition. Used on its own page and beside the table. */
export function EdgeDetailView({ audit, edgeIndex, showTitle = true }: { audit: AuditDetail; edgeIndex: number; showTitle?: boolean }) {
  const edge = useAuditEdge(audit.id, edgeIndex);
  if (edge.isPending) return <Loading what={`edge ${edgeIndex}`} />;
  if (edge.isError) return <ErrorState message={edge.error.message} onRetry={() => edge.refetch()} />;
  const e = edge.data;
  return (
    <View className="gap-4">
      {showTitle ? (
        <View className="gap-1">
          <Text accessibilityRole="header" aria-level={2} className="font-mono-bold text-lg text-ink">
            {e.source} → {e.target}
          </Text>
          <Text className="font-mono text-xs text-ink-faint">edge #{e.edgeIndex} · weight {fmt(e.weight, 6)}</Text>
        </View>
      ) : null}
      <View className="flex-row flex-wrap items-center gap-x-3 gap-y-1">
        <ClassTag cls={e.class} />
        <Text className="text-xs text-ink-faint">{classLook[e.class].law}</Text>
        {e.flagged ? <Text className={`text-xs ${e.disposition ? 'text-ink-soft' : 'text-rust'}`}>⚑ flagged{e.disposition ? '' : ': needs a disposition'}</Text> : null}
      </View>
      <Card title="Response of Re λ2">
        <ResponsePlot plus={e.plus} minus={e.minus} />
      </Card>
      <Card title="Figures">
        <EdgeFigures edge={e} />
      </Card>
      <Card title="Disposition">
        <DispositionSection auditId={audit.id} row={e} canEdit={audit.allowed.includes('dispose')} />
      </Card>
    </View>
  );
}
