import { Link } from 'expo-router';
import { Pressable, View } from 'react-native';
import type { NetworkListItem } from '@/lib/schemas/network';
import { fmt, fmtInt } from '../ui/format';
import { Text } from '../ui/text';
import { ConventionBadge } from './convention-badge';
import { SummaryStateTag } from './summary-state-tag';

export function NetworkCard({ network }: { network: NetworkListItem }) {
  const v = network.latest;
  return (
    <Link href={`/networks/${network.id}`} asChild>
      <Pressable
        accessibilityRole="link"
        accessibilityLabel={`${network.name}, version ${v.version}`}
        className="rounded-lg border border-rule bg-paper-card p-4 hover:border-ink-faint"
      >
        <View className="flex-row flex-wrap items-baseline justify-between gap-2">
          <Text className="font-bold text-lg text-ink">{network.name}</Text>
          <Text className="font-mono text-xs text-ink-faint">v{v.version}</Text>
        </View>
        {network.description ? <Text className="mt-1 text-sm leading-5 text-ink-soft">{network.description}</Text> : null}
        <View className="mt-3 flex-row flex-wrap items-center gap-x-5 gap-y-2">
          <Text className="font-mono text-sm text-ink">{fmtInt(v.nodeCount)} <Text className="font-mono text-xs text-ink-faint">nodes</Text></Text>
          <Text className="font-mono text-sm text-ink">{fmtInt(v.edgeCount)} <Text className="font-mono text-xs text-ink-faint">edges</Text></Text>
          <Text className="font-mono text-sm text-ink">Re λ2 {fmt(v.lambda2Re)}</Text>
          <ConventionBadge convention={network.convention} />
          <SummaryStateTag state={v.summaryState} />
        </View>
      </Pressable>
    </Link>
  );
}
