/**
 * Edge sweeps: for each edge and sign, recompute λ2 exactly along the ε ladder, follow its
 * identity, estimate the noise floor, classify the response and turn it into a weight tolerance.
 *
 * Each point is a full eigen-solve of L + ε·∂L_e — never a first-order estimate — because the
 * interesting edges are precisely those where first order fails (λ2 defective or nearly so).
 *
 * Identity: as ε grows another eigenvalue may take over the least real part. Δ would then describe
 * that eigenvalue, not λ2's branches, and a fit through both is meaningless. Perturbed and baseline
 * eigenvalues are matched one to one, closest pairs first (conjugates identified); a point is
 * "tracked" while some eigenvalue attaining the least real part matches a branch of the λ2 cluster.
 * Untracked points are dropped from the fit (but still count for the tolerance budget, since the
 * convergence rate is whatever the least real part is).
 */
import type {
  AuditResult,
  EdgeResult,
  FirstOrderSensitivity,
  PerturbationTerm,
  SignResponse,
  SpectralBaseline,
  SpectralNetwork,
  SpectralOptions,
  SweepHooks,
  SweepSign,
  ToleranceBudget,
  BudgetLimit,
} from './types';
import { resolveOptions } from './options';
import { SpectralInputError, SweepCancelledError } from './errors';
import { edgeSlots, type EdgeSlot } from './laplacian';
import { PerturbationWorkspace, foldedDistance, lambda2Of, leastRealIndex, zeroIndexOf, type EntryTerm } from './spectrum';
import { UNIT_ROUNDOFF } from './cluster';
import { conditionFloor, robustFloors } from './noise-floor';
import { ladderMagnitudes, signedLadder } from './ladder';
import { analyseSign, exponentOfClass, type ResponseLaws } from './classify';
import { confirmBudget, predictBudget, type SignTrace } from './tolerance';
import { sensitivityOf } from './sensitivity';
import { analyseBaseline, matrixScale } from './baseline';
import type { FastSpectralData, SweepMethod } from './types';
import { buildFastData } from './fast/projector';
import { fastContext, type FastContext } from './fast/context';
import { FastEdge, type FloorKind } from './fast/fast-edge';
import { leadingPuiseux } from './fast/puiseux';

interface SweepContext {
  baseline: SpectralBaseline;
  /** Full-solve workspace, made on first use (the fast path may never need it). */
  workspace: () => PerturbationWorkspace;
  branchSet: Set<number>;
  slots: EdgeSlot[];
  /** Fast-path data, built on first use when the baseline does not carry it. */
  fast?: { data: FastSpectralData; context: FastContext | null };
}

/** One workspace per baseline object (a worker reuses it across the edges it is given). */
const contexts = new WeakMap<SpectralBaseline, { network: SpectralNetwork; context: SweepContext }>();

function contextFor(network: SpectralNetwork, baseline: SpectralBaseline): SweepContext {
  const cached = contexts.get(baseline);
  if (cached && cached.network === network) return cached.context;
  if (network.nodes.length !== baseline.n) {
    throw new SpectralInputError('network and baseline disagree on the number of nodes');
  }
  let workspace: PerturbationWorkspace | null = null;
  const context: SweepContext = {
    baseline,
    workspace: () => (workspace ??= new PerturbationWorkspace(baseline.laplacian, baseline.n)),
    branchSet: new Set(baseline.branches),
    slots: edgeSlots(network, baseline.convention),
  };
  contexts.set(baseline, { network, context });
  return context;
}

interface PointEvaluation {
  /** Re λ2 of the perturbed matrix (least real part, zero set aside). */
  re: number;
  tracked: boolean;
  /** Raw solver-error estimate (NaN when not computed). */
  raw: number;
}

/**
 * Greedy one-to-one matching of perturbed to baseline eigenvalues (closest pairs first, conjugates
 * identified, the zero set aside on both sides). One-to-one matters: when a branch moves more than
 * half the gap to a neighbour, nearest-neighbour matching would hand it to the neighbour, although
 * the neighbour's own perturbed eigenvalue sits right on top of it and claims it first.
 * Returns true if some eigenvalue with real part ≤ `reLimit` is matched to a branch of λ2.
 */
