import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { ActionButton, LabeledInput, Notice } from '@/components/account/form-bits';
import { Text } from '@/components/ui/text';
import { useSignIn } from '@/lib/api/account';
import { ApiError } from '@/lib/api/client';
import { AuthFrame } from './auth-frame';

export function SignInScreen() {
  const router = useRouter();
  const signIn = useSignIn();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const err = signIn.error instanceof ApiError ? signIn.error : null;
  const submit = () => signIn.mutate({ email, password }, { onSuccess: () => router.replace('/') });
  return (
    <AuthFrame title="Sign in" lead="Use the e-mail address your invitation was sent to.">
      <LabeledInput label="E-mail" value={email} onChangeText={setEmail} inputMode="email" autoComplete="email" error={err?.fields?.email} />
      <LabeledInput
        label="Password"
        value={password}
        onChangeText={setPassword}
        secureTextEntry
        autoComplete="current-password"
        onSubmitEditing={submit}
        error={err?.fields?.password}
      />
      {signIn.error ? <Notice kind="refused">{signIn.error.message}</Notice> : null}
      <ActionButton label="Sign in" onPress={submit} busy={signIn.isPending} />
      <Link href="/reset-password" className="font-medium text-sm text-rust underline">
        Forgotten your password?
      </Link>
      <Text className="text-xs leading-5 text-ink-faint">Accounts are created by an admin; there is no sign-up.</Text>
    </AuthFrame>
  );
}
