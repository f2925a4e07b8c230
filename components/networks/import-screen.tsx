import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { ApiError } from '@/lib/api/client';
import { useImportNetwork, useNetwork } from '@/lib/api/networks';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Choice } from '../ui/choice';
import { Field } from '../ui/field';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { conventionText } from './convention-badge';
import { useImportFormState, type FormatChoice } from './import-form-state';
import { ImportProblems, type ShownProblem } from './import-problems';
import { pickFile } from './pick-file';

const formats: { value: FormatChoice; label: string }[] = [
  { value: 'auto', label: 'Detect' },
  { value: 'csv', label: 'CSV' },
  { value: 'tsv', label: 'TSV' },
  { value: 'json', label: 'JSON' },
  { value: 'graphml', label: 'GraphML' },
];

/** New network, or the next version of one (`?networkId=`). A refused file lists every problem. */
export function ImportScreen() {
  const params = useLocalSearchParams<{ networkId?: string }>();
  const networkId = params.networkId ? Number(params.networkId) : undefined;
  const target = useNetwork(networkId ?? NaN);
  const f = useImportFormState();
  const [advanced, setAdvanced] = useState(false);
  const [failure, setFailure] = useState<{ title: string; problems: ShownProblem[]; fields?: Record<string, string> } | null>(null);
  const mutation = useImportNetwork();
  const router = useRouter();

  async function choose() {
    const file = await pickFile('.csv,.tsv,.txt,.json,.graphml,.xml,text/csv,application/json');
    if (file) f.setFile(file);
  }

  function submit() {
    setFailure(null);
    mutation.mutate(
      { fields: f.toRequest(networkId), file: f.source === 'file' ? (f.file ?? undefined) : undefined },
      {
        onSuccess: (r) => router.replace(`/networks/${r.networkId}?version=${r.version}`),
        onError: (e) =>
          setFailure({
            title: e.message,
            problems: e instanceof ApiError ? (e.problems ?? []) : [],
            fields: e instanceof ApiError ? e.fields : undefined,
          }),
      },
    );
  }

  const ready = (networkId || f.name.trim()) && (f.source === 'file' ? !!f.file : f.text.trim() !== '');
  return (
    <Screen kicker={networkId ? `New version of ${target.data?.name ?? 'network'}` : 'Library'} title="Import a network">
      {!networkId ? (
        <Card>
          <View className="gap-4">
            <Field label="Name" value={f.name} onChangeText={f.setName} placeholder="e.g. North quay relay, tuned 3" error={failure?.fields?.name} />
            <Field label="Description (optional)" value={f.description} onChangeText={f.setDescription} multiline />
            <Choice
              label="Laplacian convention"
              value={f.convention}
              onChange={f.setConvention}
              options={[
                { value: 'in', label: conventionText.in.long },
                { value: 'out', label: conventionText.out.long },
              ]}
            />
          </View>
        </Card>
      ) : null}
      <Card>
        <View className="gap-4">
          <Choice label="Edge list from" value={f.source} onChange={f.setSource} options={[{ value: 'file', label: 'A file' }, { value: 'paste', label: 'Pasted text' }]} />
          {f.source === 'file' ? (
            <View className="flex-row flex-wrap items-center gap-3">
              <Button label={f.file ? 'Choose another file' : 'Choose a file'} tone="secondary" onPress={choose} />
              <Text className="font-mono text-sm text-ink-soft">{f.file ? `${f.file.name} · ${(f.file.size / 1024).toFixed(1)} KiB` : 'no file chosen'}</Text>
            </View>
          ) : (
            <Field label="Edge list" mono multiline numberOfLines={8} value={f.text} onChangeText={f.setText} placeholder={'source,target,weight\nmast-a,mast-b,1.25'} />
          )}
          <Choice label="Format" value={f.format} onChange={f.setFormat} options={formats} />
          <Button label={advanced ? 'Hide column and duplicate options' : 'Column, GraphML and duplicate options'} tone="quiet" onPress={() => setAdvanced(!advanced)} />
          {advanced ? <AdvancedOptions f={f} /> : null}
        </View>
      </Card>
      {/* Beside the button the person just pressed, so the answer is in view. */}
      {failure ? <ImportProblems title={failure.title} problems={failure.problems} /> : null}
      <View className="flex-row flex-wrap gap-3">
        <Button label={networkId ? 'Import as next version' : 'Import network'} onPress={submit} busy={mutation.isPending} disabled={!ready} />
        <Button label="Cancel" tone="secondary" onPress={() => router.back()} />
      </View>
    </Screen>
  );
}

function AdvancedOptions({ f }: { f: ReturnType<typeof useImportFormState> }) {
  const set = (k: 'source' | 'target' | 'weight') => (v: string) => f.setColumns({ ...f.columns, [k]: v });
  return (
    <View className="gap-4 border-t border-rule pt-4">
      <Text className="text-sm text-ink-soft">Column names, when the header does not say source, target and weight:</Text>
      <View className="flex-row flex-wrap gap-3">
        <View className="min-w-[140px] flex-1"><Field label="Source column" value={f.columns.source} onChangeText={set('source')} mono /></View>
        <View className="min-w-[140px] flex-1"><Field label="Target column" value={f.columns.target} onChangeText={set('target')} mono /></View>
        <View className="min-w-[140px] flex-1"><Field label="Weight column" value={f.columns.weight} onChangeText={set('weight')} mono /></View>
      </View>
      <Field label="GraphML weight key" hint="the id or attr.name of the <key for=&quot;edge&quot;> holding weights" value={f.weightKey} onChangeText={f.setWeightKey} mono />
      <Choice label="Undirected edges" value={f.undirected} onChange={f.setUndirected} options={[{ value: 'refuse', label: 'Refuse them' }, { value: 'both-directions', label: 'Enter both directions' }]} />
      <Choice label="Repeated source→target pairs" value={f.duplicates} onChange={f.setDuplicates} options={[{ value: 'refuse', label: 'Refuse them' }, { value: 'sum', label: 'Add their weights' }]} />
    </View>
  );
}