function followsBranch(
  values: { re: number[]; im: number[] },
  zero: number,
  reLimit: number,
  baseline: SpectralBaseline,
  branchSet: Set<number>,
): boolean {
  const spectrum = baseline.spectrum;
  const n = values.re.length;
  const candidates: number[] = [];
  for (let p = 0; p < n; p++) if (p !== zero && values.re[p] <= reLimit) candidates.push(p);
  const dist = (p: number, b: number) => foldedDistance(values.re[p], values.im[p], spectrum[b].re, spectrum[b].im);
  // Greedy decisions among pairs closer than D depend on nothing farther than D. So match within a
  // radius D that grows until every candidate is matched; the outcome equals the full greedy
  // matching at a fraction of its cost.
  let radius = 0;
  for (const p of candidates) {
    let nearest = Infinity;
    for (let b = 0; b < spectrum.length; b++) if (b !== baseline.zeroIndex) nearest = Math.min(nearest, dist(p, b));
    radius = Math.max(radius, nearest);
  }
  radius = radius * 4 + Number.MIN_VALUE;
  for (;;) {
    const pairs: { d: number; p: number; b: number }[] = [];
    for (let p = 0; p < n; p++) {
      if (p === zero) continue;
      for (let b = 0; b < spectrum.length; b++) {
        if (b === baseline.zeroIndex) continue;
        const d = dist(p, b);
        if (d <= radius) pairs.push({ d, p, b });
      }
    }
    pairs.sort((x, y) => x.d - y.d);
    const matchOf = new Map<number, number>();
    const taken = new Set<number>();
    for (const { p, b } of pairs) {
      if (matchOf.has(p) || taken.has(b)) continue;
      matchOf.set(p, b);
      taken.add(b);
    }
    if (candidates.every((p) => matchOf.has(p)) || pairs.length >= (n - 1) * (spectrum.length - 1)) {
      return candidates.some((p) => branchSet.has(matchOf.get(p) ?? -1));
    }
    radius *= 4;
  }
}

/** Fast-path data for this baseline: the baseline's own, or built once per worker. */
function fastFor(ctx: SweepContext): { data: FastSpectralData; context: FastContext | null } {
  if (!ctx.fast) {
    const data = ctx.baseline.fast ?? buildFastData(ctx.baseline);
    ctx.fast = { data, context: data.ok ? fastContext(ctx.baseline, data) : null };
  }
  return ctx.fast;
}

/** Where the points of one perturbation come from (full solves or the fast path). */
interface PointSource {
  point(eps: number, floor: FloorKind): PointEvaluation;
  /** Points that fell back to a full solve. */
  fallbacks: number;
  /** The fast path's edge, when it runs. */
  edge: FastEdge | null;
}

function pointSource(ctx: SweepContext, entries: EntryTerm[], method: SweepMethod): PointSource {
  const exact = (eps: number, floor: FloorKind) => evaluatePoint(ctx, entries, eps, floor);
  if (method === 'exact') return { point: exact, fallbacks: 0, edge: null };
  const fast = fastFor(ctx);
  const { baseline } = ctx;
  const conditionRaw = baseline.firstOrder ? conditionFloor(baseline.firstOrder.condition, baseline.normF, baseline.n) : NaN;
  const edge = fast.context ? FastEdge.create(baseline, fast.context, entries, ctx.branchSet, exact, conditionRaw) : null;
  if (edge) {
    return {
      point: (eps, floor) => edge.point(eps, floor),
      get fallbacks() {
        return edge.fallbacks;
      },
      edge,
    };
  }
  // The fast path does not apply (network or perturbation): every point is a counted fallback.
  const source: PointSource = {
    point: (eps, floor) => {
      source.fallbacks += 1;
      return exact(eps, floor);
    },
    fallbacks: 0,
    edge: null,
  };
  return source;
}

/**
 * One exact solve at ε. `floor`: 'none' skips the error estimate (budget checks), 'transpose' solves
 * Mᵀ as well, 'condition' uses the baseline's condition number.
 */
function evaluatePoint(ctx: SweepContext, terms: EntryTerm[], eps: number, floor: 'none' | 'transpose' | 'condition'): PointEvaluation {
  const { baseline, branchSet } = ctx;
  const workspace = ctx.workspace();
  const values = workspace.solve(terms, eps);
  const z = zeroIndexOf(values);
  const l = leastRealIndex(values, z);
  const minRe = values.re[l];
  const tie = 1e3 * UNIT_ROUNDOFF * matrixScale(baseline.maxDegree);
  const tracked = followsBranch(values, z, minRe + tie, baseline, branchSet);
  let raw = NaN;
  if (floor !== 'none') {
    if (floor === 'transpose' || !baseline.firstOrder) {
      const other = lambda2Of(workspace.solve(terms, eps, true));
      raw = foldedDistance(values.re[l], values.im[l], other.re, other.im);
    } else {
      raw = conditionFloor((baseline.firstOrder as NonNullable<SpectralBaseline['firstOrder']>).condition, baseline.normF, baseline.n);
    }
  }
  return { re: minRe, tracked, raw };
}

function entryTerms(ctx: SweepContext, terms: PerturbationTerm[], edgeCount: number): EntryTerm[] {
  return terms.map(({ edgeIndex, scale }) => {
    if (!Number.isInteger(edgeIndex) || edgeIndex < 0 || edgeIndex >= edgeCount) {
      throw new SpectralInputError(`edge index ${edgeIndex} is out of range`);
    }
    const { row, col } = ctx.slots[edgeIndex];
    return { row, col, scale };
  });
}

