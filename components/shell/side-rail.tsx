import { View } from 'react-native';
import { Text } from '@/components/ui/text';
import { BrandMark } from './brand-mark';
import { useMe } from '@/lib/api/account';
import { navItemsFor } from './nav-items';
import { NavLink } from './nav-link';

/** Wide-screen navigation: a quiet rail on the left, shown from 1024 px up. */
export function SideRail() {
  const { data: me } = useMe();
  return (
    <View role="navigation" aria-label="Sections" testID="side-rail" className="hidden w-60 border-r border-rule bg-paper-card px-4 py-6 lg:flex">
      <BrandMark />
      <Text className="mb-6 mt-1 text-xs text-ink-faint">weight tolerances for tuned networks</Text>
      <View className="gap-1">
        {navItemsFor(me?.roles).map((item) => (
          <NavLink key={item.href} item={item} layout="rail" />
        ))}
      </View>
    </View>
  );
}
