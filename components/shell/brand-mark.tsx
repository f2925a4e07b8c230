import { View } from 'react-native';
import { Text } from '@/components/ui/text';
import Svg, { Line, Path } from 'react-native-svg';

/** The wordmark: a straight rule with a fine crack running off it. */
export function BrandMark({ compact = false }: { compact?: boolean }) {
  return (
    <View className="flex-row items-center gap-2" accessibilityRole="header" accessibilityLabel="Hairline">
      {/* Decorative: the header already carries the name. */}
      <Svg width={26} height={26} viewBox="0 0 26 26" aria-hidden>
        <Line x1={2} y1={18} x2={24} y2={18} stroke="#1D2733" strokeWidth={2} />
        <Path d="M9 18 L11.5 13.5 L10.2 11 L13.6 6.5 L13 3.5" stroke="#A84B2A" strokeWidth={1} fill="none" />
      </Svg>
      {!compact && <Text className="font-bold text-xl tracking-tight text-ink">hairline</Text>}
    </View>
  );
}
