/**
 * Per-worker working form of the fast data: typed arrays and item tables built once per baseline
 * object (a worker reuses it for every edge of its chunk).
 */
import type { FastSpectralData, SpectralBaseline } from '../types';
import { corePoles, type CorePoles } from './core-poles';

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
  /** Position of an item in `reals` / `pairs` (−1 if it is not one). */
  realIndex: Int32Array;
  pairIndex: Int32Array;
  /** Baseline spectrum values of each item's eigenvalues (for matching). */
  itemValues: Float64Array[];
  /** Frobenius norms of each item's right and left basis. */
  rightNorm: Float64Array;
  leftNorm: Float64Array;
  /** Size of the floor model's perturbation of the reduced matrix (set on first use, fast-edge.ts). */
  floorEta: number | null;
  /** Items other than the core and the zero, sorted by the least real part of their eigenvalues. */
  byRe: Int32Array;
  /** Least real part per entry of byRe, and the widest real-part span of any item. */
  byReMin: Float64Array;
  reSpan: number;
  /** The core in partial fractions when its eigenvectors are well conditioned (core-poles.ts). */
  corePoles: CorePoles | null;
  /** Own unperturbed λ2 minus the baseline's (set on first use, fast-edge.ts). */
  referenceShift: number | null;
  /**
   * Per item: departure from normality ν = √(‖B‖_F² − Σ|λ_i|²) of its block (= ‖N‖_F of any
   * Schur form Λ + N; P. Henrici, Numer. Math. 4, 1962 — cited from memory), with a margin for the
   * cancellation in the difference. Used to bound grouped blocks' resolvents (certificate.ts).
   */
  departure: Float64Array;
}

const contexts = new WeakMap<FastSpectralData, FastContext>();
/**
 * Also by content key: a server sends every chunk of edges with its own structured clone of the
 * baseline, so the same data arrives as new objects; the working form is rebuilt once per network.
 */
const byKey = new Map<string, FastContext>();
const KEYED = 4;

const KIND = { core: 0, real: 1, pair: 2, block: 3 } as const;

export function fastContext(baseline: SpectralBaseline, data: FastSpectralData): FastContext {
  const cached = contexts.get(data) ?? (data.key ? byKey.get(data.key) : undefined);
  if (cached && cached.n === data.n) {
    contexts.set(data, cached);
    return cached;
  }
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
  const order: number[] = [];
  let reSpan = 0;
  const minRe = new Float64Array(count);
  itemValues.forEach((vals, k) => {
    let lo = Infinity;
    let hi = -Infinity;
    for (let j = 0; j < vals.length; j += 2) {
      lo = Math.min(lo, vals[j]);
      hi = Math.max(hi, vals[j]);
    }
    minRe[k] = lo;
    if (k > 0 && k !== data.zeroItem) {
      order.push(k);
      reSpan = Math.max(reSpan, hi - lo);
    }
  });
  order.sort((a, b) => minRe[a] - minRe[b]);
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
    realIndex: new Int32Array(count).fill(-1).map((_, k) => reals.indexOf(k)),
    pairIndex: new Int32Array(count).fill(-1).map((_, k) => pairs.indexOf(k)),
    blocks: Int32Array.from(blocks),
    itemValues,
    rightNorm,
    leftNorm,
    floorEta: null,
    byRe: Int32Array.from(order),
    byReMin: Float64Array.from(order.map((k) => minRe[k])),
    reSpan,
    corePoles: null,
    referenceShift: null,
    departure: Float64Array.from(data.items, (it) => {
      let bb = 0;
      for (const v of it.block) bb += v * v;
      let ll = 0;
      for (let j = 0; j < it.values.length; j += 2) ll += it.values[j] ** 2 + it.values[j + 1] ** 2;
      return Math.sqrt(Math.max(0, bb - ll) + 1e-12 * bb);
    }),
  };
  ctx.corePoles = corePoles(ctx);
  contexts.set(data, ctx);
  if (data.key) {
    byKey.set(data.key, ctx);
    while (byKey.size > KEYED) byKey.delete(byKey.keys().next().value as string);
  }
  return ctx;
}
