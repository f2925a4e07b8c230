/**
 * The unperturbed network: Laplacian, spectrum, λ2 and its cluster, reachability, first-order data.
 *
 * Computed once per audit and shipped (as plain data) to whatever runs the edge sweeps. Two full
 * eigen-decompositions are spent here, of L and of Lᵀ: the second gives the left eigenvectors for
 * first-order sensitivities and, by rounding differently, tells a rounding-split cluster from a
 * genuinely resolved one and estimates the error of the baseline value itself.
 */
import type { EigenvalueDecomposition } from 'ml-matrix';
import type { Complex, SpectralBaseline, SpectralNetwork, SpectralOptions } from './types';
import { frobeniusNorm, maxDiagonal } from './laplacian';
import { prepareNetwork } from './prepare';
import { decompose, foldedDistance, lambda2Of, leastRealIndex, toMatrix, zeroIndexOf, type EigenvalueList } from './spectrum';
import { branchIndices, findCluster, UNIT_ROUNDOFF, type ClusterFinding } from './cluster';
import { firstOrderData } from './sensitivity';
import { buildFastData } from './fast/projector';
import { realSchur, schurEigenvalues, type RealSchur } from './fast/schur';
import { firstOrderFromFast } from './fast/first-order';

/** Above this condition number λ2 is treated as nearly defective: floors come from the transposed solve. */
export const CONDITION_FOR_TRANSPOSE_FLOOR = 1e3;

function transposeFlat(a: number[], n: number): number[] {
  const t = new Array<number>(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t[j * n + i] = a[i * n + j];
  return t;
}

function valuesOf(decomposition: EigenvalueDecomposition): EigenvalueList {
  return { re: decomposition.realEigenvalues, im: decomposition.imaginaryEigenvalues };
}

/** Sort by real part, then imaginary part (presentation order; indices refer to this order). */
export function sortedValues(values: EigenvalueList): EigenvalueList {
  const order = values.re.map((_, i) => i).sort((a, b) => values.re[a] - values.re[b] || values.im[a] - values.im[b]);
  return { re: order.map((i) => values.re[i]), im: order.map((i) => values.im[i]) };
}

/** The matrix scale used for rounding radii and tie tolerances. */
export function matrixScale(maxDegree: number): number {
  return Math.max(maxDegree, Number.MIN_VALUE);
}

/** Baseline Re λ2 from a cluster: its centre when rounding-split, the computed λ2 when resolved. */
export function baselineValue(values: EigenvalueList, lambda2Index: number, cluster: ClusterFinding): Complex {
  if (cluster.resolved) return { re: values.re[lambda2Index], im: values.im[lambda2Index] };
  return cluster.mean;
}

/** Same rule applied to another computation of the same spectrum, with the cluster size fixed. */
function baselineFromOtherSolve(values: EigenvalueList, size: number, resolved: boolean): number {
  const z = zeroIndexOf(values);
  const l = leastRealIndex(values, z);
  if (resolved || size <= 1) return values.re[l];
  const near = values.re
    .map((re, j) => ({ j, d: Math.hypot(re - values.re[l], values.im[j] - values.im[l]) }))
    .filter(({ j }) => j !== z)
    .sort((a, b) => a.d - b.d)
    .slice(0, size);
  return near.reduce((s, { j }) => s + values.re[j], 0) / near.length;
}

export function analyseBaseline(network: SpectralNetwork, options: SpectralOptions = {}): SpectralBaseline {
  const { opts, n, weights, laplacian, meanWeight, reach } = prepareNetwork(network, options);
  const normF = frobeniusNorm(laplacian);
  const maxDegree = maxDiagonal(laplacian, n);

  // The exact method takes the spectrum, and λ2's eigenvectors, from two full eigen-decompositions
  // (of L and Lᵀ). The fast method reads them off its own real Schur form of L — which it needs
  // anyway — and an eigenvalues-only Schur form of Lᵀ, the two computations that round differently.
  let direct: EigenvalueDecomposition | null = null;
  let transposed: EigenvalueDecomposition | null = null;
  let schur: RealSchur | null = null;
  let rawValues: EigenvalueList;
  let tValues: EigenvalueList;
  try {
    if (opts.method !== 'fast') throw new Error('exact');
    schur = realSchur(laplacian, n);
    rawValues = schurEigenvalues(schur.t, n);
    tValues = schurEigenvalues(realSchur(transposeFlat(laplacian, n), n, false).t, n);
  } catch {
    schur = null;
    direct = decompose(toMatrix(laplacian, n));
    transposed = decompose(toMatrix(laplacian, n, true));
    rawValues = valuesOf(direct);
    tValues = valuesOf(transposed);
  }
  const values = sortedValues(rawValues);
  const zeroIndex = zeroIndexOf(values);
  const lambda2Index = leastRealIndex(values, zeroIndex);
  const scale = matrixScale(maxDegree);
  const ladderScale = meanWeight > 0 ? meanWeight : 1;
  const cluster = findCluster({
    values,
    zeroIndex,
    lambda2Index,
    plainRadius: opts.clusterTolerance * ladderScale,
    scale,
    transposed: tValues,
  });

  let lambda2 = baselineValue(values, lambda2Index, cluster);
  if (!reach.rooted) lambda2 = { re: 0, im: 0 };
  const baselineRe = lambda2.re;
  const baselineNoise = reach.rooted
    ? Math.abs(baselineRe - baselineFromOtherSolve(tValues, cluster.size, cluster.resolved))
    : 0;

  const simple = cluster.size === 1 || cluster.resolved;
  const lambda2Computed = { re: values.re[lambda2Index], im: values.im[lambda2Index] };
  const reTie = 1e3 * UNIT_ROUNDOFF * scale;
  const branches = branchIndices(values, zeroIndex, cluster.members, reTie, cluster.spread);

  const baseline: SpectralBaseline = {
    convention: opts.convention,
    nodes: [...network.nodes],
    n,
    laplacian,
    normF,
    maxDegree,
    meanWeight,
    ...reach,
    spectrum: values.re.map((re, i) => ({ re: re + 0, im: values.im[i] + 0 })),
    zeroIndex,
    lambda2Index,
    lambda2,
    baselineRe,
    baselineNoise,
    cluster: { size: cluster.size, spread: cluster.spread, members: cluster.members, resolved: cluster.resolved },
    branches,
    firstOrder: null,
    transposeFloor: true,
    options: opts,
  };
  // The fast sweep's per-network data (ordered Schur form, block-diagonal basis), computed once here
  // so that workers receive it with the baseline.
  if (opts.method === 'fast') {
    const other = reach.rooted ? lambda2Of(tValues) : { re: 0, im: 0 };
    const rawAtZero = reach.rooted ? foldedDistance(lambda2Computed.re, lambda2Computed.im, other.re, other.im) : 0;
    baseline.fast = buildFastData(baseline, rawAtZero, schur ?? undefined);
  }
  if (reach.rooted && simple) {
    baseline.firstOrder = baseline.fast ? firstOrderFromFast(baseline.fast, lambda2Index) : null;
    if (!baseline.firstOrder) {
      direct ??= decompose(toMatrix(laplacian, n));
      transposed ??= decompose(toMatrix(laplacian, n, true));
      baseline.firstOrder = firstOrderData(direct, transposed, lambda2Computed);
    }
  }
  const firstOrder = baseline.firstOrder;
  baseline.transposeFloor =
    opts.noiseFloor === 'transpose' ||
    !firstOrder ||
    !(firstOrder.condition <= CONDITION_FOR_TRANSPOSE_FLOOR) ||
    cluster.size > 1;
  return baseline;
}
