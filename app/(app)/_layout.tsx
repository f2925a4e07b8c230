import { Slot } from 'expo-router';
import { AppShell } from '@/components/shell/app-shell';
import { SessionGate } from '@/components/shell/session-gate';

export default function AppLayout() {
  return (
    <AppShell>
      <SessionGate>
        <Slot />
      </SessionGate>
    </AppShell>
  );
}
