import { Link, usePathname } from 'expo-router';
import { View } from 'react-native';
import { Text } from '@/components/ui/text';

const tabs = [
  { href: '/admin', label: 'People' },
  { href: '/admin/outbox', label: 'Outbox' },
] as const;

export function AdminTabs() {
  const pathname = usePathname();
  return (
    <View className="flex-row gap-5 border-b border-rule">
      {tabs.map((t) => {
        const on = pathname === t.href;
        return (
          <Link key={t.href} href={t.href} accessibilityRole="link" accessibilityState={{ selected: on }}>
            <View className={`pb-2 ${on ? 'border-b-2 border-rust' : ''}`}>
              <Text className={on ? 'font-bold text-rust' : 'font-medium text-ink-soft'}>{t.label}</Text>
            </View>
          </Link>
        );
      })}
    </View>
  );
}
