import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { useNetwork, useNetworkVersion } from '@/lib/api/networks';
import { StartAuditButton } from '../audits/start-audit-button';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { ConventionBadge } from './convention-badge';
import { GraphView } from './graph-view';
import { SpectrumPlot } from './spectrum-plot';
import { SummaryFigures } from './summary-figures';
import { VersionsPanel } from './versions-panel';

export function NetworkDetailScreen() {
  const params = useLocalSearchParams<{ networkId: string; version?: string }>();
  const id = Number(params.networkId);
  const router = useRouter();
  const network = useNetwork(id);
  const shown = params.version ? Number(params.version) : network.data?.latest.version;
  const version = useNetworkVersion(id, shown);

  if (network.isPending) return <Screen title="Network"><Loading what="the network" /></Screen>;
  if (network.isError) return <Screen title="Network"><ErrorState message={network.error.message} onRetry={() => network.refetch()} /></Screen>;
  const net = network.data;
  const v = version.data;
  return (
    <Screen kicker={`Network · version ${shown}`} title={net.name}>
      {net.description ? <Text className="text-[15px] leading-6 text-ink-soft">{net.description}</Text> : null}
      <View className="flex-row flex-wrap items-center gap-3">
        <ConventionBadge convention={net.convention} long />
        <Button label="Import next version" tone="secondary" onPress={() => router.push(`/networks/import?networkId=${id}`)} />
        <StartAuditButton networkId={id} version={v?.summaryState === 'ready' ? shown : undefined} />
      </View>
      {version.isPending ? <Loading what="this version" /> : null}
      {version.isError ? <ErrorState message={version.error.message} onRetry={() => version.refetch()} /> : null}
      {v ? (
        <>
          <Card title="Summary">
            <SummaryFigures version={v} />
          </Card>
          <Card title="Spectrum">
            {v.summaryState === 'ready' && v.summary ? <SpectrumPlot summary={v.summary} /> : null}
            {v.summaryState === 'pending' ? <Loading verb="Computing" what={`the spectrum of ${v.nodeCount} nodes in the background (large networks take minutes; this page updates itself)`} /> : null}
            {v.summaryState === 'failed' ? <ErrorState message={`The spectrum could not be computed: ${v.summaryError ?? 'unknown reason'}`} /> : null}
          </Card>
          <Card title="Drawing">
            <GraphView nodes={v.nodes} edges={v.edges} />
          </Card>
        </>
      ) : null}
      <Card title="Versions">
        <VersionsPanel networkId={id} versions={net.versions} shown={shown ?? 1} onShow={(n) => router.setParams({ version: String(n) })} />
      </Card>
    </Screen>
  );
}
