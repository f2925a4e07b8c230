import { View } from 'react-native';
import { Button } from '../ui/button';
import { fmtInt } from '../ui/format';
import { Text } from '../ui/text';
import { pageSizes } from './edge-query-url';

/** Previous / next and rows per page; the server does the paging. */
export function Pager({ page, pageSize, total, onPage, onPageSize }: { page: number; pageSize: number; total: number; onPage: (p: number) => void; onPageSize: (n: number) => void }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <View className="flex-row flex-wrap items-center justify-between gap-3">
      <Text className="font-mono text-sm text-ink-soft">
        {fmtInt(first)}–{fmtInt(last)} of {fmtInt(total)} · page {page} of {pages}
      </Text>
      <View className="flex-row flex-wrap items-center gap-2">
        <Button label="‹ Previous" tone="secondary" disabled={page <= 1} onPress={() => onPage(page - 1)} />
        <Button label="Next ›" tone="secondary" disabled={page >= pages} onPress={() => onPage(page + 1)} />
        <Button
          label={`${pageSize} per page`}
          tone="quiet"
          accessibilityHint="Cycles through 25, 50, 100 and 200 rows per page"
          onPress={() => onPageSize(pageSizes[(pageSizes.indexOf(pageSize as (typeof pageSizes)[number]) + 1) % pageSizes.length])}
        />
      </View>
    </View>
  );
}
