import { ActivityIndicator, Pressable, View } from 'react-native';
import { Text } from './text';

type Tone = 'primary' | 'secondary' | 'quiet' | 'danger';

const tones: Record<Tone, { box: string; text: string }> = {
  primary: { box: 'bg-ink border-ink', text: 'text-paper-card' },
  secondary: { box: 'bg-paper-card border-rule-strong', text: 'text-ink' },
  quiet: { box: 'bg-transparent border-transparent', text: 'text-rust underline' },
  danger: { box: 'bg-rust border-rust', text: 'text-paper-card' },
};

export function Button({
  label,
  onPress,
  tone = 'primary',
  busy = false,
  disabled = false,
  accessibilityHint,
}: {
  label: string;
  onPress: () => void;
  tone?: Tone;
  busy?: boolean;
  disabled?: boolean;
  accessibilityHint?: string;
}) {
  const t = tones[tone];
  const off = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityHint={accessibilityHint}
      accessibilityState={{ disabled: off, busy }}
      aria-disabled={off}
      aria-busy={busy}
      disabled={off}
      onPress={onPress}
      className={`min-h-[44px] flex-row items-center justify-center rounded-md border px-4 py-2 ${t.box} ${off ? 'opacity-50' : ''}`}
    >
      {busy ? (
        <View className="mr-2">
          <ActivityIndicator size="small" color={tone === 'primary' || tone === 'danger' ? '#FBFAF6' : '#1D2733'} />
        </View>
      ) : null}
      <Text className={`font-medium text-[15px] ${t.text}`}>{label}</Text>
    </Pressable>
  );
}
