import { TextInput, View, type TextInputProps } from 'react-native';
import { Text } from './text';

/** A labelled text input with its hint and error line. */
export function Field({
  label,
  hint,
  error,
  mono = false,
  ...input
}: TextInputProps & { label: string; hint?: string; error?: string; mono?: boolean }) {
  return (
    <View className="gap-1">
      <Text className="font-medium text-sm text-ink">{label}</Text>
      <TextInput
        accessibilityLabel={label}
        placeholderTextColor="#6B7785"
        className={`min-h-[44px] rounded-md border bg-paper-card px-3 py-2 text-[15px] text-ink ${
          mono ? 'font-mono' : 'font-sans'
        } ${error ? 'border-rust' : 'border-rule-strong'}`}
        {...input}
      />
      {error ? <Text className="text-sm text-rust">× {error}</Text> : hint ? <Text className="text-xs text-ink-faint">{hint}</Text> : null}
    </View>
  );
}
