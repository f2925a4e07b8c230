import { View } from 'react-native';
import type { EdgeDetail } from '@/lib/schemas/audit';
import { fmt } from '../ui/format';
import { fig, pct } from './numbers';
import { Text } from '../ui/text';
import { flagText, limitText } from './looks';
import type { SignDetail } from './response-geometry';
import { ClassTag } from './tags';

/** A label on the left, a right-aligned monospaced figure on the right. */
export function FigureRow({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <View className="flex-row items-baseline justify-between gap-3 border-b border-rule py-1">
      <Text className="shrink text-sm text-ink-soft">{label}</Text>
      <Text className="text-right font-mono text-sm text-ink">
        {value}
        {note ? <Text className="font-mono text-xs text-ink-faint"> {note}</Text> : null}
      </Text>
    </View>
  );
}

function SignFigures({ title, d }: { title: string; d: SignDetail | null }) {
  return (
    <View className="min-w-[220px] flex-1 gap-0.5">
      <Text className="font-medium text-sm text-ink">{title}</Text>
      {d ? (
        <>
          <View className="py-1"><ClassTag cls={d.class} /></View>
          <FigureRow label="exponent p" value={d.exponent === null ? '—' : d.exponent.toFixed(3)} />
          <FigureRow label="prefactor c" value={fmt(d.prefactor, 4)} />
          <FigureRow label="slope, small → large |ε|" value={`${d.slopeSmall === null ? '—' : d.slopeSmall.toFixed(2)} → ${d.slopeLarge === null ? '—' : d.slopeLarge.toFixed(2)}`} />
          <FigureRow label="crossover |ε|" value={fmt(d.crossoverEps, 3)} />
          <FigureRow label="noise floor" value={fmt(d.noiseFloor, 2)} />
          {d.flags.map((f) => (
            <Text key={f} className="pt-1 text-xs leading-4 text-ink-soft">⚑ {flagText[f] ?? f}</Text>
          ))}
        </>
      ) : (
        <Text className="text-sm text-ink-faint">not swept on this side</Text>
      )}
    </View>
  );
}

/** Per-sign fits, the tolerance budget and the first-order sensitivity of one edge. */
export function EdgeFigures({ edge }: { edge: EdgeDetail }) {
  const b = edge.budget;
  const s = edge.sensitivityDetail;
  return (
    <View className="gap-4">
      <View className="flex-row flex-wrap gap-4">
        <SignFigures title="+ε (weight raised)" d={edge.plus} />
        <SignFigures title="−ε (weight lowered)" d={edge.minus} />
      </View>
      <View className="gap-0.5">
        <Text className="font-medium text-sm text-ink">Tolerance</Text>
        <FigureRow label="largest safe |ε|" value={fig(b.eps, 4)} note="weight units" />
        <FigureRow label="as a share of the weight" value={b.relative === null ? '—' : `${pct(b.relative, 3)} %`} />
        <FigureRow label="allowed |Δ Re λ2| (τ·Re λ2)" value={fmt(b.allowedDelta, 3)} />
        <FigureRow label="limited by" value={limitText[b.limitedBy] ?? b.limitedBy} />
        <FigureRow label="checked by a direct solve" value={b.confirmed ? '✓ first prediction held' : '↓ bisected down to pass'} />
      </View>
      <View className="gap-0.5">
        <Text className="font-medium text-sm text-ink">First-order sensitivity</Text>
        {s ? (
          <>
            <FigureRow label="Re ∂λ2/∂w" value={fmt(s.re, 4)} />
            <FigureRow label="Im ∂λ2/∂w" value={fmt(s.im, 4)} />
            <FigureRow label="eigenvalue condition" value={fmt(s.condition, 3)} />
          </>
        ) : (
          <Text className="text-sm text-ink-soft">None: λ2 is not simple here, so no derivative exists — the response is what the ladder measured.</Text>
        )}
      </View>
    </View>
  );
}
