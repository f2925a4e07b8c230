import { ActivityIndicator, View } from 'react-native';
import { Button } from './button';
import { Text } from './text';

export function Loading({ what, verb = 'Loading' }: { what: string; verb?: string }) {
  return (
    <View accessibilityRole="progressbar" accessibilityLabel={`${verb} ${what}`} className="flex-row items-center gap-3 py-6">
      <ActivityIndicator color="#3C4A5A" />
      <Text className="shrink text-ink-soft">{verb} {what}…</Text>
    </View>
  );
}

export function ErrorState({ message, onRetry }: { message: string; onRetry?: () => void }) {
  return (
    <View role="alert" className="gap-3 rounded-lg border border-rust bg-rust-soft p-4">
      <Text className="font-medium text-ink">× {message}</Text>
      {onRetry ? (
        <View className="self-start">
          <Button label="Try again" tone="secondary" onPress={onRetry} />
        </View>
      ) : null}
    </View>
  );
}

export function EmptyState({ title, body, action }: { title: string; body: string; action?: React.ReactNode }) {
  return (
    <View className="items-start gap-2 rounded-lg border border-dashed border-rule-strong p-5">
      <Text className="font-bold text-ink">{title}</Text>
      <Text className="text-sm leading-5 text-ink-soft">{body}</Text>
      {action}
    </View>
  );
}
