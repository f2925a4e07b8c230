/**
 * Edge-list import: text in, a validated EdgeList or the full list of problems
 * out. Pure: no file system, no network, no clock, so the server, a worker or
 * a test can call it alike. A rejected import returns no partial network.
 */
import { readDelimited } from './csv';
import { checkClaimedFormat } from './detect';
import { readGraphml } from './graphml';
import { readJson } from './json';
import { normaliseText } from './lines';
import { importOptionsSchema, resolveOptions, type ResolvedOptions } from './options';
import { ProblemList } from './problems';
import type { RawImport } from './raw';
import type { ImportOptions, ImportProblem, ParseResult } from './types';
import { validateRows } from './validate';
import type { Role } from './columns';

export function parseEdgeList(text: string, options: ImportOptions): ParseResult {
  const checked = importOptionsSchema.safeParse(options);
  if (!checked.success) {
    const problems: ImportProblem[] = checked.error.issues.map((issue) => ({
      code: 'invalid-options',
      message: `Import option ${issue.path.join('.') || '(options)'}: ${issue.message}`,
    }));
    return { ok: false, problems };
  }
  const settings = resolveOptions(checked.data);
  const body = normaliseText(typeof text === 'string' ? text : '');
  if (body.trim() === '') {
    return { ok: false, problems: [{ code: 'empty-file', message: 'The file is empty; choose the exported network file, or paste its contents' }] };
  }
  const wrongFormat = checkClaimedFormat(settings.format, body);
  if (wrongFormat) return { ok: false, problems: [wrongFormat] };

  const problems = new ProblemList();
  const warnings = new ProblemList();
  const raw = read(body, settings, problems, warnings);
  if (raw.fatal) return { ok: false, problems: problems.list() };
  const edgeList = validateRows(
    raw,
    { duplicates: settings.duplicates, maxNodes: settings.maxNodes, maxEdges: settings.maxEdges, columnNames: raw.columnNames },
    problems,
    warnings,
  );
  if (problems.size > 0) return { ok: false, problems: problems.list() };
  return { ok: true, edgeList, warnings: warnings.list('warnings') };
}

function read(
  body: string,
  settings: ResolvedOptions,
  problems: ProblemList,
  warnings: ProblemList,
): RawImport & { columnNames?: Record<Role, string> } {
  const bothWays = settings.undirected === 'both-directions';
  switch (settings.format) {
    case 'csv':
      return readDelimited(body, ',', settings.columns, bothWays, problems);
    case 'tsv':
      return readDelimited(body, '\t', settings.columns, bothWays, problems);
    case 'json':
      return readJson(body, settings.columns, bothWays, problems);
    case 'graphml':
      return readGraphml(body, { weightKey: settings.graphmlWeightKey, undirected: settings.undirected }, problems, warnings);
  }
}

export { importOptionsSchema, LIMIT_CEILING } from './options';
export { detectFormat, checkClaimedFormat, formatFromName, sniffContent, type Detection, type ContentKind } from './detect';
export { COLUMN_SYNONYMS } from './columns';
export { listGraphmlEdgeKeys } from './graphml-inspect';
export {
  DEFAULT_LIMITS,
  IMPORT_FORMATS,
  MAX_NAME_LENGTH,
  PROBLEM_CODES,
  PROBLEM_LIST_CAP,
  WEIGHT_RANGE,
  type ColumnMapping,
  type Edge,
  type EdgeList,
  type ImportFormat,
  type ImportOptions,
  type ImportProblem,
  type ParseResult,
  type ProblemCode,
} from './types';
