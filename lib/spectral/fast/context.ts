/**
 * Per-worker working form of the fast data: typed arrays and item tables built once per baseline
 * object (a worker reuses it for every edge of its chunk).
 */
import type { FastSpectralData, SpectralBaseline } from '../types';

export interface FastContext {
  n: number;
  v: Float64Array;
  wt: Float64Array;
  data: FastSpectralData;
  /** Item kinds as numbers: 0 core, 1 real, 2 pair, 3 block. */
  kind: Uint8Array;
  start: Int32Array;
  size: Int32Array;
  /** Indices of the items outside the core, by kind. */
  reals: Int32Array;
  pairs: Int32Array;
  blocks: Int32Array;
  /** Baseline spectrum values of each item's eigenvalues (for matching). */
  itemValues: Float64Array[];
  /** Frobenius norms of each item's right and left basis. */
  rightNorm: Float64Array;
  leftNorm: Float64Array;
  /** Size of the floor model's perturbation of the reduced matrix (set on first use, fast-edge.ts). */
  floorEta: number | null;
}

const contexts = new WeakMap<FastSpectralData, FastContext>();

const KIND = { core: 0, real: 1, pair: 2, block: 3 } as const;

export function fastContext(baseline: SpectralBaseline, data: FastSpectralData): FastContext {
  const cached = contexts.get(data);
  if (cached) return cached;
  const n = data.n;
  const v = Float64Array.from(data.v);
  const wt = Float64Array.from(data.wt);
  const count = data.items.length;
  const kind = new Uint8Array(count);
  const start = new Int32Array(count);
  const size = new Int32Array(count);
  const reals: number[] = [];
  const pairs: number[] = [];
  const blocks: number[] = [];
  const rightNorm = new Float64Array(count);
  const leftNorm = new Float64Array(count);
  const itemValues: Float64Array[] = [];
  data.items.forEach((it, k) => {
    kind[k] = KIND[it.kind];
    start[k] = it.start;
    size[k] = it.size;
    if (k > 0) (it.kind === 'real' ? reals : it.kind === 'pair' ? pairs : blocks).push(k);
    let rn = 0;
    let ln = 0;
    for (let r = 0; r < n; r++) {
      for (let c = it.start; c < it.start + it.size; c++) {
        rn += v[r * n + c] ** 2;
        ln += wt[r * n + c] ** 2;
      }
    }
    rightNorm[k] = Math.sqrt(rn);
    leftNorm[k] = Math.sqrt(ln);
    const vals = new Float64Array(2 * it.spectrumIndex.length);
    it.spectrumIndex.forEach((b, s) => {
      vals[2 * s] = baseline.spectrum[b].re;
      vals[2 * s + 1] = baseline.spectrum[b].im;
    });
    itemValues.push(vals);
  });
  const ctx: FastContext = {
    n,
    v,
    wt,
    data,
    kind,
    start,
    size,
    reals: Int32Array.from(reals),
    pairs: Int32Array.from(pairs),
    blocks: Int32Array.from(blocks),
    itemValues,
    rightNorm,
    leftNorm,
    floorEta: null,
  };
  contexts.set(data, ctx);
  return ctx;
}
