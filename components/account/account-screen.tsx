import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { useChangePassword, useMe, useSignOut } from '@/lib/api/account';
import { ApiError } from '@/lib/api/client';
import { ActionButton, LabeledInput, Notice } from './form-bits';
import { TokensCard } from './tokens-card';

export function AccountScreen() {
  const router = useRouter();
  const { data: me } = useMe();
  const signOut = useSignOut();
  if (!me) return null;
  return (
    <Screen kicker="You" title="Account">
      <Card title={me.displayName}>
        <Text className="text-ink-soft">{me.email}</Text>
        <Text className="mt-1 text-sm text-ink-soft">Roles: {me.roles.join(', ')}</Text>
        <View className="mt-3 self-start">
          <ActionButton label="Sign out" tone="outline" busy={signOut.isPending} onPress={() => signOut.mutate(undefined, { onSettled: () => router.replace('/sign-in') })} />
        </View>
      </Card>
      <ChangePasswordCard />
      {me.roles.includes('analyst') ? <TokensCard /> : null}
    </Screen>
  );
}

function ChangePasswordCard() {
  const change = useChangePassword();
  const [currentPassword, setCurrent] = useState('');
  const [newPassword, setNew] = useState('');
  const err = change.error instanceof ApiError ? change.error : null;
  return (
    <Card title="Change password">
      <View className="gap-3">
        <LabeledInput label="Current password" value={currentPassword} onChangeText={setCurrent} secureTextEntry autoComplete="current-password" error={err?.fields?.currentPassword} />
        <LabeledInput label="New password" value={newPassword} onChangeText={setNew} secureTextEntry autoComplete="new-password" error={err?.fields?.newPassword} />
        {change.isSuccess ? <Notice kind="done">Password changed. Your other sessions have ended.</Notice> : null}
        {change.error && !err?.fields ? <Notice kind="refused">{change.error.message}</Notice> : null}
        <ActionButton
          label="Change password"
          busy={change.isPending}
          onPress={() => change.mutate({ currentPassword, newPassword }, { onSuccess: () => (setCurrent(''), setNew('')) })}
        />
      </View>
    </Card>
  );
}
