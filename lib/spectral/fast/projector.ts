/**
 * Per-network data of the fast sweep: which eigenvalues form the λ2 cluster ("core"), an ordered
 * real Schur form with the core first and close eigenvalues grouped, and the block-diagonal form
 * L = V·diag(B₁, …)·V⁻¹ whose first block gives the core's spectral projector P = V₁·(V⁻¹)₁.
 *
 * Core rule (issue 7): the smallest set of eigenvalues around λ2 — conjugates identified — whose
 * nearest outside neighbour is at least 4× farther from its centre than its own radius and at
 * least 0.1·w̄ away. The zero eigenvalue is never part of it (its right eigenvector is constant, so
 * no edge perturbation couples to it; it stays its own item).
 *
 * Outside the core, eigenvalues closer than GROUP_DISTANCE·s (s the matrix scale) are kept in one
 * block, so that every Sylvester equation of the block-diagonalisation is well conditioned; a
 * rounding-split defective eigenvalue thus stays whole.
 */
import type { Complex, FastItem, FastSpectralData, SpectralBaseline } from '../types';
import { blockLayout, eig2, realSchur, type RealSchur } from './schur';
import { swapAdjacent } from './reorder';
import { blockDiagonalise, type ItemRange } from './blocks';
import { solveSylvester } from './sylvester';

/** Core: nearest outside eigenvalue at least this many core radii away … */
export const CORE_GAP_RATIO = 4;
/** … and at least this many mean weights away. */
export const CORE_GAP_WEIGHTS = 0.1;
/** Largest core (eigenvalues, conjugates counted) the fast path accepts. */
export const MAX_CORE = 32;
/** Past this size the gap rule gives way to single linkage. */
export const STRICT_CORE_LIMIT = 8;
/** Outside eigenvalues closer than this times the matrix scale share a block. */
export const GROUP_DISTANCE = 1e-3;

interface Unit {
  /** Position (first row) in the original Schur form. */
  start: number;
  size: number;
  /** Eigenvalues (re, im). */
  values: [number, number][];
  /** Baseline spectrum index per eigenvalue. */
  spectrumIndex: number[];
}

function failed(n: number, reason: string): FastSpectralData {
  return {
    key: '',
    ok: false,
    reason,
    n,
    v: [],
    wt: [],
    items: [],
    zeroItem: -1,
    core: {
      size: 0,
      centre: { re: 0, im: 0 },
      radius: 0,
      gap: null,
      rawAtZero: 0,
      clusterRadius: 0,
      projectorDefect: 0,
      invarianceResidual: 0,
      clusterSize: 0,
      clusterCoupling: null,
    },
  };
}

/** `+ 0` turns −0 into 0 so the arrays survive a JSON round trip unchanged. */
function plain(a: ArrayLike<number>): number[] {
  const out = new Array<number>(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i] + 0;
  return out;
}

/** One-to-one matching of Schur eigenvalues to baseline spectrum indices, closest pairs first. */
function matchToSpectrum(units: Unit[], spectrum: Complex[]): boolean {
  const entries: { u: number; slot: number; re: number; im: number }[] = [];
  units.forEach((unit, u) => unit.values.forEach(([re, im], slot) => entries.push({ u, slot, re, im })));
  const pairs: { d: number; e: number; b: number }[] = [];
  entries.forEach((en, e) => {
    spectrum.forEach((z, b) => pairs.push({ d: Math.hypot(z.re - en.re, z.im - en.im), e, b }));
  });
  pairs.sort((x, y) => x.d - y.d);
  const usedE = new Uint8Array(entries.length);
  const usedB = new Uint8Array(spectrum.length);
  let matched = 0;
  for (const { e, b } of pairs) {
    if (usedE[e] || usedB[b]) continue;
    usedE[e] = 1;
    usedB[b] = 1;
    const en = entries[e];
    units[en.u].spectrumIndex[en.slot] = b;
    matched += 1;
    if (matched === entries.length) break;
  }
  return matched === entries.length;
}

