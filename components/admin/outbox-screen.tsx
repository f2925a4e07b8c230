import { Pressable, View } from 'react-native';
import { Notice } from '@/components/account/form-bits';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { useOutbox } from '@/lib/api/admin';
import { firstLink } from '@/lib/schemas/outbox';
import { AdminTabs } from './admin-tabs';

/** What the local mail fake received, newest first, with each message's link to open. */
export function OutboxScreen() {
  const outbox = useOutbox();
  return (
    <Screen kicker="Admin" title="Outbox">
      <AdminTabs />
      <Text className="text-sm leading-5 text-ink-soft">
        Mail from this server goes to a local stand-in, not out to the world. Each message it took is listed here.
      </Text>
      {outbox.error ? <Notice kind="refused">{outbox.error.message}</Notice> : null}
      {outbox.data?.messages.length === 0 ? <Text className="text-ink-soft">No mail has been sent yet.</Text> : null}
      {outbox.data?.messages.map((m) => {
        const link = firstLink(m.text);
        return (
          <Card key={m.id} title={m.subject}>
            <Text className="text-sm text-ink-soft">To {m.to.join(', ')}</Text>
            <Text className="font-mono text-xs text-ink-faint">{m.receivedAt.replace('T', ' ').slice(0, 19)} UTC</Text>
            <Text className="mt-3 text-sm leading-5 text-ink">{m.text}</Text>
            {link ? (
              <View className="mt-3 self-start">
                <Pressable
                  accessibilityRole="link"
                  accessibilityLabel={`Open the link for ${m.to.join(', ')}`}
                  onPress={() => window.location.assign(link)}
                  className="min-h-[44px] justify-center rounded-md border border-rule-strong bg-paper-card px-4"
                >
                  <Text className="font-medium text-rust">Open the link →</Text>
                </Pressable>
              </View>
            ) : null}
          </Card>
        );
      })}
    </Screen>
  );
}
