import { View } from 'react-native';
import type { AuditState, EdgeRow, ResponseClass } from '@/lib/schemas/audit';
import { fmtInt } from '../ui/format';
import { Text } from '../ui/text';
import { classLook, dispositionLook, stateLook } from './looks';

export function ClassTag({ cls, exponent, small = false }: { cls: ResponseClass; exponent?: number | null; small?: boolean }) {
  const l = classLook[cls];
  return (
    <Text numberOfLines={small ? 1 : undefined} className={`${small ? 'text-xs' : 'text-sm'} text-ink`}>
      <Text className={`font-mono-bold ${small ? 'text-xs' : 'text-sm'} ${l.tone}`}>{l.glyph}</Text> {l.label}
      {exponent !== undefined && exponent !== null ? <Text className={`font-mono ${small ? 'text-xs' : 'text-sm'} text-ink-faint`}> p={exponent.toFixed(2)}</Text> : null}
    </Text>
  );
}

export function StateTag({ state }: { state: AuditState }) {
  const l = stateLook[state];
  return (
    <View accessibilityLabel={`state ${l.label}`} className="flex-row items-center self-start rounded border border-rule-strong bg-paper-card px-2 py-0.5">
      <Text className={`text-sm ${l.tone}`}>{l.glyph}</Text>
      <Text className="ml-1.5 font-medium text-sm text-ink">{l.label}</Text>
    </View>
  );
}

export function DispositionTag({ row, small = false }: { row: Pick<EdgeRow, 'flagged' | 'disposition'>; small?: boolean }) {
  const size = small ? 'text-xs' : 'text-sm';
  if (!row.disposition) {
    return row.flagged ? (
      <Text numberOfLines={1} className={`${size} text-rust`}>{dispositionLook.none.glyph} needs one</Text>
    ) : (
      <Text className={`${size} text-ink-faint`}>—</Text>
    );
  }
  const l = dispositionLook[row.disposition.kind];
  return (
    <Text numberOfLines={1} className={`${size} text-ink`}>
      <Text className={`${size} ${l.tone}`}>{l.glyph}</Text> {l.label}
    </Text>
  );
}

/** Edges done of total, as a bar and in words. */
export function ProgressBar({ done, total }: { done: number; total: number }) {
  const share = total > 0 ? Math.min(1, done / total) : 0;
  return (
    <View
      accessibilityRole="progressbar"
      accessibilityLabel={`${done} of ${total} edges swept`}
      aria-valuemin={0}
      aria-valuemax={total}
      aria-valuenow={done}
      className="h-2.5 w-full overflow-hidden rounded-full border border-rule-strong bg-paper-deep"
    >
      <View className="h-full bg-ink" style={{ width: `${(share * 100).toFixed(1)}%` as `${number}%` }} />
    </View>
  );
}

export function progressWords(done: number, total: number, eta: number | null): string {
  const left = eta === null ? 'estimating time left' : `about ${duration(eta)} left`;
  return `${fmtInt(done)} of ${fmtInt(total)} edges · ${left}`;
}

export function duration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, '0')} min`;
}
