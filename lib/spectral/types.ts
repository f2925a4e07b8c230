/**
 * Shared shapes of the spectral engine.
 *
 * Everything a caller receives from this library is plain data (numbers, strings, arrays and
 * object literals): it survives `structuredClone`, `postMessage` to a worker thread and
 * `JSON.stringify` unchanged. Class instances and functions never leave the engine.
 */

/** A directed weighted network as the engine consumes it. Edges refer to nodes by name. */
export interface SpectralEdge {
  source: string;
  target: string;
  /** Non-negative, finite. A weight of 0 is a "probe": an absent link whose response we measure. */
  weight: number;
}

export interface SpectralNetwork {
  nodes: string[];
  edges: SpectralEdge[];
}

/**
 * Which endpoint of an edge listens.
 * - `in`  (default): `source → target` means the target listens to the source; row `target` of the
 *   Laplacian holds what the target receives.
 * - `out`: the same with source and target exchanged (the source listens to the target).
 */
export type Convention = 'in' | 'out';

/** Exponents t of the ladder ε = ±w̄·10^(−t). */
export interface LadderSpec {
  from: number;
  to: number;
  step: number;
}

export type SweepSign = 'plus' | 'minus';

/**
 * How the per-point solver error is estimated.
 * - `transpose`: solve the perturbed matrix and its transpose, compare the two λ2 values.
 * - `auto` (default): do that only where the baseline says it is needed (a λ2 cluster, or an
 *   ill-conditioned λ2); elsewhere estimate the error from the eigenvalue condition number.
 */
export type NoiseFloorMode = 'auto' | 'transpose';

/**
 * How ladder points and budget checks are computed.
 * - `fast` (default): the rank-one reduction of lib/spectral/fast — exact eigenvalues of the λ2
 *   cluster from a small reduced problem, with direct (brute-force) solves only where a guard asks.
 * - `exact`: a full eigen-solve of the perturbed Laplacian at every point.
 */
export type SweepMethod = 'fast' | 'exact';

export interface SpectralOptions {
  convention?: Convention;
  ladder?: LadderSpec;
  signs?: SweepSign[];
  /** τ: the tolerated change of Re λ2, relative to Re λ2. Default 0.01. */
  tolerance?: number;
  /**
   * Eigenvalues closer than clusterTolerance·w̄ to λ2 always count as its cluster (on top of the
   * ones whose distance is explained by rounding of a defective eigenvalue). Default 1e-6.
   */
  clusterTolerance?: number;
  noiseFloor?: NoiseFloorMode;
  /** Safety factor on the robust noise floor. Default 10. */
  floorSafety?: number;
  /** Default 'fast'. */
  method?: SweepMethod;
}

export interface ResolvedOptions {
  convention: Convention;
  ladder: LadderSpec;
  signs: SweepSign[];
  tolerance: number;
  clusterTolerance: number;
  noiseFloor: NoiseFloorMode;
  floorSafety: number;
  method: SweepMethod;
}

export interface Complex {
  re: number;
  im: number;
}

/** The eigenvalues near λ2 that behave as one (degenerate, defective, or nearly so). */
export interface ClusterInfo {
  /** How many eigenvalues (conjugates of a complex λ2 not counted). */
  size: number;
  /** Largest distance between two members. */
  spread: number;
  /** Spectrum indices of the members. */
  members: number[];
  /**
   * True when the members are genuinely distinct (the transposed solve reproduces them), false
   * when their separation is rounding of a repeated eigenvalue. Decides the baseline value.
   */
  resolved: boolean;
}

export interface FirstOrderData {
  /** Right eigenvector x of λ2 (L x = λ2 x), split in real and imaginary parts. */
  right: { re: number[]; im: number[] };
  /** Vector z with Lᵀ z = λ2 z, so that the left eigenvector is y = conj(z) and yᴴ = zᵀ. */
  left: { re: number[]; im: number[] };
  /** zᵀ x. */
  pairing: Complex;
  /** 1/|cos∠(x, y)| = ‖x‖‖y‖/|yᴴ x|. */
  condition: number;
}

export interface Reachability {
  /** True when some node reaches every node along the direction information flows. */
  rooted: boolean;
  /** Nodes that reach every node (empty when not rooted). */
  roots: string[];
  /**
   * Nodes not reached from the best-connected leader group (empty when rooted). With no root,
   * 0 is a repeated eigenvalue and these nodes never hear the rest.
   */
  cutOff: string[];
  /** Groups of nodes that listen to nobody outside their group (strong components with no inflow). */
  leaderGroups: string[][];
}

