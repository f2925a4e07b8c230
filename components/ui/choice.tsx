import { Pressable, View } from 'react-native';
import { spaceActivates } from './keys';
import { Text } from './text';

/** A row of mutually exclusive options, announced as a radio group. */
export function Choice<T extends string>({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: T;
  options: { value: T; label: string }[];
  onChange: (v: T) => void;
}) {
  return (
    <View className="gap-1">
      <Text className="font-medium text-sm text-ink">{label}</Text>
      <View role="radiogroup" aria-label={label} className="flex-row flex-wrap gap-2">
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              accessibilityLabel={o.label}
              accessibilityState={{ checked: on }}
              aria-checked={on}
              onPress={() => onChange(o.value)}
              {...spaceActivates(() => onChange(o.value))}
              className={`min-h-[36px] max-w-full flex-row items-center rounded-2xl border px-3 py-1.5 ${on ? 'border-ink bg-ink' : 'border-rule-strong bg-paper-card'}`}
            >
              <Text className={`shrink text-sm ${on ? 'text-paper-card' : 'text-ink-soft'}`}>
                {on ? '◆ ' : '◇ '}
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}
