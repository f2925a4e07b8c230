import { useEffect, useState } from 'react';
import { View } from 'react-native';
import { useSetDisposition } from '@/lib/api/audits';
import { ApiError } from '@/lib/api/client';
import { dispositionKinds, setDispositionSchema, type DispositionKind, type EdgeRow } from '@/lib/schemas/audit';
import { Button } from '../ui/button';
import { Choice } from '../ui/choice';
import { Field } from '../ui/field';
import { fmtDate } from '../ui/format';
import { Text } from '../ui/text';
import { dispositionLook } from './looks';

/** The recorded disposition, and for an auditor while the audit is in review, the form to set it. */
export function DispositionSection({ auditId, row, canEdit }: { auditId: number; row: EdgeRow; canEdit: boolean }) {
  const d = row.disposition;
  return (
    <View className="gap-3">
      {d ? (
        <View className="gap-1 rounded-md border border-rule bg-paper p-3">
          <Text className="text-sm text-ink">
            <Text className={`text-sm ${dispositionLook[d.kind].tone}`}>{dispositionLook[d.kind].glyph}</Text> <Text className="font-bold text-sm text-ink">{dispositionLook[d.kind].label}</Text> · {d.by} · <Text className="font-mono text-xs text-ink-soft">{fmtDate(d.at)}</Text>
          </Text>
          <Text className="text-sm leading-5 text-ink-soft">{d.note}</Text>
        </View>
      ) : (
        <Text className="text-sm text-ink-soft">
          {row.flagged ? '○ No disposition yet. This edge is flagged, so the audit cannot be submitted until it has one.' : 'Not flagged: a disposition is optional.'}
        </Text>
      )}
      {canEdit ? <DispositionForm key={row.edgeIndex} auditId={auditId} row={row} /> : null}
    </View>
  );
}

function DispositionForm({ auditId, row }: { auditId: number; row: EdgeRow }) {
  const [kind, setKind] = useState<DispositionKind>(row.disposition?.kind ?? 'accept');
  const [note, setNote] = useState(row.disposition?.note ?? '');
  const [error, setError] = useState<string>();
  const save = useSetDisposition(auditId, row.edgeIndex);
  useEffect(() => save.reset(), [kind, note]); // eslint-disable-line react-hooks/exhaustive-deps

  function submit() {
    const parsed = setDispositionSchema.safeParse({ kind, note });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    save.mutate(parsed.data);
  }
  const refused = save.error instanceof ApiError ? save.error : null;
  return (
    <View className="gap-3 border-t border-rule pt-3">
      <Choice
        label="Disposition"
        value={kind}
        onChange={setKind}
        options={dispositionKinds.map((k) => ({ value: k, label: `${dispositionLook[k].glyph} ${dispositionLook[k].label}` }))}
      />
      <Text className="text-xs text-ink-faint">{dispositionLook[kind].hint}</Text>
      <Field label="Note" multiline numberOfLines={3} value={note} onChangeText={setNote} placeholder="why, and what is done about it" error={error ?? refused?.fields?.note} />
      <View className="flex-row flex-wrap items-center gap-3">
        <Button label={row.disposition ? 'Update disposition' : 'Record disposition'} busy={save.isPending} onPress={submit} />
        {save.isSuccess ? <Text role="status" className="text-sm text-verdigris">● Saved</Text> : null}
      </View>
      {save.isError ? (
        <View role="alert" className="rounded-md border border-rust bg-rust-soft p-3">
          <Text className="text-sm text-ink">× {save.error.message}</Text>
        </View>
      ) : null}
    </View>
  );
}
