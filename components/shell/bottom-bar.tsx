import { View } from 'react-native';
import { useMe } from '@/lib/api/account';
import { navItemsFor } from './nav-items';
import { NavLink } from './nav-link';

/** Phone navigation: thumb-reachable, hidden from 1024 px up where the rail takes over. */
export function BottomBar() {
  const { data: me } = useMe();
  return (
    <View
      role="navigation"
      aria-label="Sections"
      testID="bottom-bar"
      className="flex-row border-t border-rule bg-paper-card lg:hidden"
      style={{ paddingBottom: 4 }}
    >
      {navItemsFor(me?.roles).map((item) => (
        <NavLink key={item.href} item={item} layout="bar" />
      ))}
    </View>
  );
}
