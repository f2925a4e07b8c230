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

export interface JordanCoreSpec {
  /** Total node count (core included). */
  nodes: number;
  /** Jordan block size of λ2: 2 or 3. */
  block: 2 | 3;
  seed: number;
  /** Average number of edges into each downstream node. Default 5. */
  edgesPerNode?: number;
  /**
   * Core shape. `chain` (default): a leader followed by a chain of `block` nodes with one common
   * weight w. `cycle`: the 3-node triangle with a chord (block 2) or the 4-cycle with two chords
   * (block 3), all weights w.
   */
  shape?: 'chain' | 'cycle';
}

/**
 * A network whose λ2 is a defective eigenvalue with a single Jordan block of the given size,
 * embedded among `nodes` nodes.
 *
 * The core listens to no one outside it, so L is block lower triangular and the core's eigenvalues
 * are eigenvalues of the whole network. Chain core c0 → c1 → … → c_k with weight w: the core block
 * is lower bidiagonal with w on the diagonal (c1 … c_k) and −w below it — one Jordan block of size
 * k at w (by hand). Cycle cores: the triangle 1→2→3→1 plus 2→1 has 0, 2w, 2w with rank(L − 2w) = 2;
 * the 4-cycle with chords 1→3, 1→4 has 0, 2w, 2w, 2w with rank(L − 2w) = 3 (worked out in the
 * closed-form tests). Every downstream node hears one core node with weight at least λ_core + 0.3
 * plus random downstream nodes, so by Gershgorin's theorem (S. Gerschgorin, Izv. Akad. Nauk SSSR
 * 1931 — cited from memory) its block's eigenvalues have real part above λ_core + 0.3: λ2 stays the
 * core's. Nodes are named c0… for the core and d0… downstream.
 */
export function jordanCoreNetwork(spec: JordanCoreSpec): SpectralNetwork {
  const rand = seededUniform(spec.seed);
  const shape = spec.shape ?? 'chain';
  const w = 0.6 + 0.8 * rand();
  const coreEdges: [number, number][] =
    shape === 'chain'
      ? Array.from({ length: spec.block }, (_, i) => [i, i + 1] as [number, number])
      : spec.block === 2
        ? [[0, 1], [1, 2], [2, 0], [1, 0]]
        : [[0, 1], [1, 2], [2, 3], [3, 0], [0, 2], [0, 3]];
  const coreSize = shape === 'chain' ? spec.block + 1 : spec.block + 1;
  const lambda = shape === 'chain' ? w : 2 * w;
  const n = spec.nodes;
  const nodes = [...Array.from({ length: coreSize }, (_, i) => `c${i}`), ...Array.from({ length: n - coreSize }, (_, i) => `d${i}`)];
  const edges: SpectralNetwork['edges'] = coreEdges.map(([s, t]) => ({ source: nodes[s], target: nodes[t], weight: w }));
  const seen = new Set(coreEdges.map(([s, t]) => s * n + t));
  const add = (s: number, t: number, weight: number) => {
    const key = s * n + t;
    if (s === t || seen.has(key)) return false;
    seen.add(key);
    edges.push({ source: nodes[s], target: nodes[t], weight });
    return true;
  };
  const perNode = spec.edgesPerNode ?? 5;
  for (let t = coreSize; t < n; t++) {
    add(Math.floor(rand() * coreSize), t, lambda + 0.3 + rand());
    const extra = Math.max(0, Math.round(perNode - 1 + (rand() - 0.5) * 2));
    for (let k = 0; k < extra; k++) {
      // Mostly downstream senders, sometimes another core node.
      const s = rand() < 0.85 && n - coreSize > 1 ? coreSize + Math.floor(rand() * (n - coreSize)) : Math.floor(rand() * coreSize);
      add(s, t, 0.5 + rand());
    }
  }
  return { nodes, edges };
}
