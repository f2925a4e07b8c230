import { listGraphmlEdgeKeys, parseEdgeList, type ImportOptions } from '../../../lib/formats';
import { edgeListOf, fixture, onlyProblem, problemsOf, warningsOf } from './helpers';

const graphml = (text: string, options: Partial<ImportOptions> = {}) =>
  parseEdgeList(text, { format: 'graphml', graphmlWeightKey: 'w', ...options });

/** A small document; line 1 is the <graphml> tag, each node and edge on its own line after the key and graph tags. */
function doc(body: string[], graphAttrs = 'edgedefault="directed"', keys = ['<key id="w" for="edge" attr.name="weight"/>']): string {
  return ['<graphml>', ...keys, `<graph ${graphAttrs}>`, ...body, '</graph>', '</graphml>'].join('\n');
}

describe('GraphML import', () => {
  it('reads a directed graph with the weight key chosen by id', () => {
    const list = edgeListOf(graphml(fixture('pump-ring-directed.graphml'), { graphmlWeightKey: 'd1' }));
    expect(list.nodes).toEqual(['pump-saltmarsh', 'pump-quarry', 'pump-old-mill', 'tank-spare']);
    expect(list.edges).toEqual([
      { source: 'pump-quarry', target: 'pump-saltmarsh', weight: 0.5 },
      { source: 'pump-saltmarsh', target: 'pump-old-mill', weight: 1.25 },
      { source: 'pump-old-mill', target: 'pump-quarry', weight: 0.8 },
    ]);
  });

  it('chooses the weight key by attr.name, and uses the key default where an edge has no value', () => {
    const list = edgeListOf(graphml(fixture('pump-ring-directed.graphml'), { graphmlWeightKey: 'pipe_length' }));
    expect(list.edges.map((e) => e.weight)).toEqual([120, 1, 64.5]);
  });

  it('refuses an undirected graph by default, once, naming the graph and its line', () => {
    const result = graphml(fixture('pump-ring-undirected.graphml'), { graphmlWeightKey: 'd1' });
    expect(problemsOf(result)).toHaveLength(1);
    const p = onlyProblem(result, 'undirected-graph');
    expect(p).toMatchObject({ element: 'graph (id="pump-ring-undirected")', line: 8 });
    expect(p.message).toMatch(/^graph \(id="pump-ring-undirected"\) on line 8: the graph is undirected/);
  });

  it('enters an undirected graph in both directions when asked', () => {
    const result = graphml(fixture('pump-ring-undirected.graphml'), { graphmlWeightKey: 'coupling', undirected: 'both-directions' });
    const list = edgeListOf(result);
    expect(list.edges).toHaveLength(6);
    expect(list.edges.slice(0, 2)).toEqual([
      { source: 'pump-quarry', target: 'pump-saltmarsh', weight: 0.5 },
      { source: 'pump-saltmarsh', target: 'pump-quarry', weight: 0.5 },
    ]);
    expect(warningsOf(result)[0]).toMatchObject({ code: 'entered-both-directions' });
    expect(warningsOf(result)[0].message).toContain('3 undirected edges were each entered in both directions, giving 6 directed edges');
  });

  it('refuses a single directed="false" edge in a directed graph, or mirrors only that edge', () => {
    const body = ['<node id="a"/>', '<node id="b"/>', '<node id="c"/>', '<edge source="a" target="b"><data key="w">1</data></edge>', '<edge id="ab2" source="b" target="c" directed="false"><data key="w">2</data></edge>'];
    const p = onlyProblem(graphml(doc(body)), 'undirected-edge');
    expect(p).toMatchObject({ element: 'edge #2 (id="ab2")', line: 8 });
    const list = edgeListOf(graphml(doc(body), { undirected: 'both-directions' }));
    expect(list.edges.map((e) => `${e.source}>${e.target}`)).toEqual(['a>b', 'b>c', 'c>b']);
  });

  it('tolerates a BOM, CRLF, namespace prefixes and entity-escaped ids', () => {
    const text = `\ufeff<?xml version="1.0"?>\r\n<g:graphml xmlns:g="urn:example:graphml">\r\n<g:key id="w" for="edge"/>\r\n<g:graph edgedefault="directed">\r\n<g:edge source="sluice &amp; gate" target="mast &#x2116;4"><g:data key="w"> 0.25 </g:data></g:edge>\r\n</g:graph></g:graphml>`;
    const list = edgeListOf(graphml(text));
    expect(list.edges).toEqual([{ source: 'sluice & gate', target: 'mast №4', weight: 0.25 }]);
  });

  it('works without a node list: nodes come from the edges', () => {
    const list = edgeListOf(graphml(doc(['<edge source="x" target="y"><data key="w">1</data></edge>'])));
    expect(list.nodes).toEqual(['x', 'y']);
  });
});