/** The response of λ2 to a weight change along `terms`, on both signs, with its budget. */
export interface PerturbationAudit {
  sensitivity: FirstOrderSensitivity | null;
  plus: SignResponse | null;
  minus: SignResponse | null;
  budget: ToleranceBudget;
  /** Points the fast path handed to a full solve (0 for method 'exact'). */
  fallbacks: number;
}

function mergedOptions(baseline: SpectralBaseline, options?: SpectralOptions) {
  const opts = resolveOptions({ ...baseline.options, ...(options ?? {}) });
  if (opts.convention !== baseline.convention) {
    throw new SpectralInputError('options ask for a different convention than the baseline was built with');
  }
  return opts;
}

/**
 * Audit an arbitrary weight change ε·Σ scale·∂L_e (e.g. both directions of an undirected link).
 * The minus side is cut at half the smallest positive weight involved; with only weight-0 edges
 * involved it is a formal probe and kept whole.
 */
export function auditPerturbation(
  network: SpectralNetwork,
  baseline: SpectralBaseline,
  terms: PerturbationTerm[],
  options?: SpectralOptions,
): PerturbationAudit {
  const opts = mergedOptions(baseline, options);
  const ctx = contextFor(network, baseline);
  if (terms.length === 0) throw new SpectralInputError('a perturbation needs at least one edge');
  const entries = entryTerms(ctx, terms, network.edges.length);
  const weights = terms.map((t) => network.edges[t.edgeIndex].weight);
  const positive = weights.filter((w) => w > 0);
  const weight = positive.length ? Math.min(...positive) : 0;
  const probe = positive.length === 0;
  const ladderScale = baseline.meanWeight > 0 ? baseline.meanWeight : 1;
  const magnitudes = ladderMagnitudes(opts.ladder, ladderScale);
  const floorMinimum = Math.max(baseline.baselineNoise, 4 * UNIT_ROUNDOFF * baseline.normF);
  const floorMode = opts.noiseFloor === 'transpose' || baseline.transposeFloor ? 'transpose' : 'condition';
  const source = pointSource(ctx, entries, opts.method);

  const responses: Partial<Record<SweepSign, SignResponse>> = {};
  const traces: Partial<Record<SweepSign, SignTrace>> = {};
  for (const sign of opts.signs) {
    const { eps, truncated } = signedLadder(magnitudes, sign, weight);
    const evals = eps.map((e) => source.point(e, floorMode));
    const delta = evals.map((p) => p.re - baseline.baselineRe);
    const raw = evals.map((p) => (p.tracked ? p.raw : NaN));
    const floor = robustFloors(raw, opts.floorSafety, floorMinimum);
    const { response, laws } = analyseSign({
      eps,
      delta,
      floor,
      tracked: evals.map((p) => p.tracked),
      truncated,
      probe,
    });
    if (source.edge && (response.class === 'square-root' || response.class === 'cube-root')) {
      // Leading Puiseux coefficient of the reduced problem, beside the fitted prefactor.
      const term = leadingPuiseux(fastFor(ctx).context as FastContext, source.edge.coupling, sign === 'plus' ? 1 : -1);
      if (term && term.coefficient !== 0 && Math.abs(term.exponent - (exponentOfClass(response.class) as number)) < 1e-9) {
        response.puiseux = term.coefficient;
      }
    }
    responses[sign] = response;
    traces[sign] = {
      magnitudes: eps.map(Math.abs),
      absDelta: delta.map(Math.abs),
      laws: laws as ResponseLaws,
      flat: response.class === 'flat',
    };
  }
  const plus = responses.plus ?? null;
  const minus = responses.minus ?? null;
  if (plus && minus && plus.class !== minus.class) {
    plus.flags.push('sign-change');
    minus.flags.push('sign-change');
  }

  const sensitivity = baseline.firstOrder ? sensitivityOf(baseline.firstOrder, entries) : null;
  const budget = toleranceBudget(ctx, source, opts.tolerance, traces, weight, probe, ladderScale);
  return { sensitivity, plus, minus, budget, fallbacks: source.fallbacks };
}

