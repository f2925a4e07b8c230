import { View } from 'react-native';
import { Text } from '../ui/text';

export const cautionText =
  'These figures support a licensed engineer’s review; they do not replace it, nor the codes and standards that apply where the system is built and operated.';

export function Caution() {
  return (
    <View role="note" aria-label="Caution" className="flex-row gap-2 rounded-md border border-ochre bg-ochre-soft px-3 py-2">
      <Text className="font-mono text-sm text-ink">!</Text>
      <Text className="flex-1 text-sm leading-5 text-ink">{cautionText}</Text>
    </View>
  );
}
