import { Card, Figure, Paragraph } from '../ui/card';
import { Screen } from '../ui/screen';
import { View } from 'react-native';
import { ServerStatus } from './server-status';

/** The landing screen. Per-role guidance arrives with accounts. */
export function OverviewScreen() {
  return (
    <Screen kicker="Gannet Sound district" title="Overview">
      <Paragraph>
        Hairline perturbs every edge weight of a tuned network, measures how the slowest convergence mode
        answers, and tells you which links need tight calibration before a configuration goes live.
      </Paragraph>
      <Card title="The job, in order">
        <View className="flex-row flex-wrap gap-4">
          <Figure label="1 · analyst" value="import" />
          <Figure label="2 · analyst" value="run" />
          <Figure label="3 · auditor" value="review" />
          <Figure label="4 · approver" value="lock" />
        </View>
      </Card>
      <ServerStatus />
    </Screen>
  );
}
