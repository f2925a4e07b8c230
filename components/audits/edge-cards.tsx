import { Link } from 'expo-router';
import { Pressable, View } from 'react-native';
import { edgeSortKeys, type EdgeRow } from '@/lib/schemas/audit';
import { Button } from '../ui/button';
import { Choice } from '../ui/choice';
import { fmt } from '../ui/format';
import { Text } from '../ui/text';
import type { EdgeFilters, EdgeSortKey } from './edge-query-url';
import { ClassTag, DispositionTag } from './tags';

export const sortLabels: Record<EdgeSortKey, string> = {
  edge: '#',
  source: 'source',
  target: 'target',
  weight: 'weight',
  class: 'class',
  plusExponent: 'p at +ε',
  minusExponent: 'p at −ε',
  tolerance: 'tolerance',
  toleranceRel: 'tolerance %',
  sensitivity: 'sensitivity',
  disposition: 'disposition',
};

/** On a phone: one compact card per edge, and the sort as a choice instead of column headers. */
export function EdgeCards({ auditId, rows, filters, onSort }: { auditId: number; rows: EdgeRow[]; filters: EdgeFilters; onSort: (sort: EdgeSortKey, dir: 'asc' | 'desc') => void }) {
  return (
    <View className="gap-3">
      <View className="gap-2">
        <Choice label="Sort by" value={filters.sort} options={edgeSortKeys.map((k) => ({ value: k, label: sortLabels[k] }))} onChange={(k) => onSort(k, filters.dir)} />
        <View className="self-start">
          <Button
            tone="secondary"
            label={filters.dir === 'asc' ? '▲ Ascending' : '▼ Descending'}
            accessibilityHint="Reverses the order"
            onPress={() => onSort(filters.sort, filters.dir === 'asc' ? 'desc' : 'asc')}
          />
        </View>
      </View>
      <View accessibilityRole="list" aria-label="Edges" className="gap-2">
        {rows.map((r) => (
          <Link key={r.edgeIndex} href={`/audits/${auditId}/edges/${r.edgeIndex}`} asChild>
            <Pressable
              accessibilityRole="link"
              accessibilityLabel={`Edge ${r.edgeIndex}: ${r.source} → ${r.target}, ${r.class}`}
              className="gap-1.5 rounded-lg border border-rule bg-paper-card px-3 py-2.5"
            >
              <View className="flex-row items-start justify-between gap-2">
                <Text className="shrink font-mono text-sm text-ink">
                  <Text className="font-mono text-xs text-ink-faint">#{r.edgeIndex} </Text>
                  {r.source} → {r.target}
                </Text>
                <DispositionTag row={r} />
              </View>
              <View className="flex-row flex-wrap items-center gap-x-3 gap-y-1">
                <ClassTag cls={r.class} />
                <Text className="font-mono text-xs text-ink-soft">
                  p {r.plusExponent === null ? '—' : r.plusExponent.toFixed(2)} / {r.minusExponent === null ? '—' : r.minusExponent.toFixed(2)}
                </Text>
              </View>
              <Text className="font-mono text-xs text-ink-soft">
                w {fmt(r.weight, 4)} · tol {fmt(r.tolerance, 3)}{r.toleranceRel !== null ? ` (${fmt(r.toleranceRel * 100, 3)}% w)` : ''}
              </Text>
            </Pressable>
          </Link>
        ))}
      </View>
    </View>
  );
}
