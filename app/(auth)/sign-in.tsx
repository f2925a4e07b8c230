import { View } from 'react-native';
import { BrandMark } from '@/components/shell/brand-mark';
import { ComingSoon } from '@/components/ui/coming-soon';

export default function SignInRoute() {
  return (
    <View className="flex-1 items-center justify-center bg-paper p-6">
      <BrandMark />
      <View className="mt-6 w-full max-w-sm">
        <ComingSoon what="Sign in with your e-mail and password." />
      </View>
    </View>
  );
}
