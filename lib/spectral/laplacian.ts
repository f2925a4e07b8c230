/**
 * The graph Laplacian of a directed weighted network, and how one edge weight enters it.
 *
 * Each node relaxes toward the nodes it listens to: ẋ_i = Σ_j w_ij (x_j − x_i), i.e. ẋ = −L x with
 * L = D − A. With the in-degree convention the listener of `source → target` is the target, so the
 * edge adds w to L[t][t] and −w to L[t][s]; every row sums to zero, hence L·1 = 0 and 0 is always an
 * eigenvalue. With the out-degree convention the source listens instead and the roles swap.
 *
 * A change ε of one weight therefore moves exactly two entries of one row: L + ε·∂L_e with
 * ∂L_e = e_r (e_r − e_c)ᵀ (r the listening node, c the node it hears), a rank-one matrix whose rows
 * still sum to zero — the zero eigenvalue survives every perturbation the engine applies.
 */
import type { Convention, SpectralNetwork } from './types';
import { SpectralInputError } from './errors';

/** The listening row and the heard column of one edge under a convention. */
export interface EdgeSlot {
  /** Row of L that the edge writes into (the listener). */
  row: number;
  /** Column of the off-diagonal entry (the node listened to). */
  col: number;
}

/** Map node names to indices, rejecting duplicates and empty names. */
export function indexNodes(nodes: string[]): Map<string, number> {
  const index = new Map<string, number>();
  nodes.forEach((name, i) => {
    if (typeof name !== 'string' || name.length === 0) {
      throw new SpectralInputError(`node ${i} has no name`);
    }
    if (index.has(name)) throw new SpectralInputError(`node "${name}" is listed twice`);
    index.set(name, i);
  });
  return index;
}

/** Check a network and resolve every edge to its Laplacian slot. */
export function edgeSlots(network: SpectralNetwork, convention: Convention): EdgeSlot[] {
  if (!network || !Array.isArray(network.nodes) || !Array.isArray(network.edges)) {
    throw new SpectralInputError('network needs arrays `nodes` and `edges`');
  }
  if (network.nodes.length === 0) throw new SpectralInputError('network has no nodes');
  const index = indexNodes(network.nodes);
  return network.edges.map((edge, k) => {
    const s = index.get(edge.source);
    const t = index.get(edge.target);
    if (s === undefined) throw new SpectralInputError(`edge ${k} names unknown source "${edge.source}"`);
    if (t === undefined) throw new SpectralInputError(`edge ${k} names unknown target "${edge.target}"`);
    if (typeof edge.weight !== 'number' || !Number.isFinite(edge.weight) || edge.weight < 0) {
      throw new SpectralInputError(`edge ${k} (${edge.source} → ${edge.target}) has weight ${edge.weight}; weights must be finite and ≥ 0`);
    }
    return convention === 'in' ? { row: t, col: s } : { row: s, col: t };
  });
}

/** Dense row-major Laplacian (length n²). Parallel edges add up; self-loops cancel out. */
export function buildLaplacian(n: number, slots: EdgeSlot[], weights: number[]): number[] {
  const L = new Array<number>(n * n).fill(0);
  for (let k = 0; k < slots.length; k++) {
    const { row, col } = slots[k];
    const w = weights[k];
    L[row * n + row] += w;
    L[row * n + col] -= w;
  }
  return L;
}

/** Mean over the edges that exist (positive weight); weight-0 probes do not set the scale. */
export function meanPositiveWeight(weights: number[]): number {
  let sum = 0;
  let count = 0;
  for (const w of weights) {
    if (w > 0) {
      sum += w;
      count += 1;
    }
  }
  return count === 0 ? 0 : sum / count;
}

export function frobeniusNorm(matrix: number[]): number {
  let sum = 0;
  for (const v of matrix) sum += v * v;
  return Math.sqrt(sum);
}

export function maxDiagonal(matrix: number[], n: number): number {
  let m = 0;
  for (let i = 0; i < n; i++) m = Math.max(m, Math.abs(matrix[i * n + i]));
  return m;
}
