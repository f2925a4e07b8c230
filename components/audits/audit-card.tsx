import { Link } from 'expo-router';
import { Pressable, View } from 'react-native';
import { isRunning } from '@/lib/api/audits';
import type { AuditSummary } from '@/lib/schemas/audit';
import { ConventionBadge } from '../networks/convention-badge';
import { fmt, fmtDate, fmtInt } from '../ui/format';
import { Text } from '../ui/text';
import { ProgressBar, progressWords, StateTag } from './tags';

export function AuditCard({ audit }: { audit: AuditSummary }) {
  const running = isRunning(audit.state);
  return (
    <Link href={`/audits/${audit.id}`} asChild>
      <Pressable
        accessibilityRole="link"
        accessibilityLabel={`Audit ${audit.id}: ${audit.networkName}, version ${audit.version}`}
        className="gap-3 rounded-lg border border-rule bg-paper-card p-4 hover:border-ink-faint"
      >
        <View className="flex-row flex-wrap items-center justify-between gap-2">
          <Text className="shrink font-bold text-lg text-ink">{audit.networkName}</Text>
          <Text className="font-mono text-xs text-ink-faint">audit #{audit.id} · v{audit.version}</Text>
        </View>
        <View className="flex-row flex-wrap items-center gap-x-4 gap-y-2">
          <StateTag state={audit.state} />
          <ConventionBadge convention={audit.convention} />
          <Text className="text-xs text-ink-faint">started by {audit.startedBy.name} · {fmtDate(audit.createdAt)}</Text>
        </View>
        {running ? (
          <View className="gap-1">
            <ProgressBar done={audit.progress.done} total={audit.progress.total} />
            <Text className="font-mono text-xs text-ink-soft">{progressWords(audit.progress.done, audit.progress.total, audit.progress.etaSeconds)}</Text>
          </View>
        ) : audit.state === 'failed' || audit.state === 'cancelled' ? (
          <Text className="text-sm text-ink-soft">{audit.reason ?? 'No reason recorded.'}</Text>
        ) : (
          <View className="flex-row flex-wrap gap-x-5 gap-y-1">
            <Text className="font-mono text-sm text-ink">{fmtInt(audit.flaggedCount)} <Text className="font-mono text-xs text-ink-faint">flagged</Text></Text>
            <Text className={`font-mono text-sm ${audit.undisposedCount ? 'text-rust' : 'text-ink'}`}>
              {fmtInt(audit.undisposedCount)} <Text className="font-mono text-xs text-ink-faint">without disposition</Text>
            </Text>
            <Text className="font-mono text-sm text-ink">Re λ2 {fmt(audit.lambda2?.re)}</Text>
          </View>
        )}
      </Pressable>
    </Link>
  );
}
