/**
 * Checks shared by every format, run once over the rows the readers produced:
 * names, weights, self-loops, membership in a declared node list, duplicates
 * and size limits. Every row is checked even after a failure so the user gets
 * the whole list in one round trip.
 */
import type { Role } from './columns';
import { checkWeight } from './numbers';
import { plural, problem, quote, type ProblemList, type Where } from './problems';
import type { RawEdge, RawImport } from './raw';
import { MAX_NAME_LENGTH, type Edge, type EdgeList } from './types';

export type ValidateSettings = {
  duplicates: 'refuse' | 'sum';
  maxNodes: number;
  maxEdges: number;
  /** CSV/TSV header names, so problems can name the column. */
  columnNames?: Record<Role, string>;
};

/** Bidirectional embedding, override and isolate controls (not the letters of right-to-left scripts). */
const BIDI_CONTROLS = /[\u202a-\u202e\u2066-\u2069]/;
const BIDI_CONTROLS_ALL = /[\u202a-\u202e\u2066-\u2069]/g;

type Seen = { where: Where; mirrored: boolean; edgeIndex: number; merged: Where[]; weights: number[] };

export function validateRows(raw: RawImport, settings: ValidateSettings, problems: ProblemList, warnings: ProblemList): EdgeList {
  const column = (role: Role) => settings.columnNames?.[role];
  const checkName = (value: string | undefined, where: Where, role: 'source' | 'target' | 'node'): string | undefined => {
    if (value === undefined) return undefined;
    const name = value.trim();
    const col = role === 'node' ? undefined : column(role);
    const what = role === 'node' ? 'the node name' : `the ${role} name`;
    if (name === '') problems.report('empty-name', where, `${what} is empty; every edge needs both end nodes named`, col);
    else if (name.length > MAX_NAME_LENGTH) {
      problems.report('name-too-long', where, `${what} is ${name.length.toLocaleString('en-US')} characters long; names may have at most ${MAX_NAME_LENGTH}`, col);
    } else if (/[\u0000-\u001f\u007f]/.test(name)) {
      problems.report('bad-name', where, `${what} ${quote(name)} contains a line break, tab or other control character; keep names on one line`, col);
    } else if (/\p{Cs}/u.test(name)) {
      // Reachable through JSON escapes (\ud800) and XML references (&#xD800;); stored as UTF-8 it would silently become U+FFFD.
      problems.report('bad-name', where, `${what} ${quote(name.replace(/\p{Cs}/gu, '?'))} contains half of a character (an unpaired UTF-16 surrogate); write the whole character`, col);
    } else if (BIDI_CONTROLS.test(name)) {
      // Right-to-left letters are fine; the invisible overrides that make a name display in another order are not.
      problems.report('bad-name', where, `${what} ${quote(name.replace(BIDI_CONTROLS_ALL, '?'))} contains an invisible text-direction control (U+202A–U+202E or U+2066–U+2069), which makes it display differently from how it is stored; delete it`, col);
    } else return name;
    return undefined;
  };

  // Declared nodes (JSON "nodes", GraphML <node>): their order is the output order, isolated ones included.
  const declared = raw.nodes ? new Map<string, Where>() : undefined;
  let nodeLimitAt: Where | undefined;
  for (const node of raw.nodes ?? []) {
    const name = checkName(node.name, node.where, 'node');
    if (name === undefined || !declared) continue;
    const first = declared.get(name);
    if (first) {
      problems.report('duplicate-node', node.where, `node ${quote(name)} is already declared at ${first.label}; declare each node once`);
      continue;
    }
    declared.set(name, node.where);
    if (declared.size === settings.maxNodes + 1) nodeLimitAt = node.where;
  }

  const order = new Map<string, true>();
  const seen = new Map<string, Seen>();
  const reportedPairs = new Set<string>();
  const edges: Edge[] = [];
  let edgeCount = 0;
  let edgeLimitAt: Where | undefined;
  let mirroredCount = 0;

  for (const row of raw.edges) {
    const { where } = row;
    const source = checkName(row.source, where, 'source');
    const target = checkName(row.target, where, 'target');
    const weight = weightOf(row, where, problems, column('weight'));
    if (source === undefined || target === undefined) continue;
    if (source === target) {
      problems.report('self-loop', where, `the edge ${quote(source)} → ${quote(target)} starts and ends at the same node; a self-loop does not change a Laplacian, so delete the row`);
      continue;
    }
    if (declared) {
      for (const [end, name] of [['source', source], ['target', target]] as const) {
        if (!declared.has(name)) problems.report('unknown-node', where, `the ${end} ${quote(name)} is not in the file's node list; declare it there or fix the spelling`, column(end));
      }
    } else {
      for (const name of [source, target]) {
        order.set(name, true);
        if (order.size === settings.maxNodes + 1 && !nodeLimitAt) nodeLimitAt = where;
      }
    }
    if (row.bothWays) mirroredCount += 1;
    const directions: [string, string][] = row.bothWays ? [[source, target], [target, source]] : [[source, target]];
    for (const [from, to] of directions) {
      edgeCount += 1;
      if (edgeCount === settings.maxEdges + 1) edgeLimitAt = where;
      const key = `${from}\u0000${to}`;
      const earlier = seen.get(key);
      if (!earlier) {
        seen.set(key, { where, mirrored: row.bothWays, edgeIndex: edges.length, merged: [where], weights: weight === undefined ? [] : [weight] });
        edges.push({ source: from, target: to, weight: weight ?? Number.NaN });
        continue;
      }
      if (settings.duplicates === 'sum') {
        earlier.merged.push(where);
        if (weight !== undefined) earlier.weights.push(weight);
        edges[earlier.edgeIndex].weight += weight ?? Number.NaN;
        continue;
      }
      const pair = `${earlier.where.label}\u0000${where.label}`;
      if (reportedPairs.has(pair)) continue; // two undirected rows repeat each other in both directions: say it once
      reportedPairs.add(pair);
      const how = earlier.mirrored ? ' (an undirected link entered in both directions)' : '';
      problems.report(
        'duplicate-edge',
        where,
        `the edge ${quote(from)} → ${quote(to)} is already given at ${earlier.where.label}${how}; keep one of the two, or choose to add up the weights of duplicate edges`,
      );
    }
  }

  const nodes = declared ? [...declared.keys()] : [...order.keys()];
  reportLimits(nodes.length, edgeCount, nodeLimitAt, edgeLimitAt, settings, problems);
  if (settings.duplicates === 'sum') reportSums(seen, edges, warnings);
  if (mirroredCount > 0) {
    warnings.report(
      'entered-both-directions',
      undefined,
      `${plural(mirroredCount, 'undirected edge')} ${mirroredCount === 1 ? 'was' : 'were each'} entered in both directions, giving ${plural(mirroredCount * 2, 'directed edge')}`,
    );
  }
  return { nodes, edges };
}

