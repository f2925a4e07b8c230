import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { useAudit } from '@/lib/api/audits';
import { ConventionBadge } from '../networks/convention-badge';
import { Button } from '../ui/button';
import { Screen } from '../ui/screen';
import { ErrorState, Loading } from '../ui/states';
import { Caution } from './caution';
import { EdgeDetailView } from './edge-detail-view';
import { StateTag } from './tags';

/** `/audits/:auditId/edges/:edgeIndex`: one edge on its own page (phones land here from a card). */
export function EdgeDetailScreen() {
  const params = useLocalSearchParams<{ auditId: string; edgeIndex: string }>();
  const id = Number(params.auditId);
  const edgeIndex = Number(params.edgeIndex);
  const audit = useAudit(id);
  const router = useRouter();
  const back = () => (router.canGoBack() ? router.back() : router.push(`/audits/${id}`));

  if (audit.isPending) return <Screen kicker={`Audit #${params.auditId}`} title={`Edge #${params.edgeIndex}`}><Loading what="the audit" /></Screen>;
  if (audit.isError) return <Screen kicker={`Audit #${params.auditId}`} title={`Edge #${params.edgeIndex}`}><ErrorState message={audit.error.message} onRetry={() => audit.refetch()} /></Screen>;
  const a = audit.data;
  return (
    <Screen kicker={`Audit #${a.id} · ${a.networkName} · v${a.version}`} title={`Edge #${edgeIndex}`}>
      <View className="flex-row flex-wrap items-center gap-3">
        <Button label="‹ Back to the audit" tone="secondary" onPress={back} />
        <StateTag state={a.state} />
        <ConventionBadge convention={a.convention} />
      </View>
      <EdgeDetailView audit={a} edgeIndex={edgeIndex} />
      <Caution />
    </Screen>
  );
}
