import { View } from 'react-native';
import { Text } from '@/components/ui/text';
import { useHealth } from '@/lib/api/health';

/** One line saying whether the server and its database answer. */
export function ServerStatus() {
  const health = useHealth();
  let glyph = '○';
  let text = 'Checking the server…';
  if (health.isError) {
    glyph = '×';
    text = `Server unreachable: ${health.error.message}`;
  } else if (health.data) {
    glyph = health.data.database.ok ? '●' : '◐';
    text = health.data.database.ok
      ? `Server and database answer · version ${health.data.version}`
      : `Database not answering: ${health.data.database.message ?? 'unknown reason'}`;
  }
  return (
    <View accessibilityRole="summary" className="flex-row items-center gap-2">
      <Text className="font-mono text-sm text-ink-soft">{glyph}</Text>
      <Text className="text-sm text-ink-soft">{text}</Text>
    </View>
  );
}
