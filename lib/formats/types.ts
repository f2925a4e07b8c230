/**
 * Public types of the edge-list import layer. Everything here is pure data:
 * the server and the spectral engine depend on these shapes, so change them
 * only together with their callers.
 */

export type ImportFormat = 'csv' | 'tsv' | 'json' | 'graphml';

export const IMPORT_FORMATS: readonly ImportFormat[] = ['csv', 'tsv', 'json', 'graphml'];

export type ColumnMapping = { source?: string; target?: string; weight?: string };

export type ImportOptions = {
  format: ImportFormat;
  /** CSV/TSV header names, or JSON edge keys, when they differ from the defaults. */
  columns?: ColumnMapping;
  /** GraphML only: the id or attr.name of the edge key that holds the weight. */
  graphmlWeightKey?: string;
  /**
   * 'refuse' (default): an undirected GraphML graph or edge is an error.
   * 'both-directions': every undirected edge becomes two directed edges.
   * For CSV/TSV/JSON, which carry no direction flag, 'both-directions'
   * declares every row an undirected link and enters it both ways.
   */
  undirected?: 'refuse' | 'both-directions';
  /** 'refuse' (default): a repeated source→target pair is an error. 'sum': weights are added. */
  duplicates?: 'refuse' | 'sum';
  limits?: { maxNodes?: number; maxEdges?: number };
};

export type Edge = { source: string; target: string; weight: number };

export type EdgeList = { nodes: string[]; edges: Edge[] };

export type ImportProblem = {
  /** Stable machine code, one of PROBLEM_CODES (kept as string so callers may add their own). */
  code: string;
  /** A sentence a person can act on; it starts with the place it refers to. */
  message: string;
  /** 1-based line in the file (CSV/TSV header is line 1; GraphML where known). */
  line?: number;
  /** Element path: `edges[3]`, `nodes[0]` for JSON, `edge #4 (id="e4")` for GraphML. */
  element?: string;
  /** Header name of the column concerned (CSV/TSV). */
  column?: string;
};

export type ParseResult =
  | { ok: true; edgeList: EdgeList; warnings: ImportProblem[] }
  | { ok: false; problems: ImportProblem[] };

export const PROBLEM_CODES = [
  // whole file
  'invalid-options',
  'empty-file',
  'wrong-format',
  'malformed',
  'bad-structure',
  'entity-declaration',
  'unsupported-graphml',
  'undirected-graph',
  'undirected-edge',
  'missing-weight-key',
  'ambiguous-weight-key',
  'missing-column',
  'duplicate-column',
  // one row / element
  'field-count',
  'missing-field',
  'empty-name',
  'bad-name',
  'name-too-long',
  'empty-weight',
  'not-a-number',
  'not-finite',
  'weight-not-positive',
  'weight-out-of-range',
  'self-loop',
  'duplicate-edge',
  'duplicate-node',
  'unknown-node',
  // limits and the cap on the list itself
  'too-many-nodes',
  'too-many-edges',
  'too-many-problems',
  // warnings (ParseResult.ok === true)
  'duplicates-summed',
  'entered-both-directions',
  'edgedefault-missing',
] as const;

export type ProblemCode = (typeof PROBLEM_CODES)[number];

export const DEFAULT_LIMITS = { maxNodes: 2000, maxEdges: 20000 } as const;

/**
 * Accepted weight magnitudes. Far beyond any physical coupling on both sides, and well inside the
 * range where the eigen-solver's squares of matrix entries stay finite and normal in double precision:
 * weights near 1e308 or 1e-300 made it return NaN or never finish.
 */
export const WEIGHT_RANGE = { min: 1e-100, max: 1e100 } as const;

/** Longest node name accepted, in UTF-16 code units. Long enough for any real label, short enough to draw. */
export const MAX_NAME_LENGTH = 200;

/** How many problems a result lists before it folds the rest into one `too-many-problems` entry. */
export const PROBLEM_LIST_CAP = 200;
