import { View } from 'react-native';
import type { Convention } from '@/lib/schemas/network';
import { Text } from '../ui/text';

export const conventionText: Record<Convention, { short: string; long: string }> = {
  in: { short: 'in-degree', long: 'in-degree: a node’s row holds the edges it receives' },
  out: { short: 'out-degree', long: 'out-degree: a node’s row holds the edges it sends' },
};

/** The Laplacian convention, shown wherever results are. */
export function ConventionBadge({ convention, long = false }: { convention: Convention; long?: boolean }) {
  return (
    <View accessibilityLabel={`Laplacian convention ${conventionText[convention].long}`} className="max-w-full flex-row items-center rounded border border-rule-strong px-2 py-0.5">
      <Text className="shrink font-mono text-xs text-ink-soft">L·{convention === 'in' ? '←' : '→'} {long ? conventionText[convention].long : conventionText[convention].short}</Text>
    </View>
  );
}
