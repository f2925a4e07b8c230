import type { ReactNode } from 'react';
import { View } from 'react-native';
import { Text } from '@/components/ui/text';

export function Card({ title, children }: { title?: string; children?: ReactNode }) {
  return (
    <View className="rounded-lg border border-rule bg-paper-card p-4">
      {title ? <Text className="mb-2 font-bold text-base text-ink">{title}</Text> : null}
      {children}
    </View>
  );
}

/** A labelled figure in the monospaced face, so digits line up across cards. */
export function Figure({ label, value, unit }: { label: string; value: string; unit?: string }) {
  return (
    <View className="min-w-[120px] flex-1">
      <Text className="text-xs tracking-wide text-ink-faint">{label}</Text>
      <Text className="mt-1 font-mono text-2xl text-ink">
        {value}
        {unit ? <Text className="font-mono text-sm text-ink-faint"> {unit}</Text> : null}
      </Text>
    </View>
  );
}

export function Paragraph({ children }: { children: ReactNode }) {
  return <Text className="text-[15px] leading-6 text-ink-soft">{children}</Text>;
}
