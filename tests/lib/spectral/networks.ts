/**
 * The small defective networks whose λ2 response is known in closed form (derived in
 * closed-forms.test.ts). Other tests lean on those derivations; building the networks in one place
 * keeps them auditing exactly the networks the derivations are about.
 */
import type { SpectralNetwork } from '@/lib/spectral';
import { net, type EdgeRow } from './helpers';

/**
 * a → b → c with the absent back edge c → b (weight 0) as a probe: λ2 = 1 is a defective double
 * eigenvalue when a → b has weight 1; weight 1 + δ splits it into 1 and 1 + δ (near-degenerate).
 */
export function chainWithProbe(leadWeight = 1): SpectralNetwork {
  return net([
    ['a', 'b', leadWeight],
    ['b', 'c', 1],
    ['c', 'b', 0],
  ]);
}

const TRIANGLE_WITH_CHORD: EdgeRow[] = [
  ['1', '2', 1],
  ['2', '3', 1],
  ['3', '1', 1],
  ['2', '1', 1],
];

/** Triangle 1→2→3→1 plus the chord 2→1: eigenvalues 0, 2, 2 with one Jordan block of size 2. */
export const triangleWithChord: SpectralNetwork = net(TRIANGLE_WITH_CHORD);

/** 4-cycle 1→2→3→4→1 with chords 1→3 and 1→4: eigenvalues 0, 2, 2, 2 in one Jordan block of size 3. */
export const fourCycleWithChords: SpectralNetwork = net([
  ['1', '2', 1],
  ['2', '3', 1],
  ['3', '4', 1],
  ['4', '1', 1],
  ['1', '3', 1],
  ['1', '4', 1],
]);

/**
 * The triangle with a chord plus two listeners (4, 5) with larger in-degrees: λ2 = 2 stays the
 * triangle's defective eigenvalue, which a plain eigen-solve of this matrix splits by rounding.
 */
export const triangleWithListeners: SpectralNetwork = net([
  ...TRIANGLE_WITH_CHORD,
  ['1', '4', 1.5],
  ['3', '4', 1.7],
  ['4', '5', 2.6],
  ['2', '5', 0.9],
]);
