/**
 * GraphML reader. Node ids are the node names; the weight comes from one
 * <key for="edge"> that the user picks by id or attr.name. Direction is taken
 * seriously: an undirected graph (or edge) is refused unless the caller
 * explicitly chose to enter it in both directions.
 */
import { chooseWeightKey, readKeys, type GraphmlKey } from './graphml-keys';
import { atElement, quote, type ProblemList, type Where } from './problems';
import type { RawEdge, RawImport, RawNode, RawWeight } from './raw';
import { attr, children, decodeXml, elementLine, parseXml, textOf, type XmlElement } from './xml';
import type { LineIndex } from './lines';

export type GraphmlOptions = { weightKey?: string; undirected: 'refuse' | 'both-directions' };

export function readGraphml(text: string, options: GraphmlOptions, problems: ProblemList, warnings: ProblemList): RawImport {
  const parsed = parseXml(text, problems);
  if (!parsed) return { edges: [], fatal: true };
  const { root, doc, lines } = parsed;
  if (root !== 'graphml') {
    problems.report('wrong-format', undefined, `this is an XML file whose root element is <${root}>, not <graphml>; export the network as GraphML, or choose the matching format`);
    return { edges: [], fatal: true };
  }
  const graphml = firstElement(doc.graphml);
  const graphs = children(graphml, 'graph');
  if (graphs.length === 0) {
    problems.report('empty-file', undefined, 'the GraphML file declares no <graph>; export the network itself, not only its keys');
    return { edges: [], fatal: true };
  }
  if (graphs.length > 1) {
    const where = atElement('graph #2', elementLine(graphs[1], lines));
    problems.report('unsupported-graphml', where, `the file holds ${graphs.length} graphs; Hairline imports one network per file, so export each graph separately`);
    return { edges: [], fatal: true };
  }
  const graph = graphs[0];
  const graphWhere = atElement(graphLabel(graph), elementLine(graph, lines));
  const keys = readKeys(graphml);
  const weightKey = chooseWeightKey(keys, options.weightKey, problems);
  const graphUndirected = readEdgeDefault(graph, graphWhere, options, problems, warnings);
  for (const hyper of children(graph, 'hyperedge').slice(0, 1)) {
    problems.report('unsupported-graphml', atElement('hyperedge', elementLine(hyper, lines)), 'the graph uses hyperedges (edges joining more than two nodes); replace each with ordinary edges');
  }
  const nodes = children(graph, 'node').map((node, i) => readNode(node, i, lines, problems));
  const edges = children(graph, 'edge').map((edge, i) => readEdge(edge, i, lines, { weightKey, graphUndirected, options }, problems));
  if (edges.length === 0) {
    problems.report('empty-file', graphWhere, 'the graph has no <edge> elements; a network needs at least one edge');
    return { edges: [], fatal: true };
  }
  // GraphML asks for <node> declarations, but some exporters omit them all; then the edges define the nodes.
  return { edges, nodes: nodes.length > 0 ? nodes : undefined, fatal: false };
}

function firstElement(value: unknown): XmlElement {
  const first = Array.isArray(value) ? value[0] : value;
  return typeof first === 'object' && first !== null ? (first as XmlElement) : {};
}

function graphLabel(graph: XmlElement): string {
  const id = attr(graph, 'id');
  return id === undefined ? 'graph' : `graph (id=${JSON.stringify(id)})`;
}

/** true when edges without their own `directed` attribute are undirected. */
function readEdgeDefault(
  graph: XmlElement,
  where: Where,
  options: GraphmlOptions,
  problems: ProblemList,
  warnings: ProblemList,
): boolean {
  const value = attr(graph, 'edgedefault');
  if (value === undefined) {
    warnings.report('edgedefault-missing', where, 'the graph does not say whether it is directed (no edgedefault); its edges were read as directed, source → target');
    return false;
  }
  if (value === 'directed') return false;
  if (value !== 'undirected') {
    problems.report('malformed', where, `edgedefault is ${quote(value)}; GraphML allows only "directed" or "undirected"`);
    return false;
  }
  if (options.undirected === 'refuse') {
    problems.report(
      'undirected-graph',
      where,
      'the graph is undirected (edgedefault="undirected") and Hairline analyses directed networks. Export it as directed, or choose to enter each undirected edge in both directions',
    );
  }
  return true;
}

