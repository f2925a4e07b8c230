import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { useNetworks, type NetworkSort } from '@/lib/api/networks';
import { Button } from '../ui/button';
import { Choice } from '../ui/choice';
import { Field } from '../ui/field';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, Loading } from '../ui/states';
import { NetworkCard } from './network-card';

const sorts: { value: NetworkSort; label: string }[] = [
  { value: 'updated', label: 'Recent' },
  { value: 'name', label: 'Name' },
  { value: 'nodes', label: 'Size' },
  { value: 'lambda2', label: 'Re λ2' },
];

export function NetworkListScreen() {
  const [q, setQ] = useState('');
  const [sort, setSort] = useState<NetworkSort>('updated');
  const list = useNetworks(q.trim(), sort);
  const router = useRouter();
  return (
    <Screen kicker="Library" title="Networks">
      <View className="flex-row flex-wrap items-end gap-3">
        <View className="min-w-[220px] flex-1">
          <Field label="Search" placeholder="name or description" value={q} onChangeText={setQ} autoCapitalize="none" />
        </View>
        <Button label="Import a network" onPress={() => router.push('/networks/import')} />
      </View>
      <Choice label="Sort by" value={sort} options={sorts} onChange={setSort} />
      {list.isPending ? <Loading what="networks" /> : null}
      {list.isError ? <ErrorState message={list.error.message} onRetry={() => list.refetch()} /> : null}
      {list.data && list.data.networks.length === 0 ? (
        <EmptyState
          title={q ? 'Nothing matches' : 'No networks yet'}
          body={q ? `No network name or description contains “${q}”.` : 'Import an edge list (CSV, TSV, JSON or GraphML) to begin.'}
        />
      ) : null}
      <View className="gap-3">
        {list.data?.networks.map((n) => <NetworkCard key={n.id} network={n} />)}
      </View>
    </Screen>
  );
}
