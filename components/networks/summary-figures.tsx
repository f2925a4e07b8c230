import { View } from 'react-native';
import type { VersionDetail } from '@/lib/schemas/network';
import { Figure } from '../ui/card';
import { fmt, fmtComplex, fmtInt } from '../ui/format';
import { Text } from '../ui/text';

export function SummaryFigures({ version }: { version: VersionDetail }) {
  const s = version.summary;
  return (
    <View className="gap-4">
      <View className="flex-row flex-wrap gap-4">
        <Figure label="nodes" value={fmtInt(version.nodeCount)} />
        <Figure label="edges" value={fmtInt(version.edgeCount)} />
        <Figure label="weights" value={s?.weightRange ? `${fmt(s.weightRange.min, 3)}–${fmt(s.weightRange.max, 3)}` : '—'} />
      </View>
      <View className="flex-row flex-wrap gap-4">
        <Figure label="λ2" value={s ? fmtComplex(s.lambda2.re, s.lambda2.im, 6) : '…'} />
        <Figure label="λ2 cluster" value={s ? String(s.cluster.size) : '…'} unit={s && s.cluster.size > 1 ? `spread ${fmt(s.cluster.spread, 2)}` : undefined} />
      </View>
      {s && !s.rooted ? (
        <View role="alert" className="rounded-md border border-rust bg-rust-soft p-3">
          <Text className="font-medium text-ink">× No node reaches every other node: λ2 = 0 and the network cannot reach consensus.</Text>
          <Text className="mt-1 text-sm text-ink-soft">
            Cut off from the leading group: <Text className="font-mono text-sm text-ink">{s.cutOff.slice(0, 30).join(', ')}{s.cutOff.length > 30 ? ` and ${s.cutOff.length - 30} more` : ''}</Text>
          </Text>
        </View>
      ) : null}
      {s?.rooted ? <Text className="text-sm text-ink-soft">● Rooted: every node can be reached from {s.roots.length === 1 ? 'the root' : 'each of the roots'} <Text className="font-mono text-sm text-ink">{s.roots.slice(0, 8).join(', ')}{s.roots.length > 8 ? '…' : ''}</Text>.</Text> : null}
    </View>
  );
}
