/**
 * Collecting problems without stopping at the first, and without letting a
 * 20,000-line file of mistakes produce 20,000 entries: only the first
 * PROBLEM_LIST_CAP are kept, the rest are counted and summarised.
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

export class ProblemList {
  private kept: ImportProblem[] = [];
  private dropped = 0;

  constructor(private readonly cap: number = PROBLEM_LIST_CAP) {}

  add(p: ImportProblem): void {
    if (this.kept.length < this.cap) this.kept.push(p);
    else this.dropped += 1;
  }

  /** For the few problems (limits) that matter more than their place in the file. */
  addFirst(p: ImportProblem): void {
    this.kept.unshift(p);
    if (this.kept.length > this.cap) {
      this.kept.pop();
      this.dropped += 1;
    }
  }

  report(code: ProblemCode, where: Where | undefined, text: string, column?: string): void {
    this.add(problem(code, where, text, column));
  }

  get size(): number {
    return this.kept.length + this.dropped;
  }

  /** The kept problems, plus one closing entry that says how many were left out. */
  list(noun = 'problems'): ImportProblem[] {
    if (this.dropped === 0) return [...this.kept];
    return [
      ...this.kept,
      {
        code: 'too-many-problems',
        message: `…and ${this.dropped} more ${noun} not listed here. Fix the ones above and import again to see the rest.`,
      },
    ];
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
