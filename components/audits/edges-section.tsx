import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, View } from 'react-native';
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
import { EdgeTable } from './edge-table';
import { Pager } from './pager';

/** Room the table and the detail need to sit side by side; below it the detail goes under the table. */
const SIDE_BY_SIDE = 1060;

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
              <View className="lg:hidden">
                <EdgeCards auditId={audit.id} rows={data.rows} filters={filters} onSort={onSort} />
              </View>
              <View className="hidden lg:flex">
                <EdgeTable rows={data.rows} total={data.total} filters={filters} selected={selected} onSort={onSort} onSelect={onSelect} />
              </View>
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
        {selected !== undefined ? (
          <View role="complementary" aria-label="Selected edge" className="hidden lg:flex" style={sideBySide ? { width: 400 } : undefined}>
            <View className="gap-3 rounded-lg border border-rule-strong bg-paper-deep p-3">
              <View className="flex-row flex-wrap items-center justify-between gap-2">
                <Text className="font-medium text-xs uppercase tracking-widest text-ink-faint">Selected edge</Text>
                <View className="flex-row items-center gap-1">
                  <Link href={`/audits/${audit.id}/edges/${selected}`} asChild>
                    <Pressable accessibilityRole="link" className="px-2 py-2">
                      <Text className="text-sm text-rust underline">Own page</Text>
                    </Pressable>
                  </Link>
                  <Button label="Close" tone="quiet" onPress={() => onSelect(undefined)} />
                </View>
              </View>
              <EdgeDetailView audit={audit} edgeIndex={selected} />
            </View>
          </View>
        ) : null}
      </View>
    </View>
  );
}
