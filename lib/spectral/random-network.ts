/**
 * Reproducible random networks for tests and benchmarks.
 *
 * The generator is a small 32-bit counter-based mixer (a Weyl sequence stepped by an odd constant,
 * scrambled by xor-shifts and multiplications): fast, seedable and identical on every platform,
 * which is all a test fixture needs. It is not meant for anything statistical or secret.
 */
import type { SpectralNetwork } from './types';

/** Uniform numbers in [0, 1) from a 32-bit seed. */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let x = state;
    x = Math.imul(x ^ (x >>> 16), 0x85ebca6b);
    x = Math.imul(x ^ (x >>> 13), 0xc2b2ae35);
    x ^= x >>> 16;
    return (x >>> 0) / 4294967296;
  };
}

export interface RandomNetworkSpec {
  nodes: number;
  /** Average number of edges per node (total edges ≈ nodes × this). Default 5. */
  edgesPerNode?: number;
  seed: number;
  /** Weights are uniform in [min, max). Default [0.5, 1.5). */
  weightRange?: [number, number];
}

/**
 * A random directed network that is strongly connected (hence rooted): a directed cycle through all
 * nodes in a shuffled order, plus distinct random edges (no self-loops, no parallels) up to the
 * requested count. Nodes are named n0, n1, ….
 */
export function randomNetwork(spec: RandomNetworkSpec): SpectralNetwork {
  const rand = seededUniform(spec.seed);
  const n = spec.nodes;
  const [lo, hi] = spec.weightRange ?? [0.5, 1.5];
  const nodes = Array.from({ length: n }, (_, i) => `n${i}`);
  const order = nodes.map((_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [order[i], order[j]] = [order[j], order[i]];
  }
  const seen = new Set<number>();
  const edges: SpectralNetwork['edges'] = [];
  const add = (s: number, t: number) => {
    const key = s * n + t;
    if (s === t || seen.has(key)) return false;
    seen.add(key);
    edges.push({ source: nodes[s], target: nodes[t], weight: lo + (hi - lo) * rand() });
    return true;
  };
  if (n > 1) for (let i = 0; i < n; i++) add(order[i], order[(i + 1) % n]);
  const wanted = Math.min(Math.round(n * (spec.edgesPerNode ?? 5)), n * (n - 1));
  while (edges.length < wanted) add(Math.floor(rand() * n), Math.floor(rand() * n));
  return { nodes, edges };
}
