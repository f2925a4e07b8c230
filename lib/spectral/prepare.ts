import { SpectralInputError } from './errors';
import { buildLaplacian, edgeSlots, meanPositiveWeight } from './laplacian';
import { resolveOptions } from './options';
import { analyseReachability } from './reachability';
import type { SpectralNetwork, SpectralOptions } from './types';

/**
 * What every analysis starts from: resolved options, the edges' matrix slots
 * in the chosen convention, the dense Laplacian, the mean weight and the
 * graph search for a common root. Shared by the import summary and the
 * sweep's baseline so both read a network the same way.
 */
export function prepareNetwork(network: SpectralNetwork, options: SpectralOptions) {
  const opts = resolveOptions(options);
  const slots = edgeSlots(network, opts.convention);
  const n = network.nodes.length;
  if (n < 2) throw new SpectralInputError('a network needs at least two nodes to have a λ2');
  const weights = network.edges.map((e) => e.weight);
  const laplacian = buildLaplacian(n, slots, weights);
  const meanWeight = meanPositiveWeight(weights);
  const reach = analyseReachability(network.nodes, slots, weights);
  return { opts, slots, n, weights, laplacian, meanWeight, reach };
}
