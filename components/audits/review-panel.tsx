import { useState } from 'react';
import { View } from 'react-native';
import { useReviewAction, type ReviewAction } from '@/lib/api/audits';
import { ApiError } from '@/lib/api/client';
import { commentSchema, type AuditDetail } from '@/lib/schemas/audit';
import { Button } from '../ui/button';
import { Field } from '../ui/field';
import { fmtDate, fmtInt } from '../ui/format';
import { Text } from '../ui/text';
import { stateLook } from './looks';

type Step = Exclude<ReviewAction, 'cancel'>;

const steps: Record<Step, { open: string; go: string; comment: 'required' | 'optional'; explain: string }> = {
  submit: { open: 'Submit for sign-off', go: 'Submit for sign-off', comment: 'optional', explain: 'Every flagged edge has a disposition; an approver who did not start the run will seal it or send it back.' },
  return: { open: 'Send back to the analyst', go: 'Send it back', comment: 'required', explain: 'The analyst gets your comment and can reopen the audit for review.' },
  reopen: { open: 'Reopen for review', go: 'Reopen', comment: 'optional', explain: 'The audit goes back to the auditors with its dispositions as they are.' },
  lock: { open: 'Seal the audit…', go: 'Seal it — this cannot be undone', comment: 'required', explain: '' },
};
const order: Step[] = ['submit', 'lock', 'return', 'reopen'];

/** The review actions the server allows this person now, each opened as a small form. */
export function ReviewPanel({ audit, onShowUndisposed }: { audit: AuditDetail; onShowUndisposed: () => void }) {
  const [open, setOpen] = useState<Step | null>(null);
  const available = order.filter((a) => audit.allowed.includes(a));
  return (
    <View className="gap-3">
      <Text className="text-sm text-ink-soft">
        {stateLook[audit.state].glyph} {stateLook[audit.state].label}: {stateLook[audit.state].hint}.
        {audit.flaggedCount ? ` ${fmtInt(audit.flaggedCount)} flagged edge${audit.flaggedCount === 1 ? '' : 's'}, ${fmtInt(audit.undisposedCount)} still without a disposition.` : ' No edge is flagged.'}
      </Text>
      {audit.undisposedCount > 0 && audit.allowed.includes('dispose') ? (
        <View className="self-start">
          <Button label={`Show the ${fmtInt(audit.undisposedCount)} without a disposition`} tone="quiet" onPress={onShowUndisposed} />
        </View>
      ) : null}
      {audit.lastComment ? (
        <View className="gap-1 border-l-2 border-rule-strong pl-3">
          <Text className="text-sm leading-5 text-ink">“{audit.lastComment.text}”</Text>
          <Text className="text-xs text-ink-faint">{audit.lastComment.by} · {audit.lastComment.action} · {fmtDate(audit.lastComment.at)}</Text>
        </View>
      ) : null}
      {available.length === 0 && audit.state !== 'sealed' ? <Text className="text-sm text-ink-faint">Nothing for you to do here at this stage.</Text> : null}
      {open ? (
        <StepForm key={open} audit={audit} step={open} onClose={() => setOpen(null)} onShowUndisposed={onShowUndisposed} />
      ) : (
        <View className="flex-row flex-wrap gap-3">
          {available.map((a) => (
            <Button key={a} label={steps[a].open} tone={a === 'lock' || a === 'submit' ? 'primary' : 'secondary'} onPress={() => setOpen(a)} />
          ))}
        </View>
      )}
    </View>
  );
}

function StepForm({ audit, step, onClose, onShowUndisposed }: { audit: AuditDetail; step: Step; onClose: () => void; onShowUndisposed: () => void }) {
  const s = steps[step];
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string>();
  const [confirming, setConfirming] = useState(false);
  const action = useReviewAction(audit.id, step);
  const refused = action.error instanceof ApiError ? action.error : null;

  function go() {
    if (s.comment === 'required') {
      const parsed = commentSchema.safeParse({ comment });
      if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    }
    setError(undefined);
    if (step === 'lock' && !confirming) return setConfirming(true);
    action.mutate(comment, { onSuccess: onClose });
  }

  return (
    <View className="gap-3 rounded-md border border-rule-strong bg-paper p-3">
      <Text className="font-bold text-ink">{s.open.replace('…', '')}</Text>
      {step === 'lock' ? <SealWarning /> : <Text className="text-sm leading-5 text-ink-soft">{s.explain}</Text>}
      <Field
        label={s.comment === 'required' ? 'Comment (required)' : 'Comment (optional)'}
        multiline
        numberOfLines={3}
        value={comment}
        editable={!confirming}
        onChangeText={setComment}
        error={error ?? refused?.fields?.comment}
      />
      {confirming ? (
        <View role="alert" aria-label="Confirm sealing" className="gap-2 rounded-md border border-rust bg-rust-soft p-3">
          <Text className="font-bold text-ink">Seal audit #{audit.id} for good?</Text>
          <Text className="text-sm leading-5 text-ink">You approve these results and dispositions under your name, with the comment above. Nobody, you included, can change or unseal it afterwards.</Text>
        </View>
      ) : null}
      {action.isError ? <Refusal error={action.error} onShowUndisposed={onShowUndisposed} /> : null}
      <View className="flex-row flex-wrap gap-3">
        <Button
          label={step === 'lock' ? (confirming ? s.go : 'Continue to confirmation') : s.go}
          tone={step === 'lock' && confirming ? 'danger' : 'primary'}
          busy={action.isPending}
          onPress={go}
        />
        <Button label={confirming ? 'Go back' : 'Cancel'} tone="secondary" onPress={confirming ? () => setConfirming(false) : onClose} />
      </View>
    </View>
  );
}

function SealWarning() {
  return (
    <View className="gap-1">
      <Text className="text-sm leading-5 text-ink-soft">
        Sealing records your name, the time, the meaning “approved”, your comment and a SHA-256 fingerprint of the results and dispositions.
      </Text>
      <Text className="font-medium text-sm leading-5 text-rust">■ It is irreversible: after sealing, every change to this audit is refused.</Text>
    </View>
  );
}

function Refusal({ error, onShowUndisposed }: { error: Error; onShowUndisposed: () => void }) {
  const e = error instanceof ApiError ? error : null;
  return (
    <View role="alert" className="gap-2 rounded-md border border-rust bg-rust-soft p-3">
      <Text className="font-medium text-sm text-ink">× {error.message}</Text>
      {e?.code === 'four-eyes' ? <Text className="text-sm text-ink-soft">Another approver, who did not start this run, has to seal it.</Text> : null}
      {e?.problems?.length ? (
        <View className="gap-0.5">
          {e.problems.slice(0, 12).map((p, i) => (
            <Text key={i} className="font-mono text-xs text-ink">· {p.element ? `${p.element}: ` : ''}{p.message}</Text>
          ))}
          {e.problems.length > 12 ? <Text className="text-xs text-ink-soft">…and {e.problems.length - 12} more.</Text> : null}
        </View>
      ) : null}
      {e?.code === 'undisposed' ? (
        <View className="self-start">
          <Button label="Show them in the table" tone="quiet" onPress={onShowUndisposed} />
        </View>
      ) : null}
    </View>
  );
}
