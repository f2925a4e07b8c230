import { Slot } from 'expo-router';
import { AppShell } from '@/components/shell/app-shell';

export default function AppLayout() {
  return (
    <AppShell>
      <Slot />
    </AppShell>
  );
}
