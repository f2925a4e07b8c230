/**
 * Which header column (or JSON key) holds the source, target and weight.
 * Without a mapping, each role is looked up by a short list of names that
 * design tools commonly write, in priority order; matching ignores case and
 * surrounding spaces. A mapping given by the user replaces the list for that role.
 */
import type { ColumnMapping } from './types';

export type Role = 'source' | 'target' | 'weight';
export const ROLES: readonly Role[] = ['source', 'target', 'weight'];

export const COLUMN_SYNONYMS: Readonly<Record<Role, readonly string[]>> = {
  source: ['source', 'from', 'src', 'tail', 'sender', 'origin'],
  target: ['target', 'to', 'dst', 'dest', 'destination', 'head', 'receiver'],
  weight: ['weight', 'w', 'value', 'gain'],
};

export const normaliseHeader = (name: string): string => name.trim().toLowerCase();

/** The names to try for a role: the user's mapping if given, else the synonyms. */
export function candidatesFor(role: Role, mapping: ColumnMapping | undefined): string[] {
  const chosen = mapping?.[role];
  return chosen !== undefined ? [normaliseHeader(chosen)] : [...COLUMN_SYNONYMS[role]];
}

export type HeaderMatch =
  | { kind: 'found'; index: number; name: string }
  | { kind: 'missing'; tried: string[]; mapped: boolean }
  | { kind: 'repeated'; name: string; indexes: number[] };

/** Find a role's column in a header row. */
export function matchHeader(header: string[], role: Role, mapping: ColumnMapping | undefined): HeaderMatch {
  const normalised = header.map(normaliseHeader);
  const tried = candidatesFor(role, mapping);
  for (const name of tried) {
    const indexes = normalised.flatMap((h, i) => (h === name ? [i] : []));
    if (indexes.length === 1) return { kind: 'found', index: indexes[0], name: header[indexes[0]].trim() };
    if (indexes.length > 1) return { kind: 'repeated', name: header[indexes[0]].trim(), indexes };
  }
  return { kind: 'missing', tried, mapped: mapping?.[role] !== undefined };
}

/** Find a role's key in one JSON edge object: exact key first, then case-insensitive. */
export function matchKey(keys: string[], role: Role, mapping: ColumnMapping | undefined): string | undefined {
  for (const name of candidatesFor(role, mapping)) {
    const exact = keys.find((k) => k === name || (mapping?.[role] !== undefined && k === mapping[role]));
    if (exact !== undefined) return exact;
    const loose = keys.find((k) => normaliseHeader(k) === name);
    if (loose !== undefined) return loose;
  }
  return undefined;
}