/** Everything a sweep needs about the unperturbed network. Plain data; clone it to workers. */
export interface SpectralBaseline extends Reachability {
  convention: Convention;
  nodes: string[];
  n: number;
  /** Dense Laplacian, row-major, length n². */
  laplacian: number[];
  /** Frobenius norm of the Laplacian. */
  normF: number;
  /** Largest weighted degree on the diagonal (a scale for the rounding radius of clusters). */
  maxDegree: number;
  /** Mean weight over edges with positive weight (0 if none). Sets the ladder scale. */
  meanWeight: number;
  spectrum: Complex[];
  /** Index in `spectrum` of the zero eigenvalue set aside. */
  zeroIndex: number;
  /** Index in `spectrum` of the computed eigenvalue of least real part (imag ≥ 0 among a pair). */
  lambda2Index: number;
  /** λ2 as reported (the cluster mean when the cluster is rounding-split; exactly 0 if not rooted). */
  lambda2: Complex;
  /** The reference value of Re λ2 that every Δ(ε) is measured from. */
  baselineRe: number;
  /** Estimated error of `baselineRe` (difference between the L and Lᵀ computations). */
  baselineNoise: number;
  cluster: ClusterInfo;
  /**
   * Baseline spectrum indices that count as branches of λ2 when tracking identity: the cluster,
   * its conjugates, and eigenvalues whose real part ties with Re λ2.
   */
  branches: number[];
  /** First-order data when λ2 is simple; null otherwise. */
  firstOrder: FirstOrderData | null;
  /** Whether sweeps solve the transposed matrix for the noise floor. */
  transposeFloor: boolean;
  options: ResolvedOptions;
  /**
   * Per-network data of the fast sweep (block-diagonal Schur form; see lib/spectral/README.md).
   * Absent when the baseline was built with method 'exact'; `ok: false` when the fast path does not
   * apply to this network (every point is then computed by full solves and counted as a fallback).
   */
  fast?: FastSpectralData;
}

/** One diagonal block of the block-diagonal Schur form L = V·diag(B₁, …)·V⁻¹. */
export interface FastItem {
  /** First column of the item in V (and first row of V⁻¹). */
  start: number;
  size: number;
  /** `core`: the λ2 cluster; `real`/`pair`: one real eigenvalue or one conjugate pair; `block`: a group of close eigenvalues. */
  kind: 'core' | 'real' | 'pair' | 'block';
  /** The block B, row-major size×size. */
  block: number[];
  /** Its eigenvalues, re and im interleaved (length 2·size). */
  values: number[];
  /** Index in the baseline spectrum of each of those eigenvalues. */
  spectrumIndex: number[];
  /** For `pair`: right (e) and left (f) eigenvectors of B for the eigenvalue with im > 0, fᵀe = 1; (re, im) interleaved. */
  pairVectors?: { e: number[]; f: number[] };
}

export interface FastSpectralData {
  /** Content key (hash of the Laplacian and the core choice): workers cache their working form by it. */
  key: string;
  ok: boolean;
  /** Why the fast path does not apply (when ok is false). */
  reason?: string;
  n: number;
  /** Right basis V, row-major n×n. */
  v: number[];
  /** Left basis V⁻¹, transposed, row-major n×n: wt[r·n + k] = (V⁻¹)[k][r]. */
  wt: number[];
  /** items[0] is the λ2 cluster (the "core"). */
  items: FastItem[];
  /** Item holding the zero eigenvalue. */
  zeroItem: number;
  core: {
    /** Eigenvalues in the core (conjugates counted). */
    size: number;
    /** Centre and radius of the core, conjugates identified. */
    centre: Complex;
    radius: number;
    /** Distance from the centre to the nearest eigenvalue outside the core (zero set aside); null if none. */
    gap: number | null;
    /**
     * Rounding at ε = 0, which anchors the fast path's noise floor: the spread of λ2 between the
     * baseline's solves of L and Lᵀ, and the radius of the cluster's eigenvalues in the Schur form.
     */
    rawAtZero: number;
    clusterRadius: number;
    /** ‖P² − P‖_F of the core's spectral projector P, and ‖LX − XA‖_F of its basis. */
    projectorDefect: number;
    invarianceResidual: number;
    /** The first `clusterSize` eigenvalues of the core are the baseline's rounding-split cluster (0 if none). */
    clusterSize: number;
    /**
     * Solution R₁ of A_c R₁ − R₁ A_o = −A_x inside the core block [[A_c, A_x], [0, A_o]] (cluster
     * first), row-major clusterSize × (size − clusterSize); null when not needed or not available.
     */
    clusterCoupling: number[] | null;
  };
}

export type ResponseClass = 'linear' | 'square-root' | 'cube-root' | 'quadratic' | 'flat' | 'other';

/**
 * - `crossover`: the local exponent drifts along the ladder (e.g. 1 at small ε toward 1/2 at large ε).
 * - `low-signal`: fewer than three consecutive points stand above the noise floor.
 * - `identity-change`: at some points another eigenvalue took over the least real part; they were dropped.
 * - `sign-change`: the law differs between +ε and −ε (different class on the other sign).
 * - `mixed-sign`: Δ changes sign inside the fitted run.
 * - `truncated`: points with |ε| > w/2 were left out on the minus side.
 * - `probe`: the edge has weight 0 (an absent link); the minus side is a formal, negative-weight probe.
 */
