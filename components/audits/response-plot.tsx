import { useMemo, useState } from 'react';
import { View } from 'react-native';
import Svg, { Circle, G, Line, Polyline, Rect, Text as SvgText } from 'react-native-svg';
import { Button } from '../ui/button';
import { fmt } from '../ui/format';
import { Text } from '../ui/text';
import { responseGeometry, type Frame, type SignDetail } from './response-geometry';

const H = 260;
const PAD: Frame['pad'] = { l: 52, r: 12, t: 12, b: 34 };
const INK = '#1D2733', RUST = '#A84B2A', FAINT = '#6B7785', PAPER = '#FBFAF6';
const colour = { plus: INK, minus: RUST } as const;
const sup: Record<string, string> = { '-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };
export const decadeLabel = (k: number) => (k === 0 ? '1' : `10${[...String(k)].map((c) => sup[c] ?? c).join('')}`);

/** |Δ Re λ2| against |ε| on log–log axes, both signs, with fits, floors and crossovers. */
export function ResponsePlot({ plus, minus }: { plus: SignDetail | null; minus: SignDetail | null }) {
  const [width, setWidth] = useState(320);
  const [table, setTable] = useState(false);
  const g = useMemo(() => responseGeometry({ plus, minus }, { width, height: H, pad: PAD }), [plus, minus, width]);
  const bottom = H - PAD.b;
  const usedCount = g.points.filter((p) => p.used).length;

  return (
    <View onLayout={(e) => setWidth(Math.max(260, Math.floor(e.nativeEvent.layout.width)))}>
      <Svg
        width={width}
        height={H}
        accessibilityLabel={`Response plot: ${g.points.length} points, ${usedCount} used in the fit, ${g.fits.length} fitted line${g.fits.length === 1 ? '' : 's'}`}
      >
        <Rect x={PAD.l} y={PAD.t} width={width - PAD.l - PAD.r} height={bottom - PAD.t} fill={PAPER} stroke="#D6CFBF" />
        {g.xTicks.map((t) => (
          <G key={`x${t.value}`}>
            <Line x1={t.at} x2={t.at} y1={PAD.t} y2={bottom} stroke="#E9E4D8" />
            <SvgText x={t.at} y={bottom + 14} fontSize={10} fontFamily="JetBrainsMono_400Regular" fill={FAINT} textAnchor="middle">
              {decadeLabel(Math.round(Math.log10(t.value)))}
            </SvgText>
          </G>
        ))}
        {g.yTicks.map((t) => (
          <G key={`y${t.value}`}>
            <Line x1={PAD.l} x2={width - PAD.r} y1={t.at} y2={t.at} stroke="#E9E4D8" />
            <SvgText x={PAD.l - 5} y={t.at + 3} fontSize={10} fontFamily="JetBrainsMono_400Regular" fill={FAINT} textAnchor="end">
              {decadeLabel(Math.round(Math.log10(t.value)))}
            </SvgText>
          </G>
        ))}
        <SvgText x={width - PAD.r} y={H - 4} fontSize={10} fill={FAINT} textAnchor="end">|ε| (weight units)</SvgText>
        <SvgText x={PAD.l + 4} y={PAD.t + 11} fontSize={10} fill={FAINT}>|Δ Re λ2|</SvgText>
        {g.floors.map((f) => (
          <Polyline key={`floor-${f.sign}`} points={f.path} fill="none" stroke={FAINT} strokeWidth={1.2} strokeDasharray="5 4" />
        ))}
        {g.crossovers.map((c) => (
          <G key={`cross-${c.sign}`}>
            <Line x1={c.at} x2={c.at} y1={PAD.t} y2={bottom} stroke={colour[c.sign]} strokeWidth={1} strokeDasharray="2 3" />
            <SvgText x={c.at + 3} y={bottom - 5} fontSize={9} fill={colour[c.sign]}>{c.sign === 'plus' ? '+' : '−'} crossover</SvgText>
          </G>
        ))}
        {g.fits.map((f) => (
          <Line key={`fit-${f.sign}`} x1={f.x1} y1={f.y1} x2={f.x2} y2={f.y2} stroke={colour[f.sign]} strokeWidth={1.8} opacity={0.8} />
        ))}
        {g.points.map((p, i) =>
          p.sign === 'plus' ? (
            <Circle key={i} cx={p.cx} cy={p.cy} r={3.6} fill={p.used ? INK : PAPER} stroke={INK} strokeWidth={1.3} />
          ) : (
            <Rect key={i} x={p.cx - 3.4} y={p.cy - 3.4} width={6.8} height={6.8} fill={p.used ? RUST : PAPER} stroke={RUST} strokeWidth={1.3} />
          ),
        )}
      </Svg>
      <View className="mt-2 flex-row flex-wrap gap-x-4 gap-y-1">
        <Text className="text-xs text-ink-soft">● ○ +ε (filled: in the fit)</Text>
        <Text className="text-xs text-ink-soft"><Text className="text-xs text-rust">■ □</Text> −ε (filled: in the fit)</Text>
        <Text className="text-xs text-ink-soft">── fitted law</Text>
        <Text className="text-xs text-ink-soft">- - - noise floor</Text>
        {g.crossovers.length ? <Text className="text-xs text-ink-soft">┆ crossover |ε|</Text> : null}
      </View>
      {g.skipped ? <Text className="mt-1 text-xs text-ink-faint">{g.skipped} point{g.skipped === 1 ? '' : 's'} with no change at all (Δ = 0) cannot sit on a log axis and are not drawn.</Text> : null}
      <View className="mt-1 self-start">
        <Button label={table ? 'Hide the ladder values' : 'Show the ladder values'} tone="quiet" onPress={() => setTable(!table)} />
      </View>
      {table ? <LadderTable plus={plus} minus={minus} /> : null}
    </View>
  );
}

function LadderTable({ plus, minus }: { plus: SignDetail | null; minus: SignDetail | null }) {
  const rows = [...(plus?.points ?? []), ...(minus?.points ?? [])];
  return (
    <View accessibilityRole="list" className="mt-1">
      <View className="flex-row gap-2 border-b border-rule-strong py-1">
        {['ε', 'Δ Re λ2', 'floor', 'fit'].map((h) => (
          <Text key={h} className="flex-1 text-right text-xs text-ink-faint">{h}</Text>
        ))}
      </View>
      {rows.map((p, i) => (
        <View key={i} className="flex-row gap-2 border-b border-rule py-0.5">
          <Text className="flex-1 text-right font-mono text-xs text-ink">{fmt(p.eps, 3)}</Text>
          <Text className="flex-1 text-right font-mono text-xs text-ink">{fmt(p.delta, 3)}</Text>
          <Text className="flex-1 text-right font-mono text-xs text-ink-soft">{fmt(p.floor, 2)}</Text>
          <Text className="flex-1 text-right font-mono text-xs text-ink-soft">{p.used ? '●' : '○'}{p.tracked ? '' : ' ×'}</Text>
        </View>
      ))}
    </View>
  );
}