/** A 64-bit FNV-1a style hash (two 32-bit halves) of the Laplacian's bits and the core's items. */
function contentKey(baseline: SpectralBaseline, items: FastItem[]): string {
  const bits = new Uint32Array(Float64Array.from(baseline.laplacian).buffer);
  let h1 = 0x811c9dc5;
  let h2 = 0x01000193;
  const mix = (x: number) => {
    h1 = Math.imul(h1 ^ x, 0x01000193);
    h2 = Math.imul(h2 ^ x, 0x5bd1e995) ^ (h2 >>> 15);
  };
  for (let i = 0; i < bits.length; i++) mix(bits[i]);
  mix(baseline.n);
  for (const it of items) mix(it.start * 131 + it.size);
  for (const b of items[0].spectrumIndex) mix(b);
  return `${(h1 >>> 0).toString(16)}${(h2 >>> 0).toString(16)}-${baseline.n}-${items.length}`;
}

function folded(re: number, im: number): [number, number] {
  return [re, Math.abs(im)];
}

interface CoreChoice {
  inCore: Uint8Array;
  centre: [number, number];
  radius: number;
  gap: number;
}

function measure(units: Unit[], inCore: Uint8Array, zeroUnit: number): CoreChoice & { count: number; nearest: number } {
  let count = 0;
  const centre: [number, number] = [0, 0];
  units.forEach((u, k) => {
    if (!inCore[k]) return;
    for (const [re, im] of u.values) {
      const f = folded(re, im);
      centre[0] += f[0];
      centre[1] += f[1];
      count += 1;
    }
  });
  centre[0] /= count;
  centre[1] /= count;
  let radius = 0;
  let gap = Infinity;
  let nearest = -1;
  units.forEach((u, k) => {
    for (const [re, im] of u.values) {
      const f = folded(re, im);
      const d = Math.hypot(f[0] - centre[0], f[1] - centre[1]);
      if (inCore[k]) radius = Math.max(radius, d);
      else if (k !== zeroUnit && d < gap) {
        gap = d;
        nearest = k;
      }
    }
  });
  return { inCore, centre, radius, gap, count, nearest };
}

/**
 * The rule: grow from the seeds by the nearest outside eigenvalue until that neighbour is
 * at least CORE_GAP_RATIO radii and CORE_GAP_WEIGHTS·w̄ from the centre. Null past `limit`
 * eigenvalues (on large random networks the left edge of the spectrum is dense and the rule can
 * run through much of it).
 */
function coreByGapRule(units: Unit[], seeds: Uint8Array, zeroUnit: number, w: number, limit: number): CoreChoice | null {
  const inCore = Uint8Array.from(seeds);
  for (;;) {
    const m = measure(units, inCore, zeroUnit);
    if (m.count > limit) return null;
    if (m.nearest < 0 || (m.gap >= CORE_GAP_RATIO * m.radius && m.gap >= CORE_GAP_WEIGHTS * w)) return m;
    inCore[m.nearest] = 1;
  }
}

/**
 * Fallback rule: single linkage at CORE_GAP_WEIGHTS·w̄ (every eigenvalue nearer than that to a core
 * member joins). Near-degenerate partners are still inside; farther eigenvalues that might
 * overtake λ2 are taken into the reduced problem edge by edge ("movers", fast-sweep.ts), and the
 * outside resolvent is evaluated exactly (partial fractions), so no expansion radius is needed.
 */
function coreByLinkage(units: Unit[], seeds: Uint8Array, zeroUnit: number, w: number): CoreChoice | null {
  const inCore = Uint8Array.from(seeds);
  const reach = CORE_GAP_WEIGHTS * w;
  for (let changed = true; changed; ) {
    changed = false;
    units.forEach((u, k) => {
      if (inCore[k] || k === zeroUnit) return;
      for (const [re, im] of u.values) {
        const f = folded(re, im);
        units.forEach((c, j) => {
          if (!inCore[j] || inCore[k]) return;
          for (const [cr, ci] of c.values) {
            const g = folded(cr, ci);
            if (Math.hypot(f[0] - g[0], f[1] - g[1]) < reach) {
              inCore[k] = 1;
              changed = true;
            }
          }
        });
      }
    });
  }
  const m = measure(units, inCore, zeroUnit);
  return m.count > MAX_CORE ? null : m;
}

/**
 * @param rawAtZero spread of λ2 between the baseline's solves of L and Lᵀ (anchors noise floors)
 */
