/**
 * Command-line audit of one network file.
 *
 *   npm run -s audit -- FILE.csv [--convention in|out] [--tolerance 0.01]
 *
 * Reads a CSV edge list (header `source,target,weight`), runs the full two-sign sweep of every
 * edge and prints one JSON document (the AuditResult of lib/spectral) on stdout. Any problem —
 * bad arguments, unreadable file, invalid rows, a network the engine cannot analyse — ends with a
 * non-zero exit status and exactly one line on stderr that names the file (and line, when known).
 */
import { readFileSync } from 'node:fs';
import { parseEdgeList } from '@/lib/formats';
import { auditNetwork, SpectralInputError, type Convention } from '@/lib/spectral';

const USAGE = 'usage: npm run -s audit -- FILE.csv [--convention in|out] [--tolerance 0.01]';

interface Arguments {
  file: string;
  convention: Convention;
  tolerance: number;
}

class UsageError extends Error {}

function parseArguments(argv: string[]): Arguments {
  let file: string | undefined;
  let convention: Convention = 'in';
  let tolerance = 0.01;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    const [flag, inline] = arg.startsWith('--') && arg.includes('=') ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)] : [arg, undefined];
    const value = (): string => {
      const v = inline ?? argv[++i];
      if (v === undefined) throw new UsageError(`${flag} needs a value`);
      return v;
    };
    if (flag === '--convention') {
      const v = value();
      if (v !== 'in' && v !== 'out') throw new UsageError(`--convention must be "in" or "out", not "${v}"`);
      convention = v;
    } else if (flag === '--tolerance') {
      const v = value();
      const t = Number(v);
      if (!Number.isFinite(t) || t <= 0 || t >= 1) throw new UsageError(`--tolerance must be a number between 0 and 1, not "${v}"`);
      tolerance = t;
    } else if (flag === '--help' || flag === '-h') {
      throw new UsageError('');
    } else if (flag.startsWith('-')) {
      throw new UsageError(`unknown option ${flag}`);
    } else if (file === undefined) {
      file = arg;
    } else {
      throw new UsageError(`only one file can be audited at a time (got "${file}" and "${arg}")`);
    }
  }
  if (file === undefined) throw new UsageError('no file given');
  return { file, convention, tolerance };
}

/** One line, whatever the message holds. */
function oneLine(text: string): string {
  return text.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}

function fail(message: string, status: number): never {
  process.stderr.write(`${oneLine(message)}\n`);
  process.exit(status);
}

function main(): void {
  let args: Arguments;
  try {
    args = parseArguments(process.argv.slice(2));
  } catch (error) {
    if (error instanceof UsageError) fail(error.message ? `audit: ${error.message}; ${USAGE}` : USAGE, 2);
    throw error;
  }
  const { file } = args;

  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'read error';
    fail(`${file}: cannot read the file (${code})`, 1);
  }

  const parsed = parseEdgeList(text, { format: 'csv' });
  if (!parsed.ok) {
    const [first, ...rest] = parsed.problems;
    const place = first?.line !== undefined ? `${file}:${first.line}` : file;
    const message = (first?.message ?? 'the file could not be read as an edge list').replace(/^line \d+:\s*/i, '');
    const more = rest.length ? ` (and ${rest.length} more problem${rest.length === 1 ? '' : 's'})` : '';
    fail(`${place}: ${message}${more}`, 1);
  }

  try {
    const result = auditNetwork(parsed.edgeList, { convention: args.convention, tolerance: args.tolerance });
    process.stdout.write(`${JSON.stringify(result)}\n`);
  } catch (error) {
    if (error instanceof SpectralInputError) fail(`${file}: ${error.message}`, 1);
    fail(`${file}: audit failed: ${(error as Error).message}`, 1);
  }
}

main();
