import { useState } from 'react';
import { View } from 'react-native';
import { Card } from '@/components/ui/card';
import { Text } from '@/components/ui/text';
import { useCreateToken, useRevokeToken, useTokens } from '@/lib/api/tokens';
import { ActionButton, LabeledInput, Notice } from './form-bits';

const when = (iso: string | null) => (iso ? iso.replace('T', ' ').slice(0, 16) + ' UTC' : 'never');

/** Personal API tokens: the secret appears once, right after creation. */
export function TokensCard() {
  const tokens = useTokens(true);
  const create = useCreateToken();
  const revoke = useRevokeToken();
  const [name, setName] = useState('');
  return (
    <Card title="API tokens">
      <Text className="mb-3 text-sm leading-5 text-ink-soft">
        A token lets a script import networks and start audits as you. Send it in the header{' '}
        <Text className="font-mono text-xs text-ink">Authorization: Bearer …</Text>
      </Text>
      <View className="gap-3">
        <LabeledInput label="Token name" value={name} onChangeText={setName} placeholder="e.g. design pipeline" error={(create.error as { fields?: Record<string, string> } | null)?.fields?.name} />
        <ActionButton label="Create token" tone="outline" busy={create.isPending} onPress={() => create.mutate(name, { onSuccess: () => setName('') })} />
        {create.data ? (
          <View className="gap-2 rounded-md border border-ochre bg-ochre-soft p-3">
            <Text className="font-medium text-sm text-ink">! Copy this now — it will not be shown again:</Text>
            <Text selectable accessibilityLabel="New token" className="font-mono text-sm text-ink">
              {create.data.secret}
            </Text>
          </View>
        ) : null}
        {revoke.error ? <Notice kind="refused">{revoke.error.message}</Notice> : null}
        {tokens.data?.tokens.map((t) => (
          <View key={t.id} className="flex-row flex-wrap items-center justify-between gap-2 border-t border-rule pt-3">
            <View className="min-w-[180px] flex-1">
              <Text className="font-medium text-ink">{t.name}</Text>
              <Text className="font-mono text-xs text-ink-faint">
                {t.hint}… · made {when(t.createdAt)} · last used {when(t.lastUsedAt)}
              </Text>
            </View>
            {t.revokedAt ? (
              <Text className="text-sm text-ink-faint">× revoked {when(t.revokedAt)}</Text>
            ) : (
              <ActionButton label={`Revoke ${t.name}`} tone="outline" onPress={() => revoke.mutate(t.id)} busy={revoke.isPending && revoke.variables === t.id} />
            )}
          </View>
        ))}
      </View>
    </Card>
  );
}