export function buildFastData(baseline: SpectralBaseline, rawAtZero = 0, precomputed?: RealSchur): FastSpectralData {
  const n = baseline.n;
  if (!baseline.rooted) return failed(n, 'not rooted: several zero eigenvalues');
  if (n < 2) return failed(n, 'too small');
  let schur: RealSchur;
  try {
    // A Schur form handed in is reordered in place below.
    schur = precomputed ?? realSchur(baseline.laplacian, n);
  } catch {
    return failed(n, 'Schur form did not converge');
  }
  const { t, q } = schur;
  const units: Unit[] = blockLayout(t, n).map(({ start, size }) => {
    if (size === 1) return { start, size, values: [[t[start * n + start], 0]], spectrumIndex: [-1] };
    const e = eig2(t[start * n + start], t[start * n + start + 1], t[(start + 1) * n + start], t[(start + 1) * n + start + 1]);
    return { start, size, values: [[e.re1, e.im], [e.re2, -e.im]], spectrumIndex: [-1, -1] };
  });
  if (!matchToSpectrum(units, baseline.spectrum)) return failed(n, 'spectrum mismatch');
  const unitOfIndex = new Int32Array(baseline.spectrum.length).fill(-1);
  units.forEach((u, k) => u.spectrumIndex.forEach((b) => (unitOfIndex[b] = k)));
  const zeroUnit = unitOfIndex[baseline.zeroIndex];
  if (zeroUnit < 0 || units[zeroUnit].size !== 1) return failed(n, 'zero eigenvalue not isolated');

  // Core: seeds are the λ2 branches (cluster, conjugates, real-part ties), then the gap rule.
  const inCore = new Uint8Array(units.length);
  for (const b of [...baseline.branches, ...baseline.cluster.members]) {
    const u = unitOfIndex[b];
    if (u === zeroUnit) return failed(n, 'λ2 cluster touches the zero eigenvalue');
    inCore[u] = 1;
  }
  const ladderScale = baseline.meanWeight > 0 ? baseline.meanWeight : 1;
  const strict = coreByGapRule(units, inCore, zeroUnit, ladderScale, STRICT_CORE_LIMIT);
  const chosen = strict ?? coreByLinkage(units, inCore, zeroUnit, ladderScale);
  if (!chosen) return failed(n, `λ2 cluster larger than ${MAX_CORE} eigenvalues`);
  inCore.set(chosen.inCore);
  const { centre, radius, gap } = chosen;

  // Groups of close eigenvalues outside the core (union–find).
  const scale = Math.max(baseline.maxDegree, ladderScale);
  const groupDistance = GROUP_DISTANCE * scale;
  const parent = units.map((_, k) => k);
  const find = (k: number): number => {
    while (parent[k] !== k) {
      parent[k] = parent[parent[k]];
      k = parent[k];
    }
    return k;
  };
  const order = units.map((_, k) => k).filter((k) => !inCore[k]).sort((a, b) => units[a].values[0][0] - units[b].values[0][0]);
  // Sweep by real part: only pairs whose real parts are within groupDistance can be close.
  for (let i = 0; i < order.length; i++) {
    const a = units[order[i]];
    const aMin = Math.min(...a.values.map((v) => v[0]));
    for (let j = i + 1; j < order.length; j++) {
      const b = units[order[j]];
      const bMin = Math.min(...b.values.map((v) => v[0]));
      if (bMin - aMin > groupDistance + 1e-300) break;
      let close = false;
      for (const x of a.values) for (const y of b.values) if (Math.hypot(x[0] - y[0], x[1] - y[1]) < groupDistance) close = true;
      if (close) parent[find(order[i])] = find(order[j]);
    }
  }
  // Zero must stay alone; the core must stay apart from the rest.
  for (let k = 0; k < units.length; k++) {
    if (k !== zeroUnit && !inCore[k] && find(k) === find(zeroUnit)) return failed(n, 'an eigenvalue sits next to zero');
  }
  if (gap < groupDistance) return failed(n, 'λ2 cluster not separated from the rest of the spectrum');

  // Desired order: core (rounding-split cluster units first), then outside groups contiguous.
  const clusterUnits = new Set<number>();
  const clusterSize = !baseline.cluster.resolved && baseline.cluster.size > 1 ? baseline.cluster.size : 0;
  if (clusterSize) for (const b of baseline.cluster.members) clusterUnits.add(unitOfIndex[b]);
  let clusterCount = 0;
  for (const u of clusterUnits) clusterCount += units[u].size;
  const desired: number[] = [];
  units.forEach((_, k) => inCore[k] && clusterUnits.has(k) && desired.push(k));
  units.forEach((_, k) => inCore[k] && !clusterUnits.has(k) && desired.push(k));
  const emitted = new Set<number>();
  units.forEach((_, k) => {
    if (inCore[k]) return;
    const root = find(k);
    if (emitted.has(root)) return;
    emitted.add(root);
    units.forEach((_, j) => !inCore[j] && find(j) === root && desired.push(j));
  });

  // Reorder by adjacent swaps (bubbling each desired unit up to its place).
  const position = units.map((_, k) => k);
  const atPos = units.map((_, k) => k);
  const startAt = units.map((u) => u.start);
  for (let target = 0; target < desired.length; target++) {
    const u = desired[target];
    for (let p = position[u]; p > target; p--) {
      const upper = atPos[p - 1];
      const lower = atPos[p];
      const j = startAt[p - 1];
      if (!swapAdjacent(t, q, n, j, units[upper].size, units[lower].size)) return failed(n, 'Schur reordering failed');
      atPos[p - 1] = lower;
      atPos[p] = upper;
      position[lower] = p - 1;
      position[upper] = p;
      startAt[p] = j + units[lower].size;
    }
  }

  // Items: the core, then one per group.
  const ranges: ItemRange[] = [];
  const itemUnits: number[][] = [];
  let cursor = 0;
  let k = 0;
  while (k < desired.length) {
    const first = desired[k];
    const members = [first];
    let j = k + 1;
    if (inCore[first]) {
      while (j < desired.length && inCore[desired[j]]) members.push(desired[j++]);
    } else {
      while (j < desired.length && !inCore[desired[j]] && find(desired[j]) === find(first)) members.push(desired[j++]);
    }
    const size = members.reduce((s, m) => s + units[m].size, 0);
    ranges.push({ start: cursor, size });
    itemUnits.push(members);
    cursor += size;
    k = j;
  }
  const diag = blockDiagonalise(t, q, n, ranges);
  if (!diag) return failed(n, 'block-diagonalisation failed');
  const { v, wt } = diag;

  const items: FastItem[] = ranges.map((range, idx) => {
    const block = new Float64Array(range.size * range.size);
    for (let r = 0; r < range.size; r++) for (let c = 0; c < range.size; c++) block[r * range.size + c] = t[(range.start + r) * n + range.start + c];
    const values: number[] = [];
    const spectrumIndex: number[] = [];
    for (const u of itemUnits[idx]) {
      units[u].values.forEach(([re, im], s) => {
        values.push(re, im);
        spectrumIndex.push(units[u].spectrumIndex[s]);
      });
    }
    let kind: FastItem['kind'] = idx === 0 ? 'core' : 'block';
    let pairVectors: FastItem['pairVectors'];
    if (idx > 0 && itemUnits[idx].length === 1) {
      const unit = units[itemUnits[idx][0]];
      if (unit.size === 1) kind = 'real';
      else {
        const [a, b, c, d] = block;
        const e = eig2(a, b, c, d);
        if (e.im > 0 && b !== 0) {
          kind = 'pair';
          // (B − μ)e = 0 with e = (b, μ − a); Bᵀf = μf with f = (c, μ − a); scaled so fᵀe = 1 (by hand).
          const mr = e.re1 - a;
          const mi = e.im;
          const dotR = c * b + (mr * mr - mi * mi);
          const dotI = 2 * mr * mi;
          const den = dotR * dotR + dotI * dotI;
          const invR = dotR / den;
          const invI = -dotI / den;
          pairVectors = {
            e: plain([b, 0, mr, mi]),
            f: plain([c * invR, c * invI, mr * invR - mi * invI, mr * invI + mi * invR]),
          };
          values.length = 0;
          values.push(e.re1, e.im, e.re2, -e.im);
        }
      }
    }
    const item: FastItem = { start: range.start, size: range.size, kind, block: plain(block), values: plain(values), spectrumIndex };
    if (pairVectors) item.pairVectors = pairVectors;
    return item;
  });
  const zeroItem = itemUnits.findIndex((members) => members.includes(zeroUnit));

  // Quality of the core's projector P = X·Yᵀ (X = V[:, core], Yᵀ = V⁻¹[core, :]).
  const m = ranges[0].size;
  const coreBlock = items[0].block;
  const ytx = new Float64Array(m * m);
  const g1 = new Float64Array(m * m);
  const g2 = new Float64Array(m * m);
  for (let r = 0; r < n; r++) {
    for (let a = 0; a < m; a++) {
      for (let b = 0; b < m; b++) {
        ytx[a * m + b] += wt[r * n + a] * v[r * n + b];
        g1[a * m + b] += v[r * n + a] * v[r * n + b];
        g2[a * m + b] += wt[r * n + a] * wt[r * n + b];
      }
    }
  }
  for (let a = 0; a < m; a++) ytx[a * m + a] -= 1;
  // ‖X K Yᵀ‖_F² = trace(Kᵀ G1 K G2) with K = YᵀX − I, G1 = XᵀX, G2 = YᵀY (by hand).
  let defect2 = 0;
  const g1k = new Float64Array(m * m);
  for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) {
    let s = 0;
    for (let c = 0; c < m; c++) s += g1[a * m + c] * ytx[c * m + b];
    g1k[a * m + b] = s;
  }
  const g1kg2 = new Float64Array(m * m);
  for (let a = 0; a < m; a++) for (let b = 0; b < m; b++) {
    let s = 0;
    for (let c = 0; c < m; c++) s += g1k[a * m + c] * g2[c * m + b];
    g1kg2[a * m + b] = s;
  }
  for (let a = 0; a < m; a++) for (let c = 0; c < m; c++) defect2 += ytx[c * m + a] * g1kg2[c * m + a];
  let residual2 = 0;
  const L = baseline.laplacian;
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < m; c++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += L[r * n + j] * v[j * n + c];
      for (let j = 0; j < m; j++) s -= v[r * n + j] * coreBlock[j * m + c];
      residual2 += s * s;
    }
  }

  // Cluster first inside the core: decouple it from the rest of the core (for Puiseux data).
  let clusterCoupling: number[] | null = null;
  let clusterLeading = 0;
  if (clusterSize && clusterCount === clusterSize) {
    clusterLeading = clusterSize;
    if (m > clusterSize) {
      const kc = clusterSize;
      const ko = m - kc;
      const ac = new Float64Array(kc * kc);
      const ao = new Float64Array(ko * ko);
      const ax = new Float64Array(kc * ko);
      for (let r = 0; r < kc; r++) for (let c = 0; c < kc; c++) ac[r * kc + c] = coreBlock[r * m + c];
      for (let r = 0; r < ko; r++) for (let c = 0; c < ko; c++) ao[r * ko + c] = coreBlock[(kc + r) * m + kc + c];
      for (let r = 0; r < kc; r++) for (let c = 0; c < ko; c++) ax[r * ko + c] = -coreBlock[r * m + kc + c];
      const r1 = solveSylvester(ac, kc, ao, ko, ax);
      if (r1 && r1.every(Number.isFinite)) clusterCoupling = plain(r1);
      else clusterLeading = 0;
    }
  }

  // Rounding split of the cluster in this Schur form (its eigenvalues' spread around their mean).
  let clusterRadius = 0;
  if (clusterLeading) {
    const vals = items[0].values;
    let mr = 0;
    let mi = 0;
    for (let i = 0; i < clusterLeading; i++) {
      mr += vals[2 * i];
      mi += vals[2 * i + 1];
    }
    mr /= clusterLeading;
    mi /= clusterLeading;
    for (let i = 0; i < clusterLeading; i++) clusterRadius = Math.max(clusterRadius, Math.hypot(vals[2 * i] - mr, vals[2 * i + 1] - mi));
  }

  return {
    key: contentKey(baseline, items),
    ok: true,
    n,
    v: plain(v),
    wt: plain(wt),
    items,
    zeroItem,
    core: {
      size: m,
      centre: { re: centre[0] + 0, im: centre[1] + 0 },
      radius,
      gap: Number.isFinite(gap) ? gap : null,
      rawAtZero: rawAtZero + 0,
      clusterRadius,
      projectorDefect: Math.sqrt(Math.max(defect2, 0)),
      invarianceResidual: Math.sqrt(residual2),
      clusterSize: clusterLeading,
      clusterCoupling,
    },
  };
}
