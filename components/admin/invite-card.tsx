import { useState } from 'react';
import { View } from 'react-native';
import { ActionButton, LabeledInput, Notice } from '@/components/account/form-bits';
import { Card } from '@/components/ui/card';
import { useInvite } from '@/lib/api/admin';
import { ApiError } from '@/lib/api/client';
import type { Role } from '@/lib/schemas/roles';
import { RolePicker } from './role-picker';

export function InviteCard() {
  const invite = useInvite();
  const [email, setEmail] = useState('');
  const [displayName, setName] = useState('');
  const [picked, setPicked] = useState<Role[]>([]);
  const err = invite.error instanceof ApiError ? invite.error : null;
  const submit = () =>
    invite.mutate({ email, displayName, roles: picked }, { onSuccess: () => (setEmail(''), setName(''), setPicked([])) });
  return (
    <Card title="Invite someone">
      <View className="gap-3">
        <LabeledInput label="E-mail address" value={email} onChangeText={setEmail} inputMode="email" error={err?.fields?.email} />
        <LabeledInput label="Name" value={displayName} onChangeText={setName} autoCapitalize="words" error={err?.fields?.displayName} />
        <RolePicker label="Roles" value={picked} onChange={setPicked} />
        {err?.fields?.roles ? <Notice kind="refused">{err.fields.roles}</Notice> : null}
        {invite.data ? <Notice kind="done">Invitation sent to {invite.data.email}. It is in the outbox.</Notice> : null}
        {invite.error && !err?.fields ? <Notice kind="refused">{invite.error.message}</Notice> : null}
        <ActionButton label="Send invitation" onPress={submit} busy={invite.isPending} />
      </View>
    </Card>
  );
}
