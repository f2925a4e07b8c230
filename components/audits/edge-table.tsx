import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { Pressable, ScrollView, View } from 'react-native';
import type { EdgeRow } from '@/lib/schemas/audit';
import { fmt } from '../ui/format';
import { Text } from '../ui/text';
import type { EdgeFilters, EdgeSortKey } from './edge-query-url';
import { ClassTag, DispositionTag } from './tags';

const col = createColumnHelper<EdgeRow>();
const num = (v: number | null, d = 3) => <Text className="font-mono text-sm text-ink">{fmt(v, d)}</Text>;
const pct = (v: number | null) => <Text className="font-mono text-sm text-ink">{v === null ? '—' : `${fmt(v * 100, 3)}%`}</Text>;
const exp = (v: number | null) => <Text className="font-mono text-sm text-ink">{v === null ? '—' : v.toFixed(2)}</Text>;

/** Column ids are the server's sort keys, so TanStack's sorting state maps onto the URL as is. */
const columns = [
  col.accessor('edgeIndex', { id: 'edge', header: '#', cell: (c) => <Text className="font-mono text-sm text-ink-faint">{c.getValue()}</Text> }),
  col.accessor('source', { id: 'source', header: 'Source', cell: (c) => <Text numberOfLines={1} className="font-mono text-sm text-ink">{c.getValue()}</Text> }),
  col.accessor('target', { id: 'target', header: 'Target', cell: (c) => <Text numberOfLines={1} className="font-mono text-sm text-ink">{c.getValue()}</Text> }),
  col.accessor('weight', { id: 'weight', header: 'Weight', cell: (c) => num(c.getValue(), 4) }),
  col.accessor('class', { id: 'class', header: 'Class', cell: (c) => <ClassTag cls={c.getValue()} /> }),
  col.accessor('plusExponent', { id: 'plusExponent', header: 'p at +ε', cell: (c) => exp(c.getValue()) }),
  col.accessor('minusExponent', { id: 'minusExponent', header: 'p at −ε', cell: (c) => exp(c.getValue()) }),
  col.accessor('tolerance', { id: 'tolerance', header: 'Tol. |ε|', cell: (c) => num(c.getValue()) }),
  col.accessor('toleranceRel', { id: 'toleranceRel', header: 'Tol. %w', cell: (c) => pct(c.getValue()) }),
  col.accessor('sensitivity', { id: 'sensitivity', header: '∂Re λ2/∂w', cell: (c) => num(c.getValue()) }),
  col.accessor((r) => r.disposition?.kind ?? '', { id: 'disposition', header: 'Disposition', cell: (c) => <DispositionTag row={c.row.original} /> }),
];

const layout: Record<EdgeSortKey, { width: number; right?: boolean }> = {
  edge: { width: 44, right: true },
  source: { width: 104 },
  target: { width: 104 },
  weight: { width: 76, right: true },
  class: { width: 124 },
  plusExponent: { width: 64, right: true },
  minusExponent: { width: 64, right: true },
  tolerance: { width: 84, right: true },
  toleranceRel: { width: 76, right: true },
  sensitivity: { width: 88, right: true },
  disposition: { width: 116 },
};
export const tableWidth = Object.values(layout).reduce((s, l) => s + l.width + 12, 0);

/** The wide-screen audit table. Sorting, filtering and paging happen on the server. */
export function EdgeTable({
  rows,
  total,
  filters,
  selected,
  onSort,
  onSelect,
}: {
  rows: EdgeRow[];
  total: number;
  filters: EdgeFilters;
  selected?: number;
  onSort: (sort: EdgeSortKey, dir: 'asc' | 'desc') => void;
  onSelect: (edgeIndex: number) => void;
}) {
  const sorting: SortingState = [{ id: filters.sort, desc: filters.dir === 'desc' }];
  const table = useReactTable({
    data: rows,
    columns,
    getRowId: (r) => String(r.edgeIndex),
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualFiltering: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    sortDescFirst: false,
    rowCount: total,
    state: { sorting, pagination: { pageIndex: filters.page - 1, pageSize: filters.pageSize } },
    onSortingChange: (up) => {
      const next = typeof up === 'function' ? up(sorting) : up;
      const s = next[0];
      if (s) onSort(s.id as EdgeSortKey, s.desc ? 'desc' : 'asc');
    },
  });

  return (
    <ScrollView horizontal contentContainerStyle={{ minWidth: '100%' }} className="rounded-lg border border-rule bg-paper-card">
      <View role="table" aria-label="Edges" aria-rowcount={total} style={{ minWidth: tableWidth }} className="flex-1">
        {table.getHeaderGroups().map((g) => (
          <View key={g.id} role="row" className="flex-row border-b border-rule-strong bg-paper-deep px-1">
            {g.headers.map((h) => {
              const l = layout[h.column.id as EdgeSortKey];
              const dir = h.column.getIsSorted();
              const name = String(h.column.columnDef.header);
              return (
                <Pressable
                  key={h.id}
                  role="columnheader"
                  aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'}
                  accessibilityLabel={`Sort by ${name}`}
                  onPress={h.column.getToggleSortingHandler()}
                  style={{ width: l.width }}
                  className={`mx-1.5 min-h-[40px] flex-row items-center gap-1 ${l.right ? 'justify-end' : ''}`}
                >
                  <Text className={`text-xs ${dir ? 'font-bold text-ink' : 'font-medium text-ink-soft'}`}>{flexRender(h.column.columnDef.header, h.getContext())}</Text>
                  <Text className="font-mono text-xs text-ink-faint">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}</Text>
                </Pressable>
              );
            })}
          </View>
        ))}
        {table.getRowModel().rows.map((r) => {
          const on = r.original.edgeIndex === selected;
          return (
            <Pressable
              key={r.id}
              role="row"
              aria-selected={on}
              accessibilityLabel={`Edge ${r.original.edgeIndex}: ${r.original.source} → ${r.original.target}, ${r.original.class}`}
              onPress={() => onSelect(r.original.edgeIndex)}
              className={`flex-row items-center border-b border-rule px-1 py-1.5 ${on ? 'bg-ochre-soft' : 'hover:bg-paper'}`}
            >
              {r.getVisibleCells().map((c) => {
                const l = layout[c.column.id as EdgeSortKey];
                return (
                  <View key={c.id} role="cell" style={{ width: l.width }} className={`mx-1.5 ${l.right ? 'items-end' : ''}`}>
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </View>
                );
              })}
            </Pressable>
          );
        })}
      </View>
    </ScrollView>
  );
}
