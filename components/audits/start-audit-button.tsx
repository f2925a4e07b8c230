import { useRouter } from 'expo-router';
import { useMe } from '@/lib/api/account';
import { Button } from '../ui/button';

/** Shown to analysts on a network's page; opens the settings form for that version. */
export function StartAuditButton({ networkId, version }: { networkId: number; version: number | undefined }) {
  const me = useMe();
  const router = useRouter();
  if (!version || !me.data?.roles.includes('analyst')) return null;
  return <Button label="Start an audit" onPress={() => router.push(`/audits/new?networkId=${networkId}&version=${version}`)} />;
}