describe('GraphML weight key', () => {
  it('asks for a key when none is chosen, listing the edge keys', () => {
    const p = onlyProblem(parseEdgeList(fixture('pump-ring-directed.graphml'), { format: 'graphml' }), 'missing-weight-key');
    expect(p.message).toContain("id 'd1' (attr.name 'coupling'); id 'd2' (attr.name 'pipe_length')");
    expect(p.message).not.toContain('elevation');
  });

  it('refuses a key declared for nodes', () => {
    const p = onlyProblem(graphml(fixture('pump-ring-directed.graphml'), { graphmlWeightKey: 'elevation' }), 'missing-weight-key');
    expect(p.message).toContain('declared for node elements, not edges');
  });

  it('refuses a key that does not exist, while still checking the edges', () => {
    const body = ['<edge source="a" target="a"/>'];
    const result = graphml(doc(body), { graphmlWeightKey: 'gain' });
    expect(problemsOf(result).map((p) => p.code)).toEqual(['missing-weight-key', 'self-loop']);
  });

  it('refuses an ambiguous attr.name', () => {
    const keys = ['<key id="k1" for="edge" attr.name="weight"/>', '<key id="k2" for="all" attr.name="weight"/>'];
    const result = graphml(doc(['<edge source="a" target="b"/>'], undefined, keys), { graphmlWeightKey: 'weight' });
    expect(onlyProblem(result, 'ambiguous-weight-key').message).toContain("choose one of them by its id");
  });

  it('refuses an edge without a value when the key has no default, naming edge and line', () => {
    const body = ['<edge id="e1" source="a" target="b"><data key="w">1</data></edge>', '<edge id="e2" source="b" target="c"/>'];
    const p = onlyProblem(graphml(doc(body)), 'empty-weight');
    expect(p).toMatchObject({ element: 'edge #2 (id="e2")', line: 5 });
    expect(p.message).toMatch(/^edge #2 \(id="e2"\) on line 5: the edge has no <data key="w">/);
  });

  it('names edge and line for a bad weight', () => {
    const body = ['<edge id="e1" source="a" target="b"><data key="w">1</data></edge>', '', '<edge id="e2" source="b" target="c">', '  <data key="w">NaN</data>', '</edge>', '<edge source="c" target="a"><data key="w">1e309</data></edge>'];
    const result = graphml(doc(body));
    expect(onlyProblem(result, 'not-a-number').message).toMatch(/^edge #2 \(id="e2"\) on line 6: weight 'NaN'/);
    expect(onlyProblem(result, 'not-finite')).toMatchObject({ element: 'edge #3', line: 9 });
  });

  it('lists edge keys for the import form', () => {
    const listed = listGraphmlEdgeKeys(fixture('pump-ring-directed.graphml'));
    expect(listed).toEqual({ ok: true, keys: [{ id: 'd1', name: 'coupling', hasDefault: false }, { id: 'd2', name: 'pipe_length', hasDefault: true }] });
  });
});

describe('GraphML structure problems', () => {
  it('refuses a DOCTYPE outright, without expanding anything', () => {
    const text = ['<?xml version="1.0"?>', '<!DOCTYPE graphml [', '  <!ENTITY boom "boomboomboom">', ']>', '<graphml><graph edgedefault="directed"><edge source="&boom;" target="b"/></graph></graphml>'].join('\n');
    const p = onlyProblem(graphml(text), 'entity-declaration');
    expect(p.line).toBe(2);
    expect(p.message).toMatch(/^line 2: the file contains a <!DOCTYPE> declaration/);
  });

  it('refuses an external entity declaration', () => {
    const text = '<graphml>\n<!ENTITY secret SYSTEM "file:///etc/hostname">\n</graphml>';
    expect(onlyProblem(graphml(text), 'entity-declaration').line).toBe(2);
  });

  it('reports an undefined entity reference instead of passing it through', () => {
    const p = onlyProblem(graphml(doc(['<edge source="a&nbsp;" target="b"><data key="w">1</data></edge>'])), 'malformed');
    expect(p.message).toContain("'&nbsp;'");
    expect(p.line).toBe(4);
  });

  it('reports XML that is not well-formed with its line', () => {
    const text = doc(['<node id="a">', '<edge source="a" target="b"/>']);
    const p = onlyProblem(graphml(text), 'malformed');
    expect(p.line).toBe(6);
    expect(p.message).toMatch(/^line 6: the XML is not well-formed here \(.*line 4/);
  });

  it('refuses absurdly deep nesting without exhausting the stack', () => {
    const text = `<graphml>${'<x>'.repeat(20000)}${'</x>'.repeat(20000)}</graphml>`;
    expect(onlyProblem(graphml(text), 'malformed').message).toContain('levels of nesting');
  });

  it('calls XML with another root the wrong format', () => {
    const p = onlyProblem(graphml('<?xml version="1.0"?>\n<svg width="10"><rect/></svg>'), 'wrong-format');
    expect(p.message).toContain('root element is <svg>, not <graphml>');
  });

  it('refuses unknown nodes, duplicate node ids and missing endpoints, each with its element', () => {
    const body = ['<node id="a"/>', '<node id="a"/>', '<node id="b"/>', '<edge source="a" target="ghost"><data key="w">1</data></edge>', '<edge target="b"><data key="w">1</data></edge>'];
    const result = graphml(doc(body));
    expect(onlyProblem(result, 'duplicate-node').message).toMatch(/^node #2 \(id="a"\) on line 5: node 'a' is already declared at node #1 \(id="a"\) on line 4/);
    expect(onlyProblem(result, 'unknown-node')).toMatchObject({ element: 'edge #1', line: 7 });
    expect(onlyProblem(result, 'missing-field')).toMatchObject({ element: 'edge #2', line: 8 });
  });

  it('names both edges of a duplicate', () => {
    const body = ['<edge id="first" source="a" target="b"><data key="w">1</data></edge>', '<edge id="again" source="a" target="b"><data key="w">1</data></edge>'];
    const p = onlyProblem(graphml(doc(body)), 'duplicate-edge');
    expect(p.message).toMatch(/^edge #2 \(id="again"\) on line 5: .*already given at edge #1 \(id="first"\) on line 4/);
  });

  it('refuses files with several graphs, hyperedges or nested graphs', () => {
    const two = '<graphml><graph edgedefault="directed"/>\n<graph edgedefault="directed"/></graphml>';
    expect(onlyProblem(graphml(two), 'unsupported-graphml').line).toBe(2);
    const hyper = doc(['<edge source="a" target="b"><data key="w">1</data></edge>', '<hyperedge><endpoint node="a"/><endpoint node="b"/></hyperedge>']);
    expect(onlyProblem(graphml(hyper), 'unsupported-graphml').message).toContain('hyperedges');
    const nested = doc(['<node id="a"><graph edgedefault="directed"/></node>', '<edge source="a" target="b"><data key="w">1</data></edge>']);
    expect(onlyProblem(graphml(nested), 'unsupported-graphml').message).toContain('nested graph');
  });

  it('warns when edgedefault is missing and reads the edges as directed', () => {
    const result = graphml(doc(['<edge source="a" target="b"><data key="w">1</data></edge>'], 'id="g"'));
    expect(edgeListOf(result).edges).toEqual([{ source: 'a', target: 'b', weight: 1 }]);
    expect(warningsOf(result).map((w) => w.code)).toEqual(['edgedefault-missing']);
  });

  it('calls a graph with no edges empty', () => {
    expect(onlyProblem(graphml(doc(['<node id="a"/>'])), 'empty-file').message).toContain('no <edge> elements');
  });
});
