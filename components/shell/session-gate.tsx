import { useRouter } from 'expo-router';
import { useEffect, type ReactNode } from 'react';
import { View } from 'react-native';
import { Text } from '@/components/ui/text';
import { useMe } from '@/lib/api/account';

/**
 * Shows the signed-in pages only to a signed-in person and sends anybody
 * else to /sign-in. The server serves these pages to anyone; the API is what
 * refuses their data — this only spares a visitor a page of refusals.
 */
export function SessionGate({ children }: { children: ReactNode }) {
  const router = useRouter();
  const me = useMe();
  const anonymous = me.isSuccess && me.data === null;
  useEffect(() => {
    if (anonymous) router.replace('/sign-in');
  }, [anonymous, router]);
  if (me.data) return <>{children}</>;
  return (
    <View className="flex-1 items-center justify-center p-6">
      <Text className="text-sm text-ink-soft">
        {me.isError ? `The server could not say who you are: ${me.error.message}` : anonymous ? 'Taking you to sign-in…' : 'Checking your session…'}
      </Text>
    </View>
  );
}
