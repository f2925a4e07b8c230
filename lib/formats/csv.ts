/**
 * CSV and TSV readers. The delimiter follows the chosen format (comma or tab)
 * rather than being guessed, so a file never silently parses one way on one
 * upload and another way on the next. papaparse handles quoting; rows are read
 * one at a time so each keeps the file line it started on, even when a quoted
 * name spans lines.
 */
import Papa from 'papaparse';
import { ROLES, matchHeader, type Role } from './columns';
import { LineIndex } from './lines';
import { atLine, plural, quote, type ProblemList } from './problems';
import type { RawEdge, RawImport } from './raw';
import type { ColumnMapping } from './types';

export type DelimitedResult = RawImport & { columnNames?: Record<Role, string> };

type Row = { fields: string[]; line: number; quoteError?: string };

export function readDelimited(
  text: string,
  delimiter: ',' | '\t',
  mapping: ColumnMapping | undefined,
  bothWays: boolean,
  problems: ProblemList,
): DelimitedResult {
  const rows = splitRows(text, delimiter);
  if (rows.length === 0) {
    problems.report('empty-file', undefined, 'the file holds no rows; export the network with a header line and one edge per line');
    return { edges: [], fatal: true };
  }
  const [headerRow, ...dataRows] = rows;
  if (headerRow.quoteError !== undefined) {
    problems.report('malformed', atLine(headerRow.line), headerRow.quoteError);
    return { edges: [], fatal: true };
  }
  const columns = resolveColumns(headerRow.fields, headerRow.line, delimiter, mapping, problems);
  if (!columns) return { edges: [], fatal: true };
  if (dataRows.length === 0) {
    problems.report('empty-file', atLine(headerRow.line), 'the header is here but no edge rows follow it; add one line per edge');
    return { edges: [], fatal: true };
  }

  const width = headerRow.fields.length;
  const lastNeeded = Math.max(columns.source.index, columns.target.index, columns.weight.index);
  const edges: RawEdge[] = [];
  for (const row of dataRows) {
    const where = atLine(row.line);
    if (row.quoteError !== undefined) {
      problems.report('malformed', where, row.quoteError);
      continue;
    }
    const { fields } = row;
    if (fields.length <= lastNeeded) {
      problems.report(
        'field-count',
        where,
        `the row has ${plural(fields.length, 'field')} but the header has ${width}; a delimiter is missing or the row is cut short`,
      );
      continue;
    }
    // Extra empty trailing cells are harmless (spreadsheets add them); extra content means a shifted row.
    if (fields.length > width && fields.slice(width).some((f) => f.trim() !== '')) {
      problems.report(
        'field-count',
        where,
        `the row has ${plural(fields.length, 'field')} but the header has ${width}; a name that contains ${delimiterName(delimiter)} must be in double quotes`,
      );
      continue;
    }
    edges.push({
      where,
      source: fields[columns.source.index],
      target: fields[columns.target.index],
      weight: { text: fields[columns.weight.index] },
      bothWays,
    });
  }
  return {
    edges,
    fatal: false,
    columnNames: { source: columns.source.name, target: columns.target.name, weight: columns.weight.name },
  };
}

function splitRows(text: string, delimiter: string): Row[] {
  const lines = new LineIndex(text);
  const rows: Row[] = [];
  let rowStart = 0;
  Papa.parse<string[]>(text, {
    delimiter,
    newline: '\n',
    skipEmptyLines: 'greedy',
    dynamicTyping: false,
    step: (result) => {
      // The cursor sits after the row; blank lines skipped before it must not count as its line.
      let first = rowStart;
      while (first < text.length && /\s/.test(text[first])) first += 1;
      const row: Row = { fields: result.data, line: lines.lineAt(first) };
      const quoteProblem = result.errors.find((e) => e.type === 'Quotes');
      if (quoteProblem) row.quoteError = describeQuoteError(quoteProblem.code);
      rows.push(row);
      rowStart = result.meta.cursor;
    },
  });
  return rows;
}

function describeQuoteError(code: string): string {
  if (code === 'MissingQuotes') {
    return 'a double-quoted field starts on this line and is never closed; close it, and write a " inside a name as ""';
  }
  return 'a double quote sits inside an unquoted field; put the whole field in double quotes and write the inner " as ""';
}

type Resolved = Record<Role, { index: number; name: string }>;

function resolveColumns(
  header: string[],
  headerLine: number,
  delimiter: string,
  mapping: ColumnMapping | undefined,
  problems: ProblemList,
): Resolved | undefined {
  const where = atLine(headerLine);
  const shown = header.map((h) => quote(h.trim(), 30)).join(', ');
  const found: Partial<Resolved> = {};
  let failed = false;
  for (const role of ROLES) {
    const match = matchHeader(header, role, mapping);
    if (match.kind === 'found') {
      found[role] = { index: match.index, name: match.name };
    } else if (match.kind === 'repeated') {
      failed = true;
      problems.report(
        'duplicate-column',
        where,
        `the header names ${quote(match.name)} ${match.indexes.length} times (columns ${match.indexes.map((i) => i + 1).join(' and ')}); rename one so the ${role} column is unambiguous`,
        match.name,
      );
    } else {
      failed = true;
      const looked = match.mapped
        ? `the column mapping says the ${role} is in column ${quote(mapping?.[role] ?? '')}, but the header has no such column`
        : `no ${role} column found (looked for ${match.tried.map((t) => quote(t)).join(', ')})`;
      problems.report(
        'missing-column',
        where,
        `${looked}; the header reads ${shown}. Rename the column or choose it in the column mapping${headerLooksLikeData(header, delimiter)}`,
        mapping?.[role] ?? role,
      );
    }
  }
  if (failed) return undefined;
  const resolved = found as Resolved;
  for (const [i, a] of ROLES.entries()) {
    for (const b of ROLES.slice(i + 1)) {
      if (resolved[a].index === resolved[b].index) {
        problems.report('duplicate-column', where, `column ${quote(resolved[a].name)} is chosen as both ${a} and ${b}; each needs its own column`, resolved[a].name);
        failed = true;
      }
    }
  }
  return failed ? undefined : resolved;
}

/** A header whose cells are numbers is most likely the first edge: say so instead of only "missing". */
function headerLooksLikeData(header: string[], delimiter: string): string {
  const numeric = header.some((h) => /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(h.trim()));
  if (!numeric) return '.';
  const line = ['source', 'target', 'weight'].join(delimiter === '\t' ? '<tab>' : delimiter);
  return `. The header line looks like an edge rather than a header: add a first line such as ${line}.`;
}

function delimiterName(delimiter: string): string {
  return delimiter === '\t' ? 'a tab' : 'a comma';
}
