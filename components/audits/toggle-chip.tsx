import { Pressable, View } from 'react-native';
import { spaceActivates } from '../ui/keys';
import { Text } from '../ui/text';

/** One of several options that can be on together, announced as a checkbox. */
export function ToggleChip({ label, glyph, on, onPress, count }: { label: string; glyph?: string; on: boolean; onPress: () => void; count?: number }) {
  return (
    <Pressable
      accessibilityRole="checkbox"
      accessibilityLabel={label}
      aria-checked={on}
      onPress={onPress}
      {...spaceActivates(onPress)}
      className={`min-h-[36px] max-w-full flex-row items-center rounded-2xl border px-3 py-1.5 ${on ? 'border-ink bg-ink' : 'border-rule-strong bg-paper-card'}`}
    >
      <Text className={`shrink text-sm ${on ? 'text-paper-card' : 'text-ink-soft'}`}>
        {on ? '☑ ' : '☐ '}
        {glyph ? <Text className={`font-mono text-sm ${on ? 'text-paper-card' : 'text-ink'}`}>{glyph} </Text> : null}
        {label}
        {count !== undefined ? <Text className={`font-mono text-xs ${on ? 'text-paper-card' : 'text-ink-faint'}`}> {count}</Text> : null}
      </Text>
    </Pressable>
  );
}

export function ChipRow({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <View className="gap-1">
      <Text className="font-medium text-sm text-ink">{label}</Text>
      <View role="group" aria-label={label} className="flex-row flex-wrap gap-2">
        {children}
      </View>
    </View>
  );
}
