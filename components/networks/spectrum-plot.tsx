import { useMemo, useState } from 'react';
import { View } from 'react-native';
import Svg, { Circle, G, Line, Polygon, Rect, Text as SvgText } from 'react-native-svg';
import type { VersionSummary } from '@/lib/schemas/network';
import { Button } from '../ui/button';
import { fmtComplex, fmtTick } from '../ui/format';
import { Text } from '../ui/text';
import { markSpectrum, niceTicks, type SpectrumPoint } from './spectrum-geometry';

const H = 240;
const PAD = { l: 50, r: 14, t: 12, b: 30 };

/** Eigenvalues in the complex plane; λ2's cluster as diamonds, the zero mode as a square. */
export function SpectrumPlot({ summary }: { summary: VersionSummary }) {
  const [width, setWidth] = useState(320);
  const [picked, setPicked] = useState<SpectrumPoint | null>(null);
  const [table, setTable] = useState(false);
  const points = useMemo(() => markSpectrum(summary), [summary]);
  const { xs, ys, x, y } = useMemo(() => {
    const re = points.map((p) => p.re);
    const im = points.map((p) => p.im);
    const x0 = Math.min(0, ...re), x1 = Math.max(...re, 1e-9);
    const yMax = Math.max(1e-9, ...im.map(Math.abs));
    const xPad = (x1 - x0) * 0.05 || 1;
    const xs = niceTicks(x0 - xPad, x1 + xPad);
    const ys = niceTicks(-yMax * 1.15, yMax * 1.15, 4);
    const [a, b] = [Math.min(xs[0], x0 - xPad), Math.max(xs[xs.length - 1], x1 + xPad)];
    const [c, d] = [Math.min(ys[0], -yMax * 1.15), Math.max(ys[ys.length - 1], yMax * 1.15)];
    const x = (v: number) => PAD.l + ((v - a) / (b - a)) * (width - PAD.l - PAD.r);
    const y = (v: number) => PAD.t + ((d - v) / (d - c)) * (H - PAD.t - PAD.b);
    return { xs, ys, x, y };
  }, [points, width]);

  return (
    <View onLayout={(e) => setWidth(Math.max(240, e.nativeEvent.layout.width))}>
      <Svg width={width} height={H} accessibilityLabel={`Spectrum plot of ${points.length} eigenvalues; λ2 cluster of ${summary.cluster.size}`}>
        <Rect x={PAD.l} y={PAD.t} width={width - PAD.l - PAD.r} height={H - PAD.t - PAD.b} fill="#FBFAF6" stroke="#D6CFBF" />
        {xs.map((t) => (
          <G key={`x${t}`}>
            <Line x1={x(t)} x2={x(t)} y1={PAD.t} y2={H - PAD.b} stroke="#E9E4D8" />
            <SvgText x={x(t)} y={H - PAD.b + 14} fontSize={10} fontFamily="JetBrainsMono_400Regular" fill="#6B7785" textAnchor="middle">{fmtTick(t)}</SvgText>
          </G>
        ))}
        {ys.map((t) => (
          <G key={`y${t}`}>
            <Line x1={PAD.l} x2={width - PAD.r} y1={y(t)} y2={y(t)} stroke={t === 0 ? '#B9B09C' : '#E9E4D8'} />
            <SvgText x={PAD.l - 4} y={y(t) + 3} fontSize={10} fontFamily="JetBrainsMono_400Regular" fill="#6B7785" textAnchor="end">{fmtTick(t)}</SvgText>
          </G>
        ))}
        <SvgText x={width - PAD.r} y={H - 4} fontSize={10} fill="#6B7785" textAnchor="end">Re λ</SvgText>
        <SvgText x={4} y={PAD.t + 8} fontSize={10} fill="#6B7785">Im λ</SvgText>
        {points.map((p) => {
          const cx = x(p.re), cy = y(p.im);
          const onPress = () => setPicked(p);
          if (p.role === 'cluster') return <Polygon key={p.index} points={`${cx},${cy - 6} ${cx + 6},${cy} ${cx},${cy + 6} ${cx - 6},${cy}`} fill="#A84B2A" onPress={onPress} />;
          if (p.role === 'zero') return <Rect key={p.index} x={cx - 4} y={cy - 4} width={8} height={8} fill="none" stroke="#1D2733" strokeWidth={1.5} onPress={onPress} />;
          return <Circle key={p.index} cx={cx} cy={cy} r={3} fill="#3C4A5A" opacity={0.75} onPress={onPress} />;
        })}
      </Svg>
      <View className="mt-2 flex-row flex-wrap gap-x-4 gap-y-1">
        <Text className="text-xs text-ink-soft"><Text className="text-rust">◆</Text> λ2 cluster ({summary.cluster.size})</Text>
        <Text className="text-xs text-ink-soft">□ zero (consensus) mode</Text>
        <Text className="text-xs text-ink-soft">● other eigenvalues</Text>
      </View>
      <Text className="mt-1 font-mono text-xs text-ink-soft">
        {picked ? `λ${picked.index + 1} = ${fmtComplex(picked.re, picked.im, 6)} (${picked.role})` : 'Select a point to read its value.'}
      </Text>
      <View className="mt-2 self-start">
        <Button label={table ? 'Hide the table of values' : 'Show the table of values'} tone="quiet" onPress={() => setTable(!table)} />
      </View>
      {table ? <SpectrumTable points={points} /> : null}
    </View>
  );
}

function SpectrumTable({ points }: { points: SpectrumPoint[] }) {
  const rows = [...points].sort((a, b) => a.re - b.re || a.im - b.im).slice(0, 60);
  return (
    <View accessibilityRole="list" className="mt-2 gap-0.5">
      {rows.map((p) => (
        <View key={p.index} className="flex-row gap-3 border-b border-rule py-1">
          <Text className="w-10 font-mono text-xs text-ink-faint">{p.role === 'cluster' ? '◆' : p.role === 'zero' ? '□' : '●'}</Text>
          <Text className="flex-1 font-mono text-xs text-ink">{fmtComplex(p.re, p.im, 8)}</Text>
        </View>
      ))}
      {points.length > rows.length ? <Text className="text-xs text-ink-faint">…the {points.length - rows.length} eigenvalues with larger real parts are not listed.</Text> : null}
    </View>
  );
}
