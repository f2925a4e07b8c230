import { parseEdgeList } from '../../../lib/formats';
import { edgeListOf, fixture, onlyProblem, problemsOf } from './helpers';

const json = (doc: unknown, extra = {}) => parseEdgeList(JSON.stringify(doc, null, 2), { format: 'json', ...extra });

describe('JSON import', () => {
  it('reads a node list of strings and { id } objects, keeping its order and isolated nodes', () => {
    const list = edgeListOf(parseEdgeList(fixture('pump-ring.json'), { format: 'json' }));
    expect(list.nodes).toEqual(['pump-saltmarsh', 'pump-quarry', 'pump-old-mill', 'tank-spare']);
    expect(list.edges).toEqual([
      { source: 'pump-quarry', target: 'pump-saltmarsh', weight: 0.5 },
      { source: 'pump-saltmarsh', target: 'pump-old-mill', weight: 1.25 },
      { source: 'pump-old-mill', target: 'pump-quarry', weight: 0.8 },
    ]);
  });

  it('orders nodes by first appearance without a node list, and accepts numbered nodes', () => {
    const list = edgeListOf(json({ edges: [{ source: 7, target: 3, weight: 1 }, { source: 3, target: 'gate', weight: 2 }] }));
    expect(list.nodes).toEqual(['7', '3', 'gate']);
  });

  it('tolerates a BOM and maps edge keys', () => {
    const text = `\ufeff${JSON.stringify({ edges: [{ up: 'a', down: 'b', k: 0.1 }] })}`;
    const list = edgeListOf(parseEdgeList(text, { format: 'json', columns: { source: 'up', target: 'down', weight: 'k' } }));
    expect(list.edges).toEqual([{ source: 'a', target: 'b', weight: 0.1 }]);
  });

  it('names the edge index for weight problems', () => {
    const result = json({ edges: [{ source: 'a', target: 'b', weight: 1 }, { source: 'b', target: 'c', weight: 'abc' }, { source: 'c', target: 'a', weight: -3 }] });
    expect(onlyProblem(result, 'not-a-number')).toMatchObject({ element: 'edges[1]', line: 8 });
    expect(onlyProblem(result, 'not-a-number').message).toMatch(/^edges\[1\] on line 8: weight 'abc' is not a number/);
    expect(onlyProblem(result, 'weight-not-positive').message).toMatch(/^edges\[2\] on line 13: weight '-3' is negative/);
  });

  it('catches 1e309, which JSON.parse turns into Infinity', () => {
    const text = '{ "edges": [ { "source": "a", "target": "b", "weight": 1e309 } ] }';
    const p = onlyProblem(parseEdgeList(text, { format: 'json' }), 'not-finite');
    expect(p.element).toBe('edges[0]');
    expect(p.message).toContain('overflows to infinity');
  });

  it('refuses null, booleans and objects as weights', () => {
    const result = json({ edges: [{ source: 'a', target: 'b', weight: null }, { source: 'b', target: 'c', weight: true }] });
    expect(onlyProblem(result, 'empty-weight').element).toBe('edges[0]');
    expect(onlyProblem(result, 'not-a-number').message).toMatch(/^edges\[1\] on line 8: weight must be a number such as 0.75, found boolean true/);
  });

  it('reports a missing field with the keys the edge does have', () => {
    const p = onlyProblem(json({ edges: [{ source: 'a', target: 'b', w8: 1 }] }), 'missing-field');
    expect(p.message).toMatch(/^edges\[0\] on line 3: no 'weight' field \(it has 'source', 'target', 'w8'\)/);
  });

  it('reports a name that is not text or a number by its path', () => {
    const p = onlyProblem(json({ edges: [{ source: ['a'], target: 'b', weight: 1 }] }), 'bad-name');
    expect(p.element).toBe('edges[0].source');
  });

  it('refuses an edge whose end is not in the node list', () => {
    const p = onlyProblem(json({ nodes: ['a', 'b'], edges: [{ source: 'a', target: 'b', weight: 1 }, { source: 'b', target: 'pump-x', weight: 1 }] }), 'unknown-node');
    expect(p.element).toBe('edges[1]');
    expect(p.message).toMatch(/^edges\[1\] on line 12: the target 'pump-x' is not in the file's node list/);
  });

  it('refuses a node declared twice, naming both entries', () => {
    const p = onlyProblem(json({ nodes: ['a', { id: 'b' }, 'b'], edges: [{ source: 'a', target: 'b', weight: 1 }] }), 'duplicate-node');
    expect(p.message).toMatch(/^nodes\[2\] on line 7: node 'b' is already declared at nodes\[1\] on line 4/);
  });

  it('counts a node list against the node limit', () => {
    const p = onlyProblem(json({ nodes: ['a', 'b', 'c', 'd'], edges: [{ source: 'a', target: 'b', weight: 1 }] }, { limits: { maxNodes: 3 } }), 'too-many-nodes');
    expect(p.element).toBe('nodes[3]');
  });

  it('names the duplicate edge entries', () => {
    const p = onlyProblem(json({ edges: [{ source: 'a', target: 'b', weight: 1 }, { source: 'a', target: 'b', weight: 2 }] }), 'duplicate-edge');
    expect(p.message).toMatch(/^edges\[1\] on line 8: .*already given at edges\[0\] on line 3/);
  });

  it('reports a syntax error with the line it is on', () => {
    const text = '{\n  "edges": [\n    { "source": "a" "target": "b", "weight": 1 }\n  ]\n}\n';
    const p = onlyProblem(parseEdgeList(text, { format: 'json' }), 'malformed');
    expect(p.line).toBe(3);
    expect(p.message).toMatch(/^line 3: the JSON syntax breaks here/);
  });

  it('finds the line of a trailing comma, whatever the engine says', () => {
    const text = '{\n  "edges": [\n    { "source": "a", "target": "b", "weight": 1 },\n  ]\n}\n';
    expect(onlyProblem(parseEdgeList(text, { format: 'json' }), 'malformed').line).toBe(4);
  });

  it('names the line of a single edge in a compact file', () => {
    const text = '{"edges":[\n{"source":"a","target":"b","weight":1},\n{"source":"b","target":"b","weight":1}]}';
    expect(onlyProblem(parseEdgeList(text, { format: 'json' }), 'self-loop')).toMatchObject({ element: 'edges[1]', line: 3 });
  });

  it.each([
    [[{ source: 'a', target: 'b', weight: 1 }], /bare list/],
    [{ links: [] }, /^There is no "edges" list \(its top-level keys are 'links'\)/],
    [{ edges: { a: 1 } }, /"edges" is an object, not a list/],
  ])('refuses the wrong shape %#', (doc, message) => {
    const p = onlyProblem(json(doc), 'bad-structure');
    expect(p.message).toMatch(message);
  });

  it('calls an empty edge list an empty file', () => {
    expect(onlyProblem(json({ edges: [] }), 'empty-file').element).toBe('edges');
  });

  it('reports edge problems even when the node list itself is broken', () => {
    const result = json({ nodes: 'a,b', edges: [{ source: 'a', target: 'a', weight: 1 }] });
    expect(problemsOf(result).map((p) => p.code)).toEqual(['bad-structure', 'self-loop']);
  });
});
