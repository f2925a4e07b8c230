import { useLocalSearchParams, useRouter } from 'expo-router';
import { useEffect, useState } from 'react';
import { View } from 'react-native';
import { useStartAudit } from '@/lib/api/audits';
import { ApiError } from '@/lib/api/client';
import { useNetwork, useNetworkVersion } from '@/lib/api/networks';
import { conventionText } from '../networks/convention-badge';
import { Button } from '../ui/button';
import { Card, Paragraph } from '../ui/card';
import { Choice } from '../ui/choice';
import { Field } from '../ui/field';
import { fmt, fmtInt } from '../ui/format';
import { Screen } from '../ui/screen';
import { ErrorState, Loading } from '../ui/states';
import { Text } from '../ui/text';
import { defaultStartForm, ladderSteps, settingsFromForm, type StartForm, type StartFormErrors } from './start-audit-form';

/** `/audits/new?networkId=&version=`: the sweep's settings, then the run. */
export function StartAuditScreen() {
  const params = useLocalSearchParams<{ networkId?: string; version?: string }>();
  const networkId = Number(params.networkId);
  const network = useNetwork(networkId);
  const versionNo = params.version ? Number(params.version) : network.data?.latest.version;
  const version = useNetworkVersion(networkId, versionNo);
  const [form, setForm] = useState<StartForm | null>(null);
  const [errors, setErrors] = useState<StartFormErrors>({});
  const start = useStartAudit();
  const router = useRouter();

  useEffect(() => {
    if (network.data && !form) setForm(defaultStartForm(network.data.convention));
  }, [network.data, form]);

  if (!Number.isFinite(networkId)) return <Screen kicker="Audits" title="Start an audit"><ErrorState message="Open a network first and start the audit from its page." /></Screen>;
  if (!network.data || !form) return <Screen kicker="Audits" title="Start an audit">{network.isError ? <ErrorState message={network.error.message} onRetry={() => network.refetch()} /> : <Loading what="the network" />}</Screen>;

  const set = (k: keyof StartForm) => (v: string) => setForm({ ...form, [k]: v });
  const edges = version.data?.edgeCount;
  const steps = ladderSteps(Number(form.from), Number(form.to), Number(form.step));
  const sides = form.signs === 'both' ? 2 : 1;
  const apiError = start.error instanceof ApiError ? start.error : null;

  function submit() {
    const r = settingsFromForm(form!);
    if (!r.ok) return setErrors(r.errors);
    setErrors({});
    start.mutate({ networkId, version: versionNo!, settings: r.settings }, { onSuccess: (a) => router.replace(`/audits/${a.id}`) });
  }

  return (
    <Screen kicker={`Audits · ${network.data.name} · version ${versionNo}`} title="Start an audit">
      <Paragraph>
        Every edge weight is changed by ±ε, with ε = w̄·10^(−t) for t along the ladder below (w̄ is the mean weight), and Re λ2 is recomputed at each step. How it moves decides the class and the weight tolerance of the edge.
      </Paragraph>
      <Card title="Ladder of steps">
        <View className="flex-row flex-wrap gap-3">
          <View className="min-w-[96px] flex-1"><Field label="From t" mono keyboardType="decimal-pad" value={form.from} onChangeText={set('from')} error={errors.from} hint="largest step" /></View>
          <View className="min-w-[96px] flex-1"><Field label="To t" mono keyboardType="decimal-pad" value={form.to} onChangeText={set('to')} error={errors.to} hint="smallest step" /></View>
          <View className="min-w-[96px] flex-1"><Field label="Step of t" mono keyboardType="decimal-pad" value={form.step} onChangeText={set('step')} error={errors.step} /></View>
        </View>
        {errors.ladder ? <Text className="mt-2 text-sm text-rust">× {errors.ladder}</Text> : null}
        <Text className="mt-3 font-mono text-xs text-ink-soft">
          {steps > 0 ? `${steps} rungs per sign: ε from w̄·10^−${form.from} down to w̄·10^−${form.to}` : 'the ladder needs To t above From t'}
        </Text>
      </Card>
      <Card title="Signs and tolerance">
        <View className="gap-4">
          <Choice
            label="Perturb"
            value={form.signs}
            onChange={set('signs')}
            options={[{ value: 'both', label: 'both signs (+ε and −ε)' }, { value: 'plus', label: '+ε only' }, { value: 'minus', label: '−ε only' }]}
          />
          <Field label="Tolerance τ (% of Re λ2)" mono keyboardType="decimal-pad" value={form.tolerancePct} onChangeText={set('tolerancePct')} error={errors.tolerance} hint="the change of convergence rate you can live with; sets each edge’s weight tolerance" />
          <Choice label="Laplacian convention" value={form.convention} onChange={set('convention')} options={[{ value: 'in', label: conventionText.in.long }, { value: 'out', label: conventionText.out.long }]} />
        </View>
      </Card>
      <Card title="This run">
        <Text className="font-mono text-sm text-ink">
          {edges !== undefined ? `${fmtInt(edges)} edges × ${steps} rungs × ${sides} sign${sides === 2 ? 's' : ''} = ${fmtInt(edges * steps * sides)} eigenvalue solves` : 'counting edges…'}
        </Text>
        {version.data?.summary ? <Text className="mt-1 font-mono text-xs text-ink-soft">Re λ2 now {fmt(version.data.summary.lambda2.re)} · τ·Re λ2 = {fmt((Number(form.tolerancePct) / 100) * version.data.summary.lambda2.re, 3)}</Text> : null}
      </Card>
      {start.isError ? <ErrorState message={apiError?.fields ? `${start.error.message} ${Object.values(apiError.fields).join(' ')}` : start.error.message} /> : null}
      <View className="flex-row flex-wrap gap-3">
        <Button label="Start the sweep" onPress={submit} busy={start.isPending} disabled={!versionNo} />
        <Button label="Back to the network" tone="secondary" onPress={() => router.push(`/networks/${networkId}`)} />
      </View>
    </Screen>
  );
}
