import { Link, usePathname } from 'expo-router';
import { Pressable, View } from 'react-native';
import { Text } from '@/components/ui/text';
import { NavIcon } from '../icons/nav-icons';
import { isCurrent, type NavItem } from './nav-items';

/** One destination; `layout` decides between the stacked (bar) and inline (rail) form. */
export function NavLink({ item, layout }: { item: NavItem; layout: 'bar' | 'rail' }) {
  const pathname = usePathname();
  const current = isCurrent(item.href, pathname);
  const color = current ? '#A84B2A' : '#3C4A5A';
  return (
    <Link href={item.href} asChild>
      <Pressable
        accessibilityRole="link"
        accessibilityLabel={item.label}
        accessibilityState={{ selected: current }}
        className={
          layout === 'bar'
            ? 'flex-1 items-center justify-center py-2'
            : `flex-row items-center gap-3 rounded-md px-3 py-2.5 ${current ? 'bg-paper-deep' : ''}`
        }
      >
        <NavIcon name={item.icon} color={color} />
        <Text
          className={`${layout === 'bar' ? 'mt-0.5 text-[11px]' : 'text-[15px]'} ${
            current ? 'font-bold text-rust' : 'font-medium text-ink-soft'
          }`}
        >
          {item.label}
        </Text>
        {layout === 'bar' && <View className={`mt-1 h-[2px] w-5 ${current ? 'bg-rust' : 'bg-transparent'}`} />}
      </Pressable>
    </Link>
  );
}
