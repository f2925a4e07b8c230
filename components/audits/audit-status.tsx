import { useState } from 'react';
import { View } from 'react-native';
import { isRunning, useReviewAction } from '@/lib/api/audits';
import { responseClasses, type AuditDetail } from '@/lib/schemas/audit';
import { ConventionBadge } from '../networks/convention-badge';
import { Button } from '../ui/button';
import { Figure } from '../ui/card';
import { fmt, fmtComplex, fmtDate, fmtInt } from '../ui/format';
import { ErrorState } from '../ui/states';
import { Text } from '../ui/text';
import { classLook, stateLook } from './looks';
import { ProgressBar, progressWords, StateTag } from './tags';
import { WorkerNotice } from './worker-notice';

/** Under the title: state, convention, who started it and with which settings. */
export function AuditHeader({ audit }: { audit: AuditDetail }) {
  const s = audit.settings;
  return (
    <View className="gap-2">
      <View className="flex-row flex-wrap items-center gap-3">
        <StateTag state={audit.state} />
        <ConventionBadge convention={audit.convention} />
      </View>
      <Text className="text-sm text-ink-soft">
        Started by {audit.startedBy.name} · <Text className="font-mono text-xs text-ink-soft">{fmtDate(audit.createdAt)}</Text>
        {audit.finishedAt ? <Text className="text-sm text-ink-soft"> · swept by <Text className="font-mono text-xs text-ink-soft">{fmtDate(audit.finishedAt)}</Text></Text> : null}
      </Text>
      <Text className="font-mono text-xs text-ink-faint">
        ladder t {s.ladder.from}→{s.ladder.to} step {s.ladder.step} · signs {s.signs.map((x) => (x === 'plus' ? '+' : '−')).join(' ')} · τ {fmt(s.tolerance * 100, 3)} % of Re λ2
      </Text>
    </View>
  );
}

/** While the sweep runs: the bar, the count and time left, and a way to stop it. */
export function SweepProgress({ audit }: { audit: AuditDetail }) {
  const cancel = useReviewAction(audit.id, 'cancel');
  const [asking, setAsking] = useState(false);
  const p = audit.progress;
  return (
    <View className="gap-3">
      <Text className="text-sm text-ink-soft">{stateLook[audit.state].glyph} {stateLook[audit.state].hint}. This page follows it by itself; the table appears when every edge is done.</Text>
      <WorkerNotice jobs={audit.jobs} />
      <ProgressBar done={p.done} total={p.total} />
      <Text className="font-mono text-sm text-ink">{progressWords(p.done, p.total, p.etaSeconds)}</Text>
      {audit.allowed.includes('cancel') ? (
        asking ? (
          <View className="flex-row flex-wrap items-center gap-3">
            <Text className="text-sm text-ink">Stop the sweep? Its partial results will not be kept as an audit.</Text>
            <Button label="Stop the sweep" tone="danger" busy={cancel.isPending} onPress={() => cancel.mutate(undefined)} />
            <Button label="Keep it running" tone="secondary" onPress={() => setAsking(false)} />
          </View>
        ) : (
          <View className="self-start">
            <Button label="Cancel the run" tone="secondary" onPress={() => setAsking(true)} />
          </View>
        )
      ) : null}
      {cancel.isError ? <ErrorState message={cancel.error.message} /> : null}
    </View>
  );
}

/** λ2, its cluster and how many edges fell in each class. */
export function AuditSummaryFigures({ audit }: { audit: AuditDetail }) {
  return (
    <View className="gap-4">
      <View className="flex-row flex-wrap gap-4">
        <Figure label="λ2" value={audit.lambda2 ? fmtComplex(audit.lambda2.re, audit.lambda2.im, 6) : '—'} />
        <Figure label="λ2 cluster" value={audit.cluster ? String(audit.cluster.size) : '—'} unit={audit.cluster && audit.cluster.size > 1 ? `spread ${fmt(audit.cluster.spread, 2)}` : undefined} />
        <Figure label="flagged edges" value={fmtInt(audit.flaggedCount)} unit={`${fmtInt(audit.undisposedCount)} open`} />
      </View>
      <View accessibilityRole="list" aria-label="Edges per class" className="flex-row flex-wrap gap-2">
        {responseClasses.map((c) => (
          <View key={c} className="grow basis-[46%] flex-row items-baseline justify-between gap-2 rounded-md border border-rule px-3 py-2 lg:basis-[30%]">
            <Text className="text-sm text-ink">
              <Text className={`font-mono-bold text-sm ${classLook[c].tone}`}>{classLook[c].glyph}</Text> {classLook[c].label}
            </Text>
            <Text className="font-mono text-base text-ink">{fmtInt(audit.classCounts[c] ?? 0)}</Text>
          </View>
        ))}
      </View>
      {audit.rooted === false ? (
        <Text role="alert" className="text-sm text-rust">× The network is not rooted (cut off: {audit.cutOff.slice(0, 12).join(', ')}): λ2 = 0 and every tolerance is limited by that.</Text>
      ) : null}
    </View>
  );
}

export const showsResults = (audit: AuditDetail) => !isRunning(audit.state) && audit.state !== 'failed' && audit.state !== 'cancelled';
