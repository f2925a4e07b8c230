import { View } from 'react-native';
import { Text } from '@/components/ui/text';
import { BrandMark } from './brand-mark';
import { navItems } from './nav-items';
import { NavLink } from './nav-link';

/** Wide-screen navigation: a quiet rail on the left, shown from 1024 px up. */
export function SideRail() {
  return (
    <View role="navigation" aria-label="Sections" testID="side-rail" className="hidden w-60 border-r border-rule bg-paper-card px-4 py-6 lg:flex">
      <BrandMark />
      <Text className="mb-6 mt-1 text-xs text-ink-faint">weight tolerances for tuned networks</Text>
      <View className="gap-1">
        {navItems.map((item) => (
          <NavLink key={item.href} item={item} layout="rail" />
        ))}
      </View>
    </View>
  );
}