function toleranceBudget(
  ctx: SweepContext,
  source: PointSource,
  tau: number,
  traces: Partial<Record<SweepSign, SignTrace>>,
  weight: number,
  probe: boolean,
  ladderScale: number,
): ToleranceBudget {
  const { baseline } = ctx;
  const allowed = tau * baseline.baselineRe;
  const relative = (eps: number) => (weight > 0 ? eps / weight : null);
  if (!baseline.rooted || !(allowed > 0)) {
    return {
      eps: 0,
      relative: relative(0),
      limitedBy: 'not-rooted',
      predicted: { plus: null, minus: null },
      confirmed: true,
      checks: 0,
      allowedDelta: Math.max(allowed, 0),
    };
  }
  const caps = { plus: Math.max(weight, ladderScale), minus: weight };
  const sides: SweepSign[] = (['plus', 'minus'] as SweepSign[]).filter(
    (s) => traces[s] !== undefined && !(s === 'minus' && probe),
  );
  if (sides.length === 0) sides.push('plus');
  const predicted: { plus: number | null; minus: number | null } = { plus: null, minus: null };
  let candidate = Infinity;
  let limitedBy: BudgetLimit = 'cap';
  for (const s of sides) {
    const trace = traces[s] ?? { magnitudes: [], absDelta: [], laws: { small: null, large: null, sign: 1 }, flat: false };
    const p = predictBudget(trace, allowed, caps[s]);
    predicted[s] = p;
    if (p < candidate) {
      candidate = p;
      limitedBy = p >= caps[s] ? (s === 'minus' ? 'weight' : 'cap') : s;
    }
  }
  let lastFailure: SweepSign | null = null;
  const passes = (eps: number): boolean => {
    for (const s of sides) {
      const signed = s === 'plus' ? eps : -eps;
      const { re } = source.point(signed, 'none');
      // A relative slack of 1e-9 keeps a prediction that lands exactly on the limit from failing by rounding.
      if (!(Math.abs(re - baseline.baselineRe) <= allowed * (1 + 1e-9))) {
        lastFailure = s;
        return false;
      }
    }
    return true;
  };
  // Nudge the prediction just inside the limit: a law that lands exactly on it would otherwise
  // fail the direct check by rounding and cost a bisection.
  const outcome = confirmBudget(candidate * (1 - 1e-6), passes, 1.01);
  if (!outcome.confirmed && lastFailure) limitedBy = lastFailure;
  return {
    eps: outcome.eps,
    relative: relative(outcome.eps),
    limitedBy,
    predicted,
    confirmed: outcome.confirmed,
    checks: outcome.checks,
    allowedDelta: allowed,
  };
}

/** Audit one edge against a baseline (what a worker runs for each edge of its chunk). */
export function auditEdge(
  network: SpectralNetwork,
  baseline: SpectralBaseline,
  edgeIndex: number,
  options?: SpectralOptions,
): EdgeResult {
  const edge = network.edges[edgeIndex];
  if (!edge) throw new SpectralInputError(`edge index ${edgeIndex} is out of range`);
  const result = auditPerturbation(network, baseline, [{ edgeIndex, scale: 1 }], options);
  return {
    index: edgeIndex,
    source: edge.source,
    target: edge.target,
    weight: edge.weight,
    tolerance: result.budget.eps,
    budget: result.budget,
    sensitivity: result.sensitivity,
    plus: result.plus,
    minus: result.minus,
    fallbacks: result.fallbacks,
  };
}

/** Shape the top of an audit document from a baseline and finished edge results. */
export function assembleAudit(baseline: SpectralBaseline, edges: EdgeResult[], edgeCount: number): AuditResult {
  const method = baseline.options.method;
  const fallbackReason = method === 'fast' && baseline.fast && !baseline.fast.ok ? baseline.fast.reason : undefined;
  return {
    convention: baseline.convention,
    tolerance: baseline.options.tolerance,
    ladder: baseline.options.ladder,
    nodeCount: baseline.n,
    edgeCount,
    meanWeight: baseline.meanWeight,
    lambda2: baseline.lambda2,
    rooted: baseline.rooted,
    roots: baseline.roots,
    cutOff: baseline.cutOff,
    cluster: { size: baseline.cluster.size, spread: baseline.cluster.spread, resolved: baseline.cluster.resolved },
    condition: baseline.firstOrder ? baseline.firstOrder.condition : null,
    spectrum: baseline.spectrum,
    edges,
    method,
    fallbacks: edges.reduce((sum, e) => sum + (e.fallbacks ?? 0), 0),
    ...(fallbackReason ? { fallbackReason } : {}),
  };
}

/** Whole-network audit, edge by edge, with progress and cancellation between edges. */
export function auditNetwork(network: SpectralNetwork, options: SpectralOptions = {}, hooks: SweepHooks = {}): AuditResult {
  const baseline = analyseBaseline(network, options);
  const total = network.edges.length;
  const edges: EdgeResult[] = [];
  for (let i = 0; i < total; i++) {
    if (hooks.isCancelled?.()) throw new SweepCancelledError(i, total);
    edges.push(auditEdge(network, baseline, i));
    hooks.onProgress?.(i + 1, total);
  }
  return assembleAudit(baseline, edges, total);
}
