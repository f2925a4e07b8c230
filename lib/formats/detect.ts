/**
 * Guessing a file's format, and noticing when a file is not what it claims.
 * Content beats the file name: names are often wrong (a ".csv" saved by a
 * spreadsheet as a workbook), while the first bytes rarely are.
 */
import { normaliseText } from './lines';
import { problem } from './problems';
import type { ImportFormat, ImportProblem } from './types';

export type ContentKind = ImportFormat | 'xml' | 'binary' | 'semicolon' | 'unknown';

export type Detection = {
  /** Best guess to preselect in the import form; undefined when nothing fits. */
  format: ImportFormat | undefined;
  byName: ImportFormat | undefined;
  byContent: ContentKind;
  /** The file name says one format and the content another. */
  mismatch: boolean;
};

const EXTENSIONS: Record<string, ImportFormat> = { csv: 'csv', tsv: 'tsv', tab: 'tsv', json: 'json', graphml: 'graphml', xml: 'graphml' };

const LABEL: Record<ContentKind, string> = {
  csv: 'CSV (comma-separated)',
  tsv: 'TSV (tab-separated)',
  json: 'JSON',
  graphml: 'GraphML',
  xml: 'XML',
  binary: 'a binary file (a spreadsheet workbook, archive or PDF)',
  semicolon: 'text separated by semicolons',
  unknown: 'plain text',
};

export function formatFromName(fileName: string | undefined): ImportFormat | undefined {
  const ext = /\.([A-Za-z]+)$/.exec(fileName?.trim() ?? '')?.[1]?.toLowerCase();
  return ext === undefined ? undefined : EXTENSIONS[ext];
}

export function sniffContent(text: string): ContentKind {
  const head = normaliseText(text.slice(0, 65536));
  if (head.includes('\u0000') || head.startsWith('PK\u0003\u0004') || head.startsWith('%PDF')) return 'binary';
  const start = head.trimStart();
  if (start.startsWith('<')) return /<(?:[\w.-]+:)?graphml[\s>/]/.test(head) ? 'graphml' : 'xml';
  if (start.startsWith('{') || start.startsWith('[')) return 'json';
  const firstLine = start.split('\n', 1)[0] ?? '';
  // Delimiters inside quoted names do not count.
  const bare = firstLine.replace(/"(?:[^"]|"")*"/g, '');
  const tabs = bare.split('\t').length - 1;
  const commas = bare.split(',').length - 1;
  if (tabs > 0 && tabs >= commas) return 'tsv';
  if (commas > 0) return 'csv';
  if (bare.includes(';')) return 'semicolon';
  return 'unknown';
}

export function detectFormat(text: string, fileName?: string): Detection {
  const byName = formatFromName(fileName);
  const byContent = sniffContent(text);
  const contentFormat = isImportFormat(byContent) ? byContent : undefined;
  return {
    format: contentFormat ?? (byContent === 'xml' ? 'graphml' : byName),
    byName,
    byContent,
    mismatch: byName !== undefined && contentFormat !== undefined && contentFormat !== byName,
  };
}

/**
 * A `wrong-format` problem when the content clearly is not the chosen format.
 * Left alone: XML with another root (the GraphML reader names the root) and
 * content too plain to tell (the reader's own checks say what is missing).
 */
export function checkClaimedFormat(format: ImportFormat, text: string): ImportProblem | undefined {
  const kind = sniffContent(text);
  const claimed = LABEL[format];
  const wrong = (advice: string) => problem('wrong-format', undefined, `this file looks like ${LABEL[kind]}, not ${claimed}; ${advice}`);
  if (kind === 'binary') return wrong(`save or export it as ${claimed} and import that file`);
  if (kind === format || kind === 'unknown') return undefined;
  if (format === 'graphml' && kind === 'xml') return undefined;
  if (kind === 'semicolon') {
    if (format === 'tsv') return wrong('export it again with tabs between the columns');
    return wrong('export it again as CSV with commas between the columns (many spreadsheets offer this under CSV options)');
  }
  if (kind === 'xml') return wrong('export the network as CSV, TSV, JSON or GraphML');
  return wrong(`choose ${LABEL[kind]} as the format`);
}

function isImportFormat(kind: ContentKind): kind is ImportFormat {
  return kind === 'csv' || kind === 'tsv' || kind === 'json' || kind === 'graphml';
}
