import { useState } from 'react';
import { View } from 'react-native';
import { ActionButton, LabeledInput, Notice } from '@/components/account/form-bits';
import { Text } from '@/components/ui/text';
import { useDeactivate, useSetRoles } from '@/lib/api/admin';
import type { UserSummary } from '@/lib/schemas/users';
import { RolePicker } from './role-picker';

const statusGlyph = { active: '● active', invited: '○ invited', deactivated: '× deactivated' } as const;

/** One person: roles to change, and deactivation behind a confirmation with a reason. */
export function UserRow({ user, isMe }: { user: UserSummary; isMe: boolean }) {
  const setRoles = useSetRoles();
  const deactivate = useDeactivate();
  const [roles, setPicked] = useState(user.roles);
  const [confirming, setConfirming] = useState(false);
  const [reason, setReason] = useState('');
  const changed = roles.slice().sort().join() !== user.roles.join();
  const error = setRoles.error ?? deactivate.error;
  return (
    <View accessibilityLabel={`Person ${user.email}`} className="gap-3 border-t border-rule py-4">
      <View className="flex-row flex-wrap items-baseline justify-between gap-2">
        <View>
          <Text className="font-medium text-ink">
            {user.displayName}
            {isMe ? ' (you)' : ''}
          </Text>
          <Text className="text-sm text-ink-soft">{user.email}</Text>
        </View>
        <Text className="font-mono text-xs text-ink-faint">{statusGlyph[user.status]}</Text>
      </View>
      {user.active ? (
        <>
          <RolePicker label={`Roles of ${user.email}`} value={roles} onChange={setPicked} />
          <View className="flex-row flex-wrap gap-2">
            {changed ? <ActionButton label="Save roles" busy={setRoles.isPending} onPress={() => setRoles.mutate({ userId: user.id, roles })} /> : null}
            {!isMe && !confirming ? <ActionButton label="Deactivate…" tone="outline" onPress={() => setConfirming(true)} /> : null}
          </View>
          {confirming ? (
            <View className="gap-2 rounded-md border border-rust bg-rust-soft p-3">
              <Text className="text-sm text-ink">
                {user.displayName} will be signed out everywhere and will no longer be able to sign in. Their records stay.
              </Text>
              <LabeledInput label="Reason (kept in the trail)" value={reason} onChangeText={setReason} />
              <View className="flex-row flex-wrap gap-2">
                <ActionButton
                  label={`Deactivate ${user.displayName}`}
                  tone="rust"
                  busy={deactivate.isPending}
                  onPress={() => deactivate.mutate({ userId: user.id, reason }, { onSuccess: () => setConfirming(false) })}
                />
                <ActionButton label="Keep active" tone="outline" onPress={() => setConfirming(false)} />
              </View>
            </View>
          ) : null}
        </>
      ) : (
        <Text className="text-sm text-ink-soft">Roles held: {user.roles.join(', ')}</Text>
      )}
      {error ? <Notice kind="refused">{(error as { fields?: Record<string, string> }).fields?.reason ?? error.message}</Notice> : null}
    </View>
  );
}