function weightOf(row: RawEdge, where: Where, problems: ProblemList, column: string | undefined): number | undefined {
  if (row.weight === undefined) return undefined;
  const check = checkWeight(row.weight);
  if (check.ok) return check.value;
  problems.report(check.code, where, check.text, column);
  return undefined;
}

function reportLimits(
  nodeCount: number,
  edgeCount: number,
  nodeAt: Where | undefined,
  edgeAt: Where | undefined,
  settings: ValidateSettings,
  problems: ProblemList,
): void {
  // Added at the front: with a huge file these matter more than the 200th bad weight.
  if (edgeCount > settings.maxEdges && edgeAt) {
    problems.addFirst(problem('too-many-edges', edgeAt, `the network has ${plural(edgeCount, 'edge')}, more than the limit of ${settings.maxEdges.toLocaleString('en-US')}; this is where the limit is passed. Import a smaller network or ask for a higher limit`));
  }
  if (nodeCount > settings.maxNodes && nodeAt) {
    problems.addFirst(problem('too-many-nodes', nodeAt, `the network has ${plural(nodeCount, 'node')}, more than the limit of ${settings.maxNodes.toLocaleString('en-US')}; node ${(settings.maxNodes + 1).toLocaleString('en-US')} first appears here. Import a smaller network or ask for a higher limit`));
  }
}

function reportSums(seen: Map<string, Seen>, edges: Edge[], warnings: ProblemList): void {
  for (const entry of seen.values()) {
    if (entry.merged.length < 2) continue;
    const edge = edges[entry.edgeIndex];
    const places = entry.merged.map((w) => w.label);
    const listed = places.length === 2 ? places.join(' and ') : `${places.slice(0, -1).join(', ')} and ${places[places.length - 1]}`;
    // The message lists every place itself, so it is not prefixed with the first one.
    const warning = problem(
      'duplicates-summed',
      undefined,
      `the edge ${quote(edge.source)} → ${quote(edge.target)} appears at ${listed}; their weights were added to ${edge.weight}`,
    );
    if (entry.where.line !== undefined) warning.line = entry.where.line;
    if (entry.where.element !== undefined) warning.element = entry.where.element;
    warnings.add(warning);
  }
}
