import { View } from 'react-native';
import { Card, Paragraph } from '../ui/card';
import { fmt } from '../ui/format';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { ConventionFigure, LawsFigure } from './help-figures';
import { helpExample, laws, toleranceFor } from './tolerance-examples';

const flagWords: [string, string][] = [
  ['crossover', 'the slope drifts along the ladder (near 1 at the smallest changes, toward ½ at larger ones): two eigenvalues are close but not equal, and the root law takes over above the crossover scale shown on the plot.'],
  ['low-signal', 'fewer than three points stand clearly above the solver’s noise floor, so no law could be fitted with confidence.'],
  ['identity-change', 'at some changes another eigenvalue became the slowest mode; those points were left out of the fit.'],
  ['sign-change', 'raising and lowering the weight follow different laws (common at a Jordan block: one side splits into a real pair, the other into a complex pair).'],
  ['truncated', 'the largest decreases were skipped because they would take the weight below half its value.'],
];

/** Plain words for what the audit figures mean, with a worked tolerance example. */
export function HelpScreen() {
  const { reLambda2, tau, c } = helpExample;
  return (
    <Screen kicker="Reference" title="Reading an audit">
      <Card title="Why some edges are fragile">
        <Paragraph>
          Re λ2 sets how fast the network settles. Change one edge weight by a small amount ε and Re λ2 moves. For most edges it
          moves in proportion to ε. But a network tuned for speed often makes several eigenvalues meet at λ2 and lock together (a
          Jordan block); then a change of ε moves λ2 by about ε to the power 1/k, where k is the size of the block, which is far more
          than ε when ε is small.
        </Paragraph>
        <View className="mt-3">
          <LawsFigure />
        </View>
      </Card>
      <Card title="What that means for a weight tolerance">
        <Paragraph>
          Suppose Re λ2 = {reLambda2} and you accept a {tau * 100} % loss, so |Δ| may reach {fmt(tau * reLambda2, 2)}. With a prefactor of {c}, each law allows:
        </Paragraph>
        <View className="mt-3 gap-1.5">
          {laws.map((law) => (
            <View key={law.key} className="flex-row flex-wrap items-baseline gap-x-3 border-t border-rule pt-1.5">
              <Text className="w-32 text-sm text-ink">{law.glyph} {law.name}</Text>
              <Text className="w-44 font-mono text-sm text-ink">|ε| ≤ {fmt(toleranceFor(law.p, c, tau, reLambda2), 2)}</Text>
              <Text className="flex-1 text-sm text-ink-soft">{law.words}</Text>
            </View>
          ))}
        </View>
        <Paragraph>
          {'\n'}A cube-root edge therefore needs its weight held about {Math.round(toleranceFor(1, c, tau, reLambda2) / toleranceFor(1 / 3, c, tau, reLambda2))} times
          more tightly than a linear one to keep the same speed. Hairline measures the actual law and prefactor of every edge, on both signs, and confirms each tolerance with a direct
          recomputation.
        </Paragraph>
      </Card>
      <Card title="The other classes and the flags">
        <Paragraph>
          Quadratic: λ2 does not move at first order (often a symmetric pair of links). Flat: no change above the solver’s noise floor,
          so the edge does not touch the slowest mode. Other: no clean power law (read the plot).
        </Paragraph>
        <View className="mt-2 gap-1">
          {flagWords.map(([flag, words]) => (
            <Text key={flag} className="text-sm leading-5 text-ink-soft">
              <Text className="font-mono text-sm text-ink">{flag}</Text> — {words}
            </Text>
          ))}
        </View>
      </Card>
      <Card title="The Laplacian convention">
        <ConventionFigure />
        <Paragraph>
          An arrow a → b means b listens to a. In the in-degree convention (the default) a node’s row holds what it receives:
          row b is [−2, 2, 0] and row c is [0, −3, 3]. In the out-degree convention a node’s row holds what it sends: row a is
          [2, −2, 0] and row b is [0, 3, −3]. Each network keeps one convention, shown beside its results.
        </Paragraph>
      </Card>
      <Text className="text-sm leading-5 text-rust">
        These figures support, and do not replace, review by a licensed engineer and the codes and standards that apply where the
        system is built and run.
      </Text>
    </Screen>
  );
}
