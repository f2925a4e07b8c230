import { Link, usePathname } from 'expo-router';
import { Pressable, View } from 'react-native';
import { useAudits } from '@/lib/api/audits';
import { stateLook } from '../audits/looks';
import { NextSteps } from '../overview/next-steps';
import { Text } from '../ui/text';

/**
 * The right-hand pane on wide screens: what is waiting for you, wherever you
 * are. On the overview, whose page already lists the next steps, it shows
 * the latest audits instead; an audit's own pages use the width themselves.
 */
export function DetailPane() {
  const pathname = usePathname();
  const onOverview = pathname === '/';
  // An audit page lays out its own table and edge detail side by side: give it the width.
  // The static export renders this route as /audits/[auditId]: match it too, or hydration disagrees.
  if (/^\/audits\/(\d+|\[auditId\])/.test(pathname)) return null;
  return (
    <View role="complementary" aria-label={onOverview ? 'Latest audits' : 'Next steps'} className="hidden w-80 border-l border-rule bg-paper-card p-6 xl:w-96 lg:flex">
      <Text className="mb-3 font-medium text-xs uppercase tracking-widest text-ink-faint">{onOverview ? 'Latest audits' : 'Next steps'}</Text>
      {onOverview ? <LatestAudits /> : <NextSteps compact />}
    </View>
  );
}

function LatestAudits() {
  const audits = useAudits([]);
  const list = audits.data?.audits.slice(0, 8) ?? [];
  if (audits.data && list.length === 0) return <Text className="text-sm text-ink-soft">No audit has been run yet.</Text>;
  return (
    <View className="gap-1.5">
      {list.map((a) => {
        const look = stateLook[a.state];
        return (
          <Link key={a.id} href={`/audits/${a.id}`} asChild>
            <Pressable accessibilityRole="link" accessibilityLabel={`Audit ${a.id}, ${a.networkName}, ${look.label}`} className="rounded-md border border-rule px-3 py-2 hover:border-ink-faint">
              <Text className="text-sm text-ink">
                <Text className="font-mono text-xs text-ink-faint">#{a.id} </Text>
                {a.networkName} <Text className="font-mono text-xs text-ink-faint">v{a.version}</Text>
              </Text>
              <Text className={`mt-0.5 text-xs ${look.tone}`}>
                {look.glyph} {look.label}
                {a.undisposedCount ? ` · ${a.undisposedCount} without disposition` : ''}
              </Text>
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}
