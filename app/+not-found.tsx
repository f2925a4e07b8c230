import { Link } from 'expo-router';
import { View } from 'react-native';
import { Text } from '@/components/ui/text';
import { BrandMark } from '@/components/shell/brand-mark';

export default function NotFoundRoute() {
  return (
    <View className="flex-1 items-center justify-center bg-paper p-6">
      <BrandMark />
      <Text accessibilityRole="header" className="mt-6 font-bold text-2xl text-ink">
        No such page
      </Text>
      <Text className="mt-2 text-center text-ink-soft">The address may be mistyped, or the page has moved.</Text>
      <Link href="/" className="mt-4 font-medium text-rust underline">
        Back to the overview
      </Link>
    </View>
  );
}