export type ResponseFlag =
  | 'crossover'
  | 'low-signal'
  | 'identity-change'
  | 'sign-change'
  | 'mixed-sign'
  | 'truncated'
  | 'probe';

/** One point of the ladder. Numbers only, to keep results compact. */
export interface LadderPoint {
  /** Signed weight change ε. */
  eps: number;
  /** Δ(ε) = Re λ2(perturbed) − baseline Re λ2, from an exact solve. */
  delta: number;
  /** Robust noise floor at this point (already multiplied by the safety factor). */
  floor: number;
  /** 1 when the point is part of the fitted run, else 0. */
  used: 0 | 1;
  /** 1 when the least-real-part eigenvalue is still a branch of the λ2 cluster, 0 when it was overtaken. */
  tracked: 0 | 1;
}

export interface SignResponse {
  class: ResponseClass;
  /** Least-squares slope of log|Δ| on log|ε| over the fitted run (null if fewer than 2 points). */
  exponent: number | null;
  /** Signed c in Δ ≈ c|ε|^p (negative: Re λ2 drops). Null for flat or empty. */
  prefactor: number | null;
  flags: ResponseFlag[];
  /** Slope over the three smallest |ε| of the run. */
  slopeSmall: number | null;
  /** Slope over the three largest |ε| of the run. */
  slopeLarge: number | null;
  /** |ε| where the small-ε and large-ε laws meet, when a crossover is flagged. */
  crossoverEps: number | null;
  /** Largest point floor on this sign. */
  noiseFloor: number;
  points: LadderPoint[];
  /**
   * Fast path, root-type classes only: the leading Puiseux coefficient c of Δ ≈ c|ε|^p predicted by
   * the reduced problem of the λ2 cluster (to set beside `prefactor`). Absent otherwise.
   */
  puiseux?: number;
}

export interface FirstOrderSensitivity {
  /** dλ2/dw, real part (the rate that matters for convergence). */
  re: number;
  im: number;
  /** Eigenvalue condition number 1/|cos∠(x, y)|. */
  condition: number;
}

export type BudgetLimit = 'plus' | 'minus' | 'weight' | 'cap' | 'not-rooted';

export interface ToleranceBudget {
  /** Largest |ε| (weight units) keeping |Δ| ≤ τ·Re λ2 on both signs, confirmed by a direct solve. */
  eps: number;
  /** eps / weight (null for a weight-0 probe). */
  relative: number | null;
  /** What set the budget. */
  limitedBy: BudgetLimit;
  /** Per-sign predictions from the measured points and fitted laws (null: sign not used). */
  predicted: { plus: number | null; minus: number | null };
  /** True if the first prediction passed the direct check; false if it had to be bisected down. */
  confirmed: boolean;
  /** Number of direct solves spent on confirmation. */
  checks: number;
  /** The allowed |Δ| (τ·Re λ2). */
  allowedDelta: number;
}

export interface EdgeResult {
  index: number;
  source: string;
  target: string;
  weight: number;
  /** Weight tolerance = budget.eps. */
  tolerance: number;
  budget: ToleranceBudget;
  sensitivity: FirstOrderSensitivity | null;
  plus: SignResponse | null;
  minus: SignResponse | null;
  /** Points (ladder and budget checks) that the fast path handed to a full eigen-solve. 0 for method 'exact'. */
  fallbacks?: number;
}

export interface ClusterSummary {
  size: number;
  spread: number;
}

export interface AuditResult {
  convention: Convention;
  tolerance: number;
  ladder: LadderSpec;
  nodeCount: number;
  edgeCount: number;
  meanWeight: number;
  lambda2: Complex;
  rooted: boolean;
  roots: string[];
  cutOff: string[];
  cluster: ClusterSummary & { resolved: boolean };
  condition: number | null;
  spectrum: Complex[];
  edges: EdgeResult[];
  /** How the points were computed. */
  method?: SweepMethod;
  /** Sum of the edges' fallbacks. */
  fallbacks?: number;
  /** Why the fast path did not apply to this network at all (every point then fell back). */
  fallbackReason?: string;
}

/** What the import step shows before any sweep: one eigen-solve. */
export interface NetworkSummary {
  nodeCount: number;
  edgeCount: number;
  weightRange: { min: number; max: number } | null;
  meanWeight: number;
  rooted: boolean;
  roots: string[];
  cutOff: string[];
  leaderGroups: string[][];
  lambda2: Complex;
  cluster: ClusterSummary;
  spectrum: Complex[];
}

export interface SweepHooks {
  onProgress?(done: number, total: number): void;
  isCancelled?(): boolean;
}

/** A weight change along several edges at once (used for paired, undirected changes). */
export interface PerturbationTerm {
  edgeIndex: number;
  /** Multiplier of ε for this edge. */
  scale: number;
}
