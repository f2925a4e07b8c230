import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type Row, type SortingState } from '@tanstack/react-table';
import { memo, useCallback, useRef } from 'react';
import { Pressable, ScrollView, View, type ViewStyle } from 'react-native';
import type { EdgeRow } from '@/lib/schemas/audit';
import { fig, pct } from './numbers';
import { Text } from '../ui/text';
import type { EdgeFilters, EdgeSortKey } from './edge-query-url';
import { ClassTag, DispositionTag } from './tags';

const col = createColumnHelper<EdgeRow>();
const figure = (text: string) => <Text className="font-mono text-xs text-ink">{text}</Text>;
const exp = (v: number | null) => figure(v === null ? '—' : v.toFixed(2));

/** Column ids are the server's sort keys, so TanStack's sorting state maps onto the URL as is. */
const columns = [
  col.accessor('edgeIndex', { id: 'edge', header: '#', cell: (c) => <Text className="font-mono text-xs text-ink-faint">{c.getValue()}</Text> }),
  col.accessor('source', { id: 'source', header: 'Source', cell: (c) => <Text numberOfLines={1} className="font-mono text-xs text-ink">{c.getValue()}</Text> }),
  col.accessor('target', { id: 'target', header: 'Target', cell: (c) => <Text numberOfLines={1} className="font-mono text-xs text-ink">{c.getValue()}</Text> }),
  col.accessor('weight', { id: 'weight', header: 'Weight', cell: (c) => figure(fig(c.getValue(), 4)) }),
  col.accessor('class', { id: 'class', header: 'Class', cell: (c) => <ClassTag cls={c.getValue()} small /> }),
  col.accessor('plusExponent', { id: 'plusExponent', header: 'p +ε', cell: (c) => exp(c.getValue()) }),
  col.accessor('minusExponent', { id: 'minusExponent', header: 'p −ε', cell: (c) => exp(c.getValue()) }),
  col.accessor('tolerance', { id: 'tolerance', header: 'Tol |ε|', cell: (c) => figure(fig(c.getValue(), 3)) }),
  col.accessor('toleranceRel', { id: 'toleranceRel', header: 'Tol %w', cell: (c) => figure(pct(c.getValue())) }),
  col.accessor('sensitivity', { id: 'sensitivity', header: '∂Re λ2', cell: (c) => figure(fig(c.getValue(), 3)) }),
  col.accessor((r) => r.disposition?.kind ?? '', { id: 'disposition', header: 'Disposition', cell: (c) => <DispositionTag row={c.row.original} small /> }),
];

/**
 * Least widths, to fit beside the edge detail in a 1440 px window; any room beyond is shared out, names taking twice their share.
 * `lead` is extra room before a left-aligned column that follows a right-aligned one, where the two would otherwise touch.
 */
const layout: Record<EdgeSortKey, { width: number; right?: boolean; grow?: number; lead?: number; name: string }> = {
  edge: { width: 28, right: true, name: 'edge number' },
  source: { width: 70, grow: 2, name: 'source' },
  target: { width: 70, grow: 2, name: 'target' },
  weight: { width: 50, right: true, name: 'weight' },
  class: { width: 86, lead: 6, name: 'class' },
  plusExponent: { width: 38, right: true, name: 'exponent at +ε' },
  minusExponent: { width: 38, right: true, name: 'exponent at −ε' },
  tolerance: { width: 72, right: true, name: 'tolerance |ε|' },
  toleranceRel: { width: 62, right: true, name: 'tolerance as % of weight' },
  sensitivity: { width: 66, right: true, name: 'sensitivity ∂Re λ2/∂w' },
  disposition: { width: 80, lead: 8, name: 'disposition' },
};
const GAP = 3;
const AFTER_NUMBER = 4;
export const tableWidth = Object.values(layout).reduce((s, l) => s + l.width + (l.lead ?? 0) + GAP, 12 + AFTER_NUMBER);
const cellStyle = (l: (typeof layout)[EdgeSortKey]) => ({
  flexBasis: l.width,
  flexGrow: l.width * (l.grow ?? 1),
  flexShrink: 0,
  minWidth: l.width,
  marginLeft: GAP / 2 + (l.lead ?? 0),
  marginRight: l === layout.edge ? GAP / 2 + AFTER_NUMBER : GAP / 2,
});

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
  // A stable handler, so selecting one edge re-renders two rows rather than the page.
  const latest = useRef(onSelect);
  latest.current = onSelect;
  const select = useCallback((edgeIndex: number) => latest.current(edgeIndex), []);
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
              return (
                <Pressable
                  key={h.id}
                  role="columnheader"
                  aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'}
                  accessibilityLabel={`Sort by ${l.name}`}
                  onPress={h.column.getToggleSortingHandler()}
                  style={cellStyle(l)}
                  className={`min-h-[40px] flex-row items-center gap-0.5 ${l.right ? 'justify-end' : ''}`}
                >
                  <Text numberOfLines={1} className={`text-xs ${dir ? 'font-bold text-ink' : 'font-medium text-ink-soft'}`}>{flexRender(h.column.columnDef.header, h.getContext())}</Text>
                  <Text className={`text-[10px] ${dir ? 'text-ink' : 'text-ink-faint'}`}>{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}</Text>
                </Pressable>
              );
            })}
          </View>
        ))}
        {table.getRowModel().rows.map((r) => (
          <TableRow key={r.id} row={r} on={r.original.edgeIndex === selected} onSelect={select} />
        ))}
      </View>
    </ScrollView>
  );
}

const cellBoxes = Object.fromEntries(
  (Object.keys(layout) as EdgeSortKey[]).map((k) => [k, { ...cellStyle(layout[k]), alignItems: layout[k].right ? 'flex-end' : 'flex-start' } as const]),
) as Record<EdgeSortKey, ViewStyle>;

/** One row; memoised, since a page may hold 200 of them. Cell boxes take plain styles to keep each cheap. */
const TableRow = memo(function TableRow({ row, on, onSelect }: { row: Row<EdgeRow>; on: boolean; onSelect: (edgeIndex: number) => void }) {
  const e = row.original;
  return (
    <Pressable
      role="row"
      aria-selected={on}
      accessibilityLabel={`Edge ${e.edgeIndex}: ${e.source} → ${e.target}, ${e.class}`}
      onPress={() => onSelect(e.edgeIndex)}
      className={`min-h-[34px] flex-row items-center border-b border-rule px-1 py-1 [contain-intrinsic-size:auto_34px] [content-visibility:auto] ${on ? 'bg-ochre-soft' : 'hover:bg-paper'}`}
    >
      {row.getVisibleCells().map((c) => (
        <View key={c.id} role="cell" style={cellBoxes[c.column.id as EdgeSortKey]}>
          {flexRender(c.column.columnDef.cell, c.getContext())}
        </View>
      ))}
    </Pressable>
  );
});
