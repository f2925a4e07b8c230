import type { ReactNode } from 'react';
import { View } from 'react-native';
import { BottomBar } from './bottom-bar';
import { DetailPane } from './detail-pane';
import { SideRail } from './side-rail';

/**
 * Phone first: content above a bottom bar. From 1024 px the same tree shows a
 * side rail, the content and a detail pane. Breakpoints are CSS media queries
 * (NativeWind's `lg:`), so the static export and the first client render agree.
 */
export function AppShell({ children }: { children: ReactNode }) {
  return (
    <View className="flex-1 flex-col bg-paper lg:flex-row">
      <SideRail />
      <View role="main" className="flex-1">
        {children}
      </View>
      <DetailPane />
      <BottomBar />
    </View>
  );
}
