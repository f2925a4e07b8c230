/**
 * Collecting problems without stopping at the first, and without letting a
 * 20,000-line file of mistakes produce 20,000 entries: only the first
 * PROBLEM_LIST_CAP (by line) are listed, the rest are counted and summarised.
 */
import { PROBLEM_LIST_CAP, type ImportProblem, type ProblemCode } from './types';

/** Where a row or element sits in the file, and how to say so in a message. */
export type Where = { line?: number; element?: string; label: string };

export function atLine(line: number): Where {
  return { line, label: `line ${line}` };
}

export function atElement(element: string, line?: number): Where {
  return line === undefined ? { element, label: element } : { element, line, label: `${element} on line ${line}` };
}

/** A part of an element, at the same place: `edges[3]` → `edges[3].source`. */
export function within(where: Where, part: string): Where {
  return atElement(`${where.element ?? where.label}.${part}`, where.line);
}

export function problem(code: ProblemCode, where: Where | undefined, text: string, column?: string): ImportProblem {
  const p: ImportProblem = { code, message: where ? `${where.label}: ${text}` : capitalise(text) };
  if (where?.line !== undefined) p.line = where.line;
  if (where?.element !== undefined) p.element = where.element;
  if (column !== undefined) p.column = column;
  return p;
}

/**
 * Problems come from two passes (the format reader, then the shared checks),
 * so they are ordered by line when listed. Memory stays bounded: once the
 * list holds several times the cap, it is sorted and trimmed to the cap.
 */
export class ProblemList {
  private entries: { key: number; seq: number; problem: ImportProblem }[] = [];
  private dropped = 0;
  private seq = 0;

  constructor(private readonly cap: number = PROBLEM_LIST_CAP) {}

  /** Problems without a line (whole-file ones) sort before all lines. */
  add(p: ImportProblem, key: number = p.line ?? 0): void {
    this.entries.push({ key, seq: this.seq++, problem: p });
    if (this.entries.length >= this.cap * 4) this.trim();
  }

  /** For the few problems (limits) that matter more than their place in the file. */
  addFirst(p: ImportProblem): void {
    this.add(p, -1);
  }

  report(code: ProblemCode, where: Where | undefined, text: string, column?: string): void {
    this.add(problem(code, where, text, column));
  }

  get size(): number {
    return this.entries.length + this.dropped;
  }

  /** The first problems in file order, plus one closing entry that says how many were left out. */
  list(noun = 'problems'): ImportProblem[] {
    this.trim();
    const kept = this.entries.map((e) => e.problem);
    if (this.dropped === 0) return kept;
    return [
      ...kept,
      {
        code: 'too-many-problems',
        message: `…and ${this.dropped.toLocaleString('en-US')} more ${noun} not listed here. Fix the ones above and import again to see the rest.`,
      },
    ];
  }

  private trim(): void {
    this.entries.sort((a, b) => a.key - b.key || a.seq - b.seq);
    if (this.entries.length > this.cap) {
      this.dropped += this.entries.length - this.cap;
      this.entries.length = this.cap;
    }
  }
}

/** Quote a user value for a message, shortened so a 10 kB cell cannot flood the error list. */
export function quote(value: string, max = 40): string {
  const shown = value.length > max ? `${value.slice(0, max)}…` : value;
  return `'${shown.replace(/[\u0000-\u001f\u007f]/g, '?')}'`;
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
