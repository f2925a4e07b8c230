import { View } from 'react-native';
import type { AuditDetail } from '@/lib/schemas/audit';
import { fmtDate } from '../ui/format';
import { Text } from '../ui/text';
import { FigureRow } from './edge-figures';

/** A 64-digit hash in groups of eight, so it wraps on a phone and reads in chunks. */
export const groupHash = (h: string) => h.match(/.{1,8}/g)?.join(' ') ?? h;

/** The seal: who approved, when, with what comment, and whether the fingerprint still matches. */
export function LockRecord({ audit }: { audit: AuditDetail }) {
  const lock = audit.lock;
  if (!lock) return null;
  const check = audit.hashCheck;
  return (
    <View className="gap-3">
      <View className="gap-0.5">
        <FigureRow label="sealed by" value={lock.by.name} />
        <FigureRow label="at" value={fmtDate(lock.at)} />
        <FigureRow label="meaning" value={lock.meaning} />
      </View>
      <View className="gap-1 border-l-2 border-rule-strong pl-3">
        <Text className="text-sm leading-5 text-ink">“{lock.comment}”</Text>
      </View>
      <View className="gap-1">
        <Text className="text-xs text-ink-faint">SHA-256 over the results, dispositions and comment, as sealed</Text>
        <Text selectable className="font-mono text-xs leading-5 text-ink">{groupHash(lock.hash)}</Text>
      </View>
      {check ? (
        check.matches ? (
          <View role="status" className="flex-row gap-2 rounded-md border border-verdigris bg-verdigris-soft p-3">
            <Text className="font-mono text-ink">●</Text>
            <Text className="flex-1 text-sm leading-5 text-ink">Recomputed from the stored records just now: it matches. Nothing has changed since sealing.</Text>
          </View>
        ) : (
          <View role="alert" className="gap-1 rounded-md border border-rust bg-rust-soft p-3">
            <Text className="text-sm leading-5 text-ink">× Recomputed just now, the fingerprint does NOT match: the stored records differ from what was sealed.</Text>
            <Text selectable className="font-mono text-xs leading-5 text-ink">{groupHash(check.recomputed)}</Text>
          </View>
        )
      ) : null}
    </View>
  );
}
