import { View } from 'react-native';
import { Text } from '@/components/ui/text';

/**
 * The right-hand pane on wide screens. Screens that have a selection (an edge,
 * a version) will fill it; until then it says what will appear here.
 */
export function DetailPane() {
  return (
    <View
      role="complementary"
      accessibilityLabel="Details"
      className="hidden w-80 border-l border-rule bg-paper-card p-6 xl:w-96 lg:flex"
    >
      <Text className="font-medium text-xs uppercase tracking-widest text-ink-faint">Details</Text>
      <View className="mt-4 rounded-md border border-dashed border-rule-strong p-4">
        <Text className="text-sm leading-5 text-ink-soft">
          Select an edge or a network version to see its response, tolerance and history here.
        </Text>
      </View>
    </View>
  );
}
