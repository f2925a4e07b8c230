import { Pressable, View, type TextInputProps } from 'react-native';
import { Field } from '@/components/ui/field';
import { Text } from '@/components/ui/text';

/** A labelled input with the server's per-field message under it; e-mail addresses and passwords are never capitalised. */
export function LabeledInput(props: TextInputProps & { label: string; error?: string }) {
  return <Field autoCapitalize="none" {...props} />;
}

/** A button; `tone` picks ink (main action), outline, or rust (a step that ends something). */
export function ActionButton({
  label,
  onPress,
  busy = false,
  tone = 'ink',
}: {
  label: string;
  onPress: () => void;
  busy?: boolean;
  tone?: 'ink' | 'outline' | 'rust';
}) {
  const box = tone === 'ink' ? 'bg-ink border-ink' : tone === 'rust' ? 'bg-rust border-rust' : 'bg-paper-card border-rule-strong';
  const text = tone === 'outline' ? 'text-ink' : 'text-paper-card';
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ disabled: busy, busy }}
      disabled={busy}
      onPress={onPress}
      className={`min-h-[44px] items-center justify-center rounded-md border px-4 py-2 ${box} ${busy ? 'opacity-60' : ''}`}
    >
      <Text className={`font-medium text-[15px] ${text}`}>{busy ? `${label}…` : label}</Text>
    </Pressable>
  );
}

/** A one-line outcome: ● done (verdigris) or × refused (rust); never colour alone. */
export function Notice({ kind, children }: { kind: 'done' | 'refused'; children: React.ReactNode }) {
  return (
    <View
      role={kind === 'refused' ? 'alert' : 'status'}
      className={`flex-row gap-2 rounded-md border p-3 ${kind === 'done' ? 'border-verdigris bg-verdigris-soft' : 'border-rust bg-rust-soft'}`}
    >
      <Text className="font-mono text-ink">{kind === 'done' ? '●' : '×'}</Text>
      <Text className="flex-1 text-sm leading-5 text-ink">{children}</Text>
    </View>
  );
}
