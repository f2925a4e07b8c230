import type { ReactNode } from 'react';
import { ScrollView, View } from 'react-native';
import { Text } from '@/components/ui/text';
import { BrandMark } from '../shell/brand-mark';

/** A page: a title block with an optional kicker line, then scrolling content. */
export function Screen({ title, kicker, children }: { title: string; kicker?: string; children?: ReactNode }) {
  return (
    <ScrollView className="flex-1" contentContainerClassName="px-5 pb-10 pt-6 lg:px-10 lg:pt-10">
      <View className="mb-5 lg:hidden">
        <BrandMark />
      </View>
      {kicker ? <Text className="font-medium text-xs uppercase tracking-widest text-ink-faint">{kicker}</Text> : null}
      <Text accessibilityRole="header" className="mt-1 font-bold text-3xl tracking-tight text-ink">
        {title}
      </Text>
      <View className="mt-2 h-px w-full bg-rule" />
      <View className="mt-6 gap-4">{children}</View>
    </ScrollView>
  );
}
