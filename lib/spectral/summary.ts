/**
 * The import-time summary: what a network looks like before any sweep, for one eigen-solve.
 *
 * Without the transposed solve the cluster cannot be tested for reproducibility, so a cluster of
 * more than one eigenvalue is taken to be rounding-split and λ2 is reported as its centre; the full
 * baseline (two solves) may, in rare near-degenerate cases, report the computed λ2 instead.
 */
import type { NetworkSummary, SpectralNetwork, SpectralOptions } from './types';
import { maxDiagonal } from './laplacian';
import { prepareNetwork } from './prepare';
import { leastRealIndex, solveEigenvalues, toMatrix, zeroIndexOf } from './spectrum';
import { findCluster } from './cluster';
import { matrixScale, sortedValues } from './baseline';

export function summariseNetwork(network: SpectralNetwork, options: SpectralOptions = {}): NetworkSummary {
  const { opts, n, weights, laplacian, meanWeight, reach } = prepareNetwork(network, options);
  const values = sortedValues(solveEigenvalues(toMatrix(laplacian, n)));
  const zeroIndex = zeroIndexOf(values);
  const lambda2Index = leastRealIndex(values, zeroIndex);
  const cluster = findCluster({
    values,
    zeroIndex,
    lambda2Index,
    plainRadius: opts.clusterTolerance * (meanWeight > 0 ? meanWeight : 1),
    scale: matrixScale(maxDiagonal(laplacian, n)),
  });
  const lambda2 = reach.rooted ? cluster.mean : { re: 0, im: 0 };
  return {
    nodeCount: n,
    edgeCount: network.edges.length,
    weightRange: weights.length ? { min: Math.min(...weights), max: Math.max(...weights) } : null,
    meanWeight,
    rooted: reach.rooted,
    roots: reach.roots,
    cutOff: reach.cutOff,
    leaderGroups: reach.leaderGroups,
    lambda2,
    cluster: { size: cluster.size, spread: cluster.spread },
    spectrum: values.re.map((re, i) => ({ re: re + 0, im: values.im[i] + 0 })),
  };
}
