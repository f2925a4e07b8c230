import { useEffect, useState } from 'react';
import { ActionButton, LabeledInput, Notice } from '@/components/account/form-bits';
import { useAcceptInvitation } from '@/lib/api/account';
import { ApiError } from '@/lib/api/client';
import { AuthFrame, DoneThenSignIn, tokenFromHash } from './auth-frame';

/** Opened from the invitation e-mail: choose the first password. */
export function InvitationScreen() {
  const accept = useAcceptInvitation();
  const [token, setToken] = useState('');
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const [mismatch, setMismatch] = useState(false);
  useEffect(() => setToken(tokenFromHash()), []);
  const err = accept.error instanceof ApiError ? accept.error : null;
  const submit = () => {
    setMismatch(password !== repeat);
    if (password === repeat) accept.mutate({ token, password });
  };
  if (accept.data) return <DoneThenSignIn title="Password set">Your password for {accept.data.email} is set. Sign in to start.</DoneThenSignIn>;
  return (
    <AuthFrame title="Accept your invitation" lead="Choose a password of at least 12 characters. The link works once.">
      <LabeledInput label="New password" value={password} onChangeText={setPassword} secureTextEntry autoComplete="new-password" error={err?.fields?.password} />
      <LabeledInput
        label="Repeat the password"
        value={repeat}
        onChangeText={setRepeat}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
        error={mismatch ? 'The two entries differ.' : undefined}
      />
      {accept.error ? <Notice kind="refused">{err?.fields?.token ?? accept.error.message}</Notice> : null}
      <ActionButton label="Set password" onPress={submit} busy={accept.isPending} />
    </AuthFrame>
  );
}
