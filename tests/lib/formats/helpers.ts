import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ImportProblem, ParseResult } from '../../../lib/formats';

export function fixture(name: string): string {
  return readFileSync(join(__dirname, '../../fixtures/formats', name), 'utf8');
}

export function problemsOf(result: ParseResult): ImportProblem[] {
  if (result.ok) throw new Error(`expected a rejected import, got ${result.edgeList.edges.length} edges`);
  return result.problems;
}

export function edgeListOf(result: ParseResult) {
  if (!result.ok) throw new Error(`expected an accepted import, got:\n${result.problems.map((p) => `${p.code}: ${p.message}`).join('\n')}`);
  return result.edgeList;
}

export function warningsOf(result: ParseResult): ImportProblem[] {
  if (!result.ok) throw new Error('expected an accepted import');
  return result.warnings;
}

export function withCode(result: ParseResult, code: string): ImportProblem[] {
  return problemsOf(result).filter((p) => p.code === code);
}

/** The single problem with this code; fails if there is none or more than one. */
export function onlyProblem(result: ParseResult, code: string): ImportProblem {
  const found = withCode(result, code);
  if (found.length !== 1) {
    throw new Error(`expected one '${code}', found ${found.length} in:\n${problemsOf(result).map((p) => `${p.code}: ${p.message}`).join('\n')}`);
  }
  return found[0];
}

export const csvLines = (...lines: string[]) => `${lines.join('\n')}\n`;
