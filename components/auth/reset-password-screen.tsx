import { Link } from 'expo-router';
import { useEffect, useState } from 'react';
import { ActionButton, LabeledInput, Notice } from '@/components/account/form-bits';
import { useCompleteReset, useRequestReset } from '@/lib/api/account';
import { ApiError } from '@/lib/api/client';
import { AuthFrame, DoneThenSignIn, tokenFromHash } from './auth-frame';

/** Without a token: ask for a reset link. With one (from the e-mail): choose the new password. */
export function ResetPasswordScreen() {
  const [token, setToken] = useState<string | null>(null);
  useEffect(() => setToken(tokenFromHash()), []);
  if (token === null) return <AuthFrame title="Reset your password">{null}</AuthFrame>;
  return token ? <CompleteReset token={token} /> : <RequestReset />;
}

function RequestReset() {
  const request = useRequestReset();
  const [email, setEmail] = useState('');
  const err = request.error instanceof ApiError ? request.error : null;
  return (
    <AuthFrame title="Reset your password" lead="We will e-mail a link to choose a new password. It works once, for one hour.">
      <LabeledInput label="E-mail" value={email} onChangeText={setEmail} inputMode="email" autoComplete="email" error={err?.fields?.email} />
      {request.data ? <Notice kind="done">If {email} has an account, a link is on its way.</Notice> : null}
      {request.error && !err?.fields ? <Notice kind="refused">{request.error.message}</Notice> : null}
      <ActionButton label="Send the link" onPress={() => request.mutate({ email })} busy={request.isPending} />
      <Link href="/sign-in" className="font-medium text-sm text-rust underline">
        Back to sign-in
      </Link>
    </AuthFrame>
  );
}

function CompleteReset({ token }: { token: string }) {
  const complete = useCompleteReset();
  const [password, setPassword] = useState('');
  const err = complete.error instanceof ApiError ? complete.error : null;
  if (complete.data) {
    return <DoneThenSignIn title="Password changed">The password for {complete.data.email} is changed, and its other sessions have ended.</DoneThenSignIn>;
  }
  return (
    <AuthFrame title="Choose a new password" lead="At least 12 characters.">
      <LabeledInput label="New password" value={password} onChangeText={setPassword} secureTextEntry autoComplete="new-password" error={err?.fields?.password} />
      {complete.error ? <Notice kind="refused">{complete.error.message}</Notice> : null}
      <ActionButton label="Change password" onPress={() => complete.mutate({ token, password })} busy={complete.isPending} />
    </AuthFrame>
  );
}
