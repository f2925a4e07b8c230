import { Link } from 'expo-router';
import { Pressable, View } from 'react-native';
import type { EdgeRow } from '@/lib/schemas/audit';
import { fig, pct } from './numbers';
import { Text } from '../ui/text';
import { ClassTag, DispositionTag } from './tags';


/** On a phone: one compact card per edge (the sort is a choice among the filters, as there are no column headers). */
export function EdgeCards({ auditId, rows }: { auditId: number; rows: EdgeRow[] }) {
  return (
    <View className="gap-3">
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
                w {fig(r.weight, 4)} · tol {fig(r.tolerance, 3)}{r.toleranceRel !== null ? ` (${pct(r.toleranceRel)} % of w)` : ''}
              </Text>
            </Pressable>
          </Link>
        ))}
      </View>
    </View>
  );
}
