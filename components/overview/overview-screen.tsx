import { Card, Paragraph } from '../ui/card';
import { Screen } from '../ui/screen';
import { NextSteps } from './next-steps';
import { ServerStatus } from './server-status';

/** The landing screen: what Hairline does, and what is next for you. */
export function OverviewScreen() {
  return (
    <Screen kicker="Gannet Sound district" title="Overview">
      <Paragraph>
        Hairline perturbs every edge weight of a tuned network, measures how the slowest convergence mode
        answers, and tells you which links need tight calibration before a configuration goes live.
      </Paragraph>
      <Card title="Next steps">
        <NextSteps />
      </Card>
      <ServerStatus />
    </Screen>
  );
}
