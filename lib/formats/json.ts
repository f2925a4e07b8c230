/**
 * JSON reader: { "edges": [{ "source", "target", "weight" }], "nodes"?: [...] }.
 * JSON.parse keeps no positions, so rows are named by their path (edges[3]);
 * only a syntax error, whose offset the engine reports, gets a line number.
 */
import { ROLES, matchKey, type Role } from './columns';
import { scanJson } from './json-scan';
import { LineIndex } from './lines';
import { atElement, atLine, quote, within, type ProblemList, type Where } from './problems';
import type { RawEdge, RawImport, RawNode, RawWeight } from './raw';
import type { ColumnMapping } from './types';

export function readJson(
  text: string,
  mapping: ColumnMapping | undefined,
  bothWays: boolean,
  problems: ProblemList,
): RawImport {
  const lines = new LineIndex(text);
  const scan = scanJson(text);
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch {
    reportSyntax(scan.errorAt === undefined ? undefined : lines.lineAt(scan.errorAt), problems);
    return { edges: [], fatal: true };
  }
  const at = (path: string) => {
    const offset = scan.offsets.get(path);
    return atElement(path, offset === undefined ? undefined : lines.lineAt(offset));
  };
  if (Array.isArray(doc)) {
    problems.report('bad-structure', undefined, 'the file is a bare list; wrap it as { "edges": [ … ] } so Hairline knows the list holds edges');
    return { edges: [], fatal: true };
  }
  if (!isObject(doc)) {
    problems.report('bad-structure', undefined, `the file holds ${describe(doc)}, not an object with an "edges" list`);
    return { edges: [], fatal: true };
  }
  if (!Array.isArray(doc.edges)) {
    const keys = Object.keys(doc);
    const has = keys.length ? `its top-level keys are ${keys.slice(0, 8).map((k) => quote(k)).join(', ')}` : 'the object is empty';
    const why = 'edges' in doc ? `"edges" is ${describe(doc.edges)}, not a list` : `there is no "edges" list (${has})`;
    problems.report('bad-structure', undefined, `${why}; write the edges as "edges": [{ "source": …, "target": …, "weight": … }]`);
    return { edges: [], fatal: true };
  }
  if (doc.edges.length === 0) {
    problems.report('empty-file', atElement('edges'), 'the list is empty; add one object per edge');
    return { edges: [], fatal: true };
  }
  // A broken node list is reported but does not stop the edge checks: the user sees both at once.
  const nodes = doc.nodes === undefined || doc.nodes === null ? undefined : (readNodes(doc.nodes, at, problems) ?? undefined);
  const edges = doc.edges.map((item, i) => readEdge(item, at(`edges[${i}]`), mapping, bothWays, problems));
  return { edges: edges.filter((e): e is RawEdge => e !== undefined), nodes, fatal: false };
}

function readEdge(
  item: unknown,
  where: Where,
  mapping: ColumnMapping | undefined,
  bothWays: boolean,
  problems: ProblemList,
): RawEdge | undefined {
  if (!isObject(item)) {
    problems.report('bad-structure', where, `expected an object such as { "source": "a", "target": "b", "weight": 1 }, found ${describe(item)}`);
    return undefined;
  }
  const keys = Object.keys(item);
  const found: Partial<Record<Role, unknown>> = {};
  let missing = false;
  for (const role of ROLES) {
    const key = matchKey(keys, role, mapping);
    if (key === undefined) {
      missing = true;
      const wanted = mapping?.[role] ?? role;
      const has = keys.length ? `it has ${keys.slice(0, 8).map((k) => quote(k)).join(', ')}` : 'it is empty';
      problems.report('missing-field', where, `no ${quote(wanted)} field (${has}); every edge needs source, target and weight`);
    } else {
      found[role] = item[key];
    }
  }
  if (missing) return undefined;
  return {
    where,
    source: readName(found.source, within(where, 'source'), problems),
    target: readName(found.target, within(where, 'target'), problems),
    weight: readWeight(found.weight, where, problems),
    bothWays,
  };
}

/** Names may be written as text or as numbers (many tools number their nodes). */
function readName(value: unknown, where: Where, problems: ProblemList): string | undefined {
  if (typeof value === 'string') return value;
  if (typeof value === 'number' && Number.isFinite(value)) return String(value);
  problems.report('bad-name', where, `a node name must be text or a number, found ${describe(value)}`);
  return undefined;
}

function readWeight(value: unknown, where: Where, problems: ProblemList): RawWeight | undefined {
  if (typeof value === 'number') return { value };
  if (typeof value === 'string') return { text: value };
  if (value === null) return { text: '' };
  problems.report('not-a-number', where, `weight must be a number such as 0.75, found ${describe(value)}`);
  return undefined;
}

/** Returns null when "nodes" is not a list (already reported). */
function readNodes(value: unknown, at: (path: string) => Where, problems: ProblemList): RawNode[] | null {
  if (!Array.isArray(value)) {
    problems.report('bad-structure', atElement('nodes'), `expected a list of node names, found ${describe(value)}`);
    return null;
  }
  return value.map((item, i): RawNode => {
    const where = at(`nodes[${i}]`);
    if (isObject(item)) {
      if (!('id' in item)) {
        problems.report('missing-field', where, 'a node object needs an "id", as in { "id": "pump-3" }');
        return { where, name: undefined };
      }
      return { where, name: readName(item.id, within(where, 'id'), problems) };
    }
    return { where, name: readName(item, where, problems) };
  });
}

function reportSyntax(line: number | undefined, problems: ProblemList): void {
  const advice = 'check for a missing comma, quote or bracket, or a trailing comma, which JSON does not allow';
  if (line === undefined) problems.report('malformed', undefined, `the JSON cannot be read; ${advice}`);
  else problems.report('malformed', atLine(line), `the JSON syntax breaks here; ${advice}`);
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'an object';
  if (typeof value === 'string') return `the text ${quote(value)}`;
  return `${typeof value} ${String(value)}`;
}