function readNode(node: XmlElement, i: number, lines: LineIndex, problems: ProblemList): RawNode {
  const rawId = attr(node, 'id');
  const label = rawId === undefined ? `node #${i + 1}` : `node #${i + 1} (id=${JSON.stringify(rawId)})`;
  const where = atElement(label, elementLine(node, lines));
  if (children(node, 'graph').length > 0) {
    problems.report('unsupported-graphml', where, 'this node contains a nested graph; flatten the network before exporting it');
  }
  if (rawId === undefined) {
    problems.report('missing-field', where, 'the node has no id attribute; every <node> needs one');
    return { where, name: undefined };
  }
  return { where, name: decoded(rawId, where, problems) };
}

type EdgeContext = { weightKey: GraphmlKey | undefined; graphUndirected: boolean; options: GraphmlOptions };

function readEdge(edge: XmlElement, i: number, lines: LineIndex, ctx: EdgeContext, problems: ProblemList): RawEdge {
  const id = attr(edge, 'id');
  const label = id === undefined ? `edge #${i + 1}` : `edge #${i + 1} (id=${JSON.stringify(id)})`;
  const where = atElement(label, elementLine(edge, lines));
  const ends = { source: attr(edge, 'source'), target: attr(edge, 'target') };
  for (const [end, value] of Object.entries(ends)) {
    if (value === undefined) problems.report('missing-field', where, `the edge has no ${end} attribute; every <edge> needs source and target`);
  }
  const directed = attr(edge, 'directed');
  const undirected = directed === 'false' || (directed === undefined && ctx.graphUndirected);
  if (directed !== undefined && directed !== 'true' && directed !== 'false') {
    problems.report('malformed', where, `directed is ${quote(directed)}; GraphML allows only "true" or "false"`);
  } else if (directed === 'false' && !ctx.graphUndirected && ctx.options.undirected === 'refuse') {
    problems.report('undirected-edge', where, 'this edge is marked directed="false" in a directed graph; make it directed, or choose to enter undirected edges in both directions');
  }
  return {
    where,
    source: ends.source === undefined ? undefined : decoded(ends.source, where, problems),
    target: ends.target === undefined ? undefined : decoded(ends.target, where, problems),
    weight: ctx.weightKey ? readWeight(edge, ctx.weightKey, where, problems) : undefined,
    bothWays: undirected && ctx.options.undirected === 'both-directions',
  };
}

function readWeight(edge: XmlElement, key: GraphmlKey, where: Where, problems: ProblemList): RawWeight | undefined {
  const data = children(edge, 'data').filter((d) => attr(d, 'key') === key.id);
  if (data.length > 1) {
    problems.report('malformed', where, `the edge has ${data.length} <data key=${JSON.stringify(key.id)}> values; keep exactly one weight per edge`);
    return undefined;
  }
  if (data.length === 0) {
    if (key.defaultValue !== undefined) return { text: key.defaultValue };
    problems.report('empty-weight', where, `the edge has no <data key=${JSON.stringify(key.id)}> and that key declares no <default>; give every edge a weight`);
    return undefined;
  }
  return { text: decoded(textOf(data[0]), where, problems) };
}

function decoded(raw: string, where: Where, problems: ProblemList): string {
  const { text, unknown } = decodeXml(raw);
  if (unknown !== undefined) {
    problems.report('malformed', where, `the entity reference ${unknown} is not defined in XML; write the character itself or a numeric reference such as &#233;`);
  }
  return text;
}
