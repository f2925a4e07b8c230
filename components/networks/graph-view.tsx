import { useMemo, useState } from 'react';
import { ScrollView, View } from 'react-native';
import Svg, { Circle, G, Line, Polygon, Text as SvgText } from 'react-native-svg';
import { Button } from '../ui/button';
import { Choice } from '../ui/choice';
import { Text } from '../ui/text';
import { arrowHead, layoutGraph } from './graph-layout';

/** Above this many nodes the drawing is made only on request: it costs seconds and says little. */
export const DRAW_ON_REQUEST_ABOVE = 400;

export function GraphView({ nodes, edges }: { nodes: string[]; edges: { source: string; target: string; weight: number }[] }) {
  const [forced, setForced] = useState(false);
  if (nodes.length > DRAW_ON_REQUEST_ABOVE && !forced) {
    return (
      <View className="gap-2">
        <Text className="text-sm leading-5 text-ink-soft">
          {nodes.length} nodes is more than a drawing can show legibly; the summary and spectrum above cover the whole network.
        </Text>
        <View className="self-start">
          <Button label="Draw it anyway" tone="secondary" onPress={() => setForced(true)} />
        </View>
      </View>
    );
  }
  return <GraphDrawing nodes={nodes} edges={edges} />;
}

function GraphDrawing({ nodes, edges }: { nodes: string[]; edges: { source: string; target: string; weight: number }[] }) {
  const [width, setWidth] = useState(320);
  const [zoom, setZoom] = useState<'1' | '2' | '4'>('1');
  const [weights, setWeights] = useState<'hide' | 'show'>('hide');
  const [picked, setPicked] = useState<string | null>(null);
  const layout = useMemo(() => layoutGraph(nodes, edges), [nodes, edges]);
  const { minX, minY, maxX, maxY } = layout.bounds;
  const pad = 24;
  const w = width * Number(zoom);
  const span = Math.max(maxX - minX, maxY - minY, 1);
  const scale = (w - 2 * pad) / span;
  const h = Math.max(220, (maxY - minY) * scale + 2 * pad);
  const X = (v: number) => pad + (v - minX) * scale;
  const Y = (v: number) => pad + (v - minY) * scale;
  const labels = nodes.length <= 40 || Number(zoom) >= 2;
  const r = nodes.length > 150 ? 3.5 : 5.5;

  return (
    <View onLayout={(e) => setWidth(Math.max(240, e.nativeEvent.layout.width))} className="gap-2">
      <View className="flex-row flex-wrap gap-4">
        <Choice label="Zoom" value={zoom} onChange={setZoom} options={[{ value: '1', label: '1×' }, { value: '2', label: '2×' }, { value: '4', label: '4×' }]} />
        <Choice label="Weights" value={weights} onChange={setWeights} options={[{ value: 'hide', label: 'Hidden' }, { value: 'show', label: 'On edges' }]} />
      </View>
      <ScrollView horizontal={zoom !== '1'} className="rounded-md border border-rule bg-paper-card">
        <Svg width={w} height={h} accessibilityLabel={`Drawing of ${nodes.length} nodes and ${edges.length} edges`}>
          {layout.edges.map((e, i) => {
            const on = picked !== null && (e.source.id === picked || e.target.id === picked);
            const stroke = on ? '#A84B2A' : '#8C8574';
            const sx = X(e.source.x), sy = Y(e.source.y), tx = X(e.target.x), ty = Y(e.target.y);
            return (
              <G key={i}>
                <Line x1={sx} y1={sy} x2={tx} y2={ty} stroke={stroke} strokeWidth={on ? 1.6 : 0.9} opacity={picked && !on ? 0.35 : 0.9} />
                <Polygon points={arrowHead(sx, sy, tx, ty, r + 1.5, 6)} fill={stroke} opacity={picked && !on ? 0.35 : 1} />
                {weights === 'show' ? (
                  <SvgText x={(sx + tx) / 2} y={(sy + ty) / 2 - 2} fontSize={9} fontFamily="JetBrainsMono_400Regular" fill="#3C4A5A" textAnchor="middle">{+e.weight.toPrecision(3)}</SvgText>
                ) : null}
              </G>
            );
          })}
          {layout.nodes.map((d) => (
            <G key={d.id} onPress={() => setPicked(picked === d.id ? null : d.id)}>
              <Circle cx={X(d.x)} cy={Y(d.y)} r={r} fill={picked === d.id ? '#A84B2A' : '#1D2733'} />
              {labels ? <SvgText x={X(d.x) + r + 2} y={Y(d.y) - r} fontSize={10} fill="#1D2733">{d.id}</SvgText> : null}
            </G>
          ))}
        </Svg>
      </ScrollView>
      <Text className="text-xs text-ink-soft">
        Arrows point from source to target (the target listens). {picked ? `Selected: ${picked} — its edges in rust.` : 'Select a node to trace its edges.'}
      </Text>
    </View>
  );
}
