import { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useVersionDiff } from '@/lib/api/networks';
import type { VersionInfo } from '@/lib/schemas/network';
import { fmt, fmtDate } from '../ui/format';
import { ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { SummaryStateTag } from './summary-state-tag';

/** The version history; choosing an older version compares it with the one shown. */
export function VersionsPanel({ networkId, versions, shown, onShow }: { networkId: number; versions: VersionInfo[]; shown: number; onShow: (v: number) => void }) {
  const [compare, setCompare] = useState<number | undefined>(versions.find((v) => v.version !== shown)?.version);
  return (
    <View className="gap-3">
      <View accessibilityRole="list" className="gap-1">
        {versions.map((v) => (
          <View key={v.version} className={`flex-row flex-wrap items-center gap-x-3 gap-y-1 rounded-md px-2 py-2 ${v.version === shown ? 'bg-paper-deep' : ''}`}>
            <Pressable accessibilityRole="button" accessibilityLabel={`Show version ${v.version}`} onPress={() => onShow(v.version)}>
              <Text className={`font-mono text-sm ${v.version === shown ? 'font-mono-bold text-ink' : 'text-rust underline'}`}>v{v.version}</Text>
            </Pressable>
            <Text className="font-mono text-xs text-ink-soft">{v.nodeCount}n · {v.edgeCount}e · Re λ2 {fmt(v.lambda2Re)}</Text>
            <SummaryStateTag state={v.summaryState} />
            <Text className="text-xs text-ink-faint">{fmtDate(v.createdAt)}{v.createdBy ? ` · ${v.createdBy}` : ''} · {v.sourceName}</Text>
            {v.version !== shown ? (
              <Pressable accessibilityRole="radio" accessibilityState={{ checked: compare === v.version }} accessibilityLabel={`Compare with version ${v.version}`} onPress={() => setCompare(v.version)}>
                <Text className="text-xs text-ink-soft">{compare === v.version ? '◆ compared' : '◇ compare'}</Text>
              </Pressable>
            ) : null}
          </View>
        ))}
      </View>
      {compare ? <VersionDiffView networkId={networkId} from={Math.min(compare, shown)} to={Math.max(compare, shown)} /> : null}
    </View>
  );
}

function VersionDiffView({ networkId, from, to }: { networkId: number; from: number; to: number }) {
  const diff = useVersionDiff(networkId, from, to);
  if (diff.isPending) return <Loading what="the comparison" />;
  if (diff.isError) return <ErrorState message={diff.error.message} />;
  const d = diff.data;
  const rows = [
    ...d.added.map((e) => ({ mark: '+', text: `${e.source} → ${e.target}`, value: fmt(e.weight) })),
    ...d.removed.map((e) => ({ mark: '−', text: `${e.source} → ${e.target}`, value: fmt(e.weight) })),
    ...d.reweighted.map((e) => ({ mark: '~', text: `${e.source} → ${e.target}`, value: `${fmt(e.before)} → ${fmt(e.after)}` })),
  ];
  return (
    <View className="gap-2 border-t border-rule pt-3">
      <Text className="font-medium text-ink">
        v{from} → v{to}: {d.added.length} added, {d.removed.length} removed, {d.reweighted.length} re-weighted
      </Text>
      {rows.slice(0, 200).map((r, i) => (
        <View key={i} className="flex-row gap-3">
          <Text className="w-4 font-mono text-sm text-ink">{r.mark}</Text>
          <Text className="flex-1 font-mono text-xs text-ink">{r.text}</Text>
          <Text className="font-mono text-xs text-ink-soft">{r.value}</Text>
        </View>
      ))}
      {rows.length > 200 ? <Text className="text-xs text-ink-faint">…and {rows.length - 200} more changes.</Text> : null}
      {rows.length === 0 ? <Text className="text-sm text-ink-soft">The two versions have the same edges and weights.</Text> : null}
    </View>
  );
}
