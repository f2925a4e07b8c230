/**
 * The largest network the default limits allow (2,000 nodes, 20,000 edges)
 * must import in every format well within a request's time. The bound is
 * loose on purpose (a slow CI machine must not fail it); the point is to catch
 * an accidental quadratic step, which would take minutes at this size.
 */
import { parseEdgeList, type ImportFormat } from '../../../lib/formats';
import { edgeListOf } from './helpers';

const NODES = 2000;
const EDGES = 20000;

/** Deterministic invented network: mast-i sends to the ten masts after it around a ring. */
function edges(): [string, string, number][] {
  const out: [string, string, number][] = [];
  for (let i = 0; out.length < EDGES; i += 1) {
    const from = i % NODES;
    const step = 1 + Math.floor(i / NODES);
    out.push([`mast-${from}`, `mast-${(from + step) % NODES}`, 0.5 + ((i * 37) % 100) / 100]);
  }
  return out;
}

function write(format: ImportFormat): string {
  const rows = edges();
  if (format === 'csv') return ['source,target,weight', ...rows.map((r) => r.join(','))].join('\r\n');
  if (format === 'tsv') return ['source\ttarget\tweight', ...rows.map((r) => r.join('\t'))].join('\n');
  if (format === 'json') return JSON.stringify({ edges: rows.map(([source, target, weight]) => ({ source, target, weight })) }, null, 1);
  return [
    '<graphml><key id="w" for="edge" attr.name="weight"/><graph edgedefault="directed">',
    ...Array.from({ length: NODES }, (_, i) => `<node id="mast-${i}"/>`),
    ...rows.map(([s, t, w], i) => `<edge id="e${i}" source="${s}" target="${t}"><data key="w">${w}</data></edge>`),
    '</graph></graphml>',
  ].join('\n');
}

describe('a network at the default limits', () => {
  it.each(['csv', 'tsv', 'json', 'graphml'] as const)('%s imports 2,000 nodes and 20,000 edges', (format) => {
    const text = write(format);
    const started = performance.now();
    const list = edgeListOf(parseEdgeList(text, { format, graphmlWeightKey: 'weight' }));
    const ms = performance.now() - started;
    expect(list.nodes).toHaveLength(NODES);
    expect(list.edges).toHaveLength(EDGES);
    expect(ms).toBeLessThan(8000);
  });

  it('one more edge is refused, and the problem names the line of edge 20,001', () => {
    const text = `${write('csv')}\r\nmast-0,mast-1999,1`;
    const result = parseEdgeList(text, { format: 'csv' });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0]).toMatchObject({ code: 'too-many-edges', line: EDGES + 2 });
  });
});
