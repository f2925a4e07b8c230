import Svg, { Circle, Line, Path, Rect } from 'react-native-svg';

/** Hand-drawn line icons on a 24-unit grid, one stroke weight throughout. */
export type IconName = 'overview' | 'networks' | 'audits' | 'admin' | 'account' | 'help';

interface IconProps {
  name: IconName;
  size?: number;
  color: string;
}

export function NavIcon({ name, size = 22, color }: IconProps) {
  const stroke = { stroke: color, strokeWidth: 1.6, fill: 'none', strokeLinecap: 'round' as const };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" aria-hidden>
      {name === 'overview' && (
        <>
          <Rect x={3.5} y={3.5} width={17} height={17} rx={2} {...stroke} />
          <Path d="M3.5 14 L9 11 L13 15.5 L20.5 7" {...stroke} />
        </>
      )}
      {name === 'networks' && (
        <>
          <Circle cx={5.5} cy={6} r={2.2} {...stroke} />
          <Circle cx={18.5} cy={8} r={2.2} {...stroke} />
          <Circle cx={11} cy={18.5} r={2.2} {...stroke} />
          <Line x1={7.6} y1={6.4} x2={16.3} y2={7.7} {...stroke} />
          <Line x1={17.3} y1={10} x2={12.3} y2={16.6} {...stroke} />
          <Line x1={6.5} y1={8} x2={10} y2={16.5} {...stroke} />
        </>
      )}
      {name === 'audits' && (
        <>
          <Circle cx={10.5} cy={10.5} r={6.5} {...stroke} />
          <Line x1={15.3} y1={15.3} x2={20.5} y2={20.5} {...stroke} />
          <Path d="M8 7.5 L10.5 10 L9.2 11.4 L12.5 14" {...stroke} />
        </>
      )}
      {name === 'admin' && (
        <>
          <Circle cx={8} cy={12} r={4} {...stroke} />
          <Path d="M12 12 H20.5 M17.5 12 V15 M20.5 12 V14.5" {...stroke} />
        </>
      )}
      {name === 'account' && (
        <>
          <Circle cx={12} cy={8.5} r={3.8} {...stroke} />
          <Path d="M4.5 20 C5.5 15.8 8.4 14 12 14 C15.6 14 18.5 15.8 19.5 20" {...stroke} />
        </>
      )}
      {name === 'help' && (
        <>
          <Circle cx={12} cy={12} r={8.5} {...stroke} />
          <Path d="M9.5 9.6 C9.6 7.9 10.8 7 12.2 7 C13.8 7 14.8 8.1 14.8 9.4 C14.8 11.4 12.2 11.6 12.2 13.6" {...stroke} />
          <Circle cx={12.2} cy={16.6} r={0.6} fill={color} stroke={color} />
        </>
      )}
    </Svg>
  );
}
