import { View } from 'react-native';
import { useAuditTrail } from '@/lib/api/audits';
import { fmtDate } from '../ui/format';
import { ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { actionText, describeValue } from './looks';

const clip = (raw: string | null, n = 90) => {
  const s = describeValue(raw);
  return s.length > n ? `${s.slice(0, n - 1)}…` : s;
};

/** Every recorded action, oldest first, and whether the hash chain holds. */
export function AuditTrail({ auditId }: { auditId: number }) {
  const trail = useAuditTrail(auditId);
  if (trail.isPending) return <Loading what="the trail" />;
  if (trail.isError) return <ErrorState message={trail.error.message} onRetry={() => trail.refetch()} />;
  const { entries, verified } = trail.data;
  return (
    <View className="gap-3">
      <Text role={verified ? 'status' : 'alert'} className={`text-sm ${verified ? 'text-verdigris' : 'text-rust'}`}>
        {verified ? `● The hash chain verifies: ${entries.length} entr${entries.length === 1 ? 'y' : 'ies'}, none altered or removed.` : '× The hash chain is broken: an entry was altered or removed.'}
      </Text>
      <View accessibilityRole="list" aria-label="Trail" className="gap-0">
        {entries.map((e) => (
          <View key={e.id} className="gap-0.5 border-b border-rule py-2">
            <View className="flex-row flex-wrap items-baseline gap-x-2">
              <Text className="font-mono text-xs text-ink-faint">{fmtDate(e.at)}</Text>
              <Text className="font-medium text-sm text-ink">{e.actor ?? 'system'}</Text>
              <Text className="text-sm text-ink-soft">{actionText[e.action] ?? e.action.replace(/^audit\./, '')}</Text>
            </View>
            {e.oldValue !== null || e.newValue !== null ? (
              <Text className="font-mono text-xs text-ink-soft">
                {e.oldValue === null ? clip(e.newValue) : `${clip(e.oldValue)} → ${clip(e.newValue)}`}
              </Text>
            ) : null}
            {e.reason ? <Text className="text-sm leading-5 text-ink-soft">“{e.reason}”</Text> : null}
          </View>
        ))}
      </View>
    </View>
  );
}
