import { useState } from 'react';
import { View } from 'react-native';
import Svg, { Circle, Line, Path, Polygon, Text as SvgText } from 'react-native-svg';
import { laws } from './tolerance-examples';

const mono = 'JetBrainsMono_400Regular';

/**
 * |Δ| against |ε| on log–log axes for the three laws through the same point
 * at |ε| = 1: the lower the exponent, the larger the change at small |ε|.
 */
export function LawsFigure() {
  const [width, setWidth] = useState(320);
  const H = 200, L = 44, R = 12, T = 10, B = 30;
  const dec = { x: [-6, 0], y: [-6, 0] };
  const X = (e: number) => L + ((e - dec.x[0]) / (dec.x[1] - dec.x[0])) * (width - L - R);
  const Y = (d: number) => T + ((dec.y[1] - d) / (dec.y[1] - dec.y[0])) * (H - T - B);
  const strokes = ['#3C4A5A', '#A84B2A', '#A84B2A'];
  const dashes = [undefined, '6 3', '2 3'];
  return (
    <View onLayout={(e) => setWidth(Math.max(260, Math.min(560, e.nativeEvent.layout.width)))}>
      <Svg width={width} height={H} accessibilityLabel="Log-log sketch: linear, square-root and cube-root responses">
        {[-6, -4, -2, 0].map((k) => (
          <SvgText key={`x${k}`} x={X(k)} y={H - 12} fontSize={10} fontFamily={mono} fill="#6B7785" textAnchor="middle">{`1e${k}`}</SvgText>
        ))}
        {[-6, -4, -2, 0].map((k) => (
          <SvgText key={`y${k}`} x={L - 4} y={Y(k) + 3} fontSize={10} fontFamily={mono} fill="#6B7785" textAnchor="end">{`1e${k}`}</SvgText>
        ))}
        <Line x1={L} y1={H - B} x2={width - R} y2={H - B} stroke="#B9B09C" />
        <Line x1={L} y1={T} x2={L} y2={H - B} stroke="#B9B09C" />
        {laws.map((law, i) => {
          // log|Δ| = p·log|ε| through (0, 0); clipped to the plotted decades.
          const x0 = Math.max(dec.x[0], dec.y[0] / law.p);
          return <Path key={law.key} d={`M ${X(x0)} ${Y(law.p * x0)} L ${X(0)} ${Y(0)}`} stroke={strokes[i]} strokeWidth={1.8} strokeDasharray={dashes[i]} fill="none" />;
        })}
        <SvgText x={X(-5.6)} y={Y(-5.6 * 1) - 6} fontSize={11} fill="#3C4A5A">╱ linear</SvgText>
        <SvgText x={X(-5.6)} y={Y(-5.6 / 2) - 6} fontSize={11} fill="#A84B2A">√ square-root</SvgText>
        <SvgText x={X(-5.6)} y={Y(-5.6 / 3) - 6} fontSize={11} fill="#A84B2A">∛ cube-root</SvgText>
        <SvgText x={width - R} y={H - B - 6} fontSize={10} fill="#6B7785" textAnchor="end">|ε| weight change</SvgText>
        <SvgText x={L + 6} y={T + 10} fontSize={10} fill="#6B7785">|Δ Re λ2|</SvgText>
      </Svg>
    </View>
  );
}

/** Three nodes, two edges, and the Laplacian rows each convention writes. */
export function ConventionFigure() {
  const node = (x: number, y: number, label: string) => (
    <>
      <Circle cx={x} cy={y} r={14} fill="#FBFAF6" stroke="#1D2733" strokeWidth={1.5} />
      <SvgText x={x} y={y + 4} fontSize={12} fill="#1D2733" textAnchor="middle">{label}</SvgText>
    </>
  );
  const arrow = (x1: number, y1: number, x2: number, y2: number, w: string) => {
    const len = Math.hypot(x2 - x1, y2 - y1), ux = (x2 - x1) / len, uy = (y2 - y1) / len;
    const tx = x2 - ux * 16, ty = y2 - uy * 16;
    return (
      <>
        <Line x1={x1 + ux * 16} y1={y1 + uy * 16} x2={tx} y2={ty} stroke="#3C4A5A" strokeWidth={1.4} />
        <Polygon points={`${tx},${ty} ${tx - ux * 8 - uy * 4},${ty - uy * 8 + ux * 4} ${tx - ux * 8 + uy * 4},${ty - uy * 8 - ux * 4}`} fill="#3C4A5A" />
        <SvgText x={(x1 + x2) / 2} y={(y1 + y2) / 2 - 8} fontSize={11} fontFamily={mono} fill="#A84B2A" textAnchor="middle">{w}</SvgText>
      </>
    );
  };
  return (
    <Svg width={260} height={90} accessibilityLabel="Three nodes a, b, c with edges a to b of weight 2 and b to c of weight 3">
      {arrow(30, 50, 130, 50, '2')}
      {arrow(130, 50, 230, 50, '3')}
      {node(30, 50, 'a')}
      {node(130, 50, 'b')}
      {node(230, 50, 'c')}
    </Svg>
  );
}
