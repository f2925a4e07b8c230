import { Link } from 'expo-router';
import type { ReactNode } from 'react';
import { ScrollView, View } from 'react-native';
import { Notice } from '@/components/account/form-bits';
import { BrandMark } from '@/components/shell/brand-mark';
import { Text } from '@/components/ui/text';

/** The frame of the signed-out pages: the mark, a title, one narrow column. */
export function AuthFrame({ title, lead, children }: { title: string; lead?: string; children: ReactNode }) {
  return (
    <ScrollView className="flex-1 bg-paper" contentContainerClassName="flex-grow items-center justify-center px-5 py-10">
      <View className="w-full max-w-sm">
        <BrandMark />
        <Text accessibilityRole="header" className="mt-8 font-bold text-2xl tracking-tight text-ink">
          {title}
        </Text>
        {lead ? <Text className="mt-1 text-[15px] leading-6 text-ink-soft">{lead}</Text> : null}
        <View className="mt-2 h-px w-full bg-rule" />
        <View className="mt-6 gap-4">{children}</View>
      </View>
    </ScrollView>
  );
}

/** The end of a signed-out task (a password set or changed): what happened, and the way to sign in. */
export function DoneThenSignIn({ title, children }: { title: string; children: ReactNode }) {
  return (
    <AuthFrame title={title}>
      <Notice kind="done">{children}</Notice>
      <Link href="/sign-in" className="font-medium text-rust underline">
        Go to sign-in
      </Link>
    </AuthFrame>
  );
}

/** The token after `#token=` in the address: kept out of server logs and Referer headers. */
export function tokenFromHash(): string {
  if (typeof window === 'undefined') return '';
  return new URLSearchParams(window.location.hash.replace(/^#/, '')).get('token') ?? '';
}
