import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, ScrollView, View, type ViewStyle } from 'react-native';
import { auditCsvHref, auditReportHref, useAuditEdges } from '@/lib/api/audits';
import type { AuditDetail } from '@/lib/schemas/audit';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { EmptyState, ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { DownloadLink } from './download-link';
import { EdgeCards } from './edge-cards';
import { EdgeDetailView } from './edge-detail-view';
import { EdgeFiltersPanel } from './edge-filters';
import { changeFilters, edgeQueryFromFilters, type EdgeFilters } from './edge-query-url';
import { EdgeTable, tableWidth } from './edge-table';
import { Pager } from './pager';
import { SideSheet } from './side-sheet';
import { useWide } from './use-wide';

/**
 * Room the table and the detail need side by side in the content column.
 * Narrower (the shell's own pane takes the right edge of a wide screen), the
 * selected edge opens as a sheet over that pane, still beside the table.
 */
const DETAIL_WIDTH = 368;
const SIDE_BY_SIDE = tableWidth + 16 + DETAIL_WIDTH;
/** The detail stays in view while the table scrolls past (web CSS, hence the cast). */
const sticky = { width: DETAIL_WIDTH, position: 'sticky', top: 12, maxHeight: 'calc(100vh - 24px)' } as unknown as ViewStyle;

export function EdgesSection({
  audit,
  filters,
  onFilters,
  selected,
  onSelect,
}: {
  audit: AuditDetail;
  filters: EdgeFilters;
  onFilters: (f: EdgeFilters) => void;
  selected?: number;
  onSelect: (edgeIndex: number | undefined) => void;
}) {
  const query = edgeQueryFromFilters(filters);
  const edges = useAuditEdges(audit.id, query);
  const [width, setWidth] = useState(0);
  const wide = useWide();
  const sideBySide = width >= SIDE_BY_SIDE;
  const data = edges.data;
  const onSort = (sort: EdgeFilters['sort'], dir: EdgeFilters['dir']) => onFilters(changeFilters(filters, { sort, dir }));

  return (
    <View className="gap-4" onLayout={(e) => setWidth(e.nativeEvent.layout.width)}>
      <Card title="Edges">
        <EdgeFiltersPanel filters={filters} onChange={onFilters} total={data?.total} />
      </Card>
      <View style={{ flexDirection: sideBySide ? 'row' : 'column', alignItems: sideBySide ? 'flex-start' : 'stretch', gap: 16 }}>
        <View className="gap-3" style={sideBySide ? { flex: 1, minWidth: 0 } : undefined}>
          {edges.isPending ? <Loading what="edges" /> : null}
          {edges.isError ? <ErrorState message={edges.error.message} onRetry={() => edges.refetch()} /> : null}
          {data && data.rows.length === 0 ? (
            <EmptyState
              title="No edge matches"
              body={data.total > 0 ? 'This page is past the last one.' : 'No edge passes every filter. Loosen or clear them.'}
              action={<Button label={data.total > 0 ? 'Go to page 1' : 'Clear filters'} tone="secondary" onPress={() => onFilters(data.total > 0 ? changeFilters(filters, { page: 1 }) : changeFilters(filters, { classes: [], dispositions: [], flagged: undefined, q: '', expMin: undefined, expMax: undefined, tolBelow: undefined }))} />}
            />
          ) : null}
          {data && data.rows.length > 0 ? (
            <>
              {/* Rows arrive after hydration, so the layout can follow the window: only one of the two is built. */}
              {wide ? (
                <View className="hidden lg:flex">
                  <EdgeTable rows={data.rows} total={data.total} filters={filters} selected={selected} onSort={onSort} onSelect={onSelect} />
                </View>
              ) : (
                <View className="lg:hidden">
                  <EdgeCards auditId={audit.id} rows={data.rows} />
                </View>
              )}
              <Pager
                page={filters.page}
                pageSize={filters.pageSize}
                total={data.total}
                onPage={(page) => onFilters(changeFilters(filters, { page }))}
                onPageSize={(pageSize) => onFilters(changeFilters(filters, { pageSize }))}
              />
              {edges.isFetching ? <Text className="text-xs text-ink-faint">updating…</Text> : null}
            </>
          ) : null}
          <View className="flex-row flex-wrap gap-x-6">
            <DownloadLink href={auditCsvHref(audit.id, query)} label="CSV of this table as filtered" filename={`audit-${audit.id}-edges.csv`} />
            <DownloadLink href={auditReportHref(audit.id)} label="PDF sign-off report" filename={`audit-${audit.id}-report.pdf`} />
          </View>
        </View>
        {selected !== undefined && sideBySide ? (
          <View role="complementary" aria-label="Selected edge" className="hidden rounded-lg border border-rule-strong bg-paper-deep lg:flex" style={sticky}>
            <SelectedEdge audit={audit} selected={selected} onSelect={onSelect} fill={false} />
          </View>
        ) : null}
        {selected !== undefined && !sideBySide ? (
          <SideSheet label="Selected edge" onClose={() => onSelect(undefined)}>
            <SelectedEdge audit={audit} selected={selected} onSelect={onSelect} />
          </SideSheet>
        ) : null}
      </View>
    </View>
  );
}

function SelectedEdge({ audit, selected, onSelect, fill = true }: { audit: AuditDetail; selected: number; onSelect: (edgeIndex: number | undefined) => void; fill?: boolean }) {
  return (
    <ScrollView className={fill ? 'flex-1' : 'grow-0'} contentContainerClassName="gap-3 p-4">
      <View className="flex-row flex-wrap items-center justify-between gap-2">
        <Text className="font-medium text-xs uppercase tracking-widest text-ink-faint">Selected edge</Text>
        <View className="flex-row items-center gap-1">
          <Link href={`/audits/${audit.id}/edges/${selected}`} asChild>
            <Pressable accessibilityRole="link" className="px-2 py-2">
              <Text className="text-sm text-rust underline">Own page</Text>
            </Pressable>
          </Link>
          <Button label="Close" tone="quiet" accessibilityHint="Closes the edge detail (Escape)" onPress={() => onSelect(undefined)} />
        </View>
      </View>
      <EdgeDetailView audit={audit} edgeIndex={selected} />
    </ScrollView>
  );
}
