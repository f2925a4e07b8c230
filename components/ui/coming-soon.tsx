import { View } from 'react-native';
import { Text } from '@/components/ui/text';

/** States plainly that a screen's feature is not built yet, instead of a blank page. */
export function ComingSoon({ what }: { what: string }) {
  return (
    <View className="rounded-lg border border-dashed border-rule-strong p-5">
      <Text className="font-medium text-ink">Not built yet</Text>
      <Text className="mt-1 text-sm leading-5 text-ink-soft">{what}</Text>
    </View>
  );
}
