/**
 * Round-trip properties over the whole range of what the parsers accept:
 * names drawn from all of Unicode (quotes, delimiters, markup characters,
 * emoji, right-to-left letters), weights across the accepted range 1e-100 …
 * 1e100 written in several spellings, declared node lists with isolated
 * nodes, optional quoting, CRLF and byte-order marks. The writers here are
 * written from the format definitions (RFC 4180 quoting for CSV, XML 1.0
 * escaping for GraphML), not with the parsers' own libraries.
 * properties.test.ts covers the narrower alphabet and the robustness side.
 */
import fc from 'fast-check';
import { MAX_NAME_LENGTH, WEIGHT_RANGE, parseEdgeList, type Edge, type ImportFormat } from '../../../lib/formats';

const CONTROL = /[\u0000-\u001f\u007f]/;
const DIRECTION_CONTROL = /[\u202a-\u202e\u2066-\u2069]/;
/** XML 1.0 forbids these characters even as references. */
const NOT_XML = /[\ufffe\uffff]/;

/** Any name the rules accept: trimmed, non-empty, at most 200 code units, no control characters. */
const name = fc
  .string({ unit: fc.oneof(fc.constantFrom(',', '"', '\t', ' ', '<', '>', '&', "'", ';', '=', '\u05d0', '\u0627', '🛟'), fc.string({ unit: 'grapheme', minLength: 1, maxLength: 1 })), minLength: 1, maxLength: 24 })
  .map((s) => s.trim())
  .filter((s) => s.length > 0 && s.length <= MAX_NAME_LENGTH && !CONTROL.test(s) && !DIRECTION_CONTROL.test(s) && !NOT_XML.test(s) && !/\p{Cs}/u.test(s));

const weight = fc.double({ min: WEIGHT_RANGE.min, max: WEIGHT_RANGE.max, noNaN: true, noDefaultInfinity: true });
/** Ways a spreadsheet or script may spell the same number; each reads back as exactly the same double. */
const spelling = fc.constantFrom(
  (w: number) => String(w),
  (w: number) => w.toExponential(),
  (w: number) => w.toPrecision(17),
  (w: number) => ` ${String(w)} `,
);

type Network = { nodes: string[]; edges: Edge[] };

/** Distinct nodes, some of them isolated, and distinct source→target pairs between them. */
const network: fc.Arbitrary<Network> = fc
  .uniqueArray(name, { minLength: 2, maxLength: 10 })
  .chain((nodes) =>
    fc
      .uniqueArray(fc.tuple(fc.nat(nodes.length - 1), fc.nat(nodes.length - 1), weight), {
        minLength: 1,
        maxLength: 30,
        selector: ([s, t]) => `${s}:${t}`,
      })
      .map((rows) => rows.filter(([s, t]) => s !== t).map(([s, t, w]): Edge => ({ source: nodes[s], target: nodes[t], weight: w })))
      .filter((edges) => edges.length > 0)
      .map((edges) => ({ nodes, edges })),
  );

type Style = { crlf: boolean; bom: boolean; quoteAll: boolean; spell: (w: number) => string };
const style: fc.Arbitrary<Style> = fc.record({ crlf: fc.boolean(), bom: fc.boolean(), quoteAll: fc.boolean(), spell: spelling });

/** RFC 4180: a field holding the delimiter, a quote or a line break is quoted, inner quotes doubled. */
function field(value: string, delimiter: string, quoteAll: boolean): string {
  const needs = value.includes(delimiter) || value.includes('"') || /[\r\n]/.test(value) || value !== value.trim();
  return needs || quoteAll ? `"${value.replace(/"/g, '""')}"` : value;
}

const escapeXml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');

function write(net: Network, format: ImportFormat, s: Style): string {
  const nl = s.crlf ? '\r\n' : '\n';
  const bom = s.bom ? '\ufeff' : '';
  switch (format) {
    case 'csv':
    case 'tsv': {
      const d = format === 'csv' ? ',' : '\t';
      const rows = net.edges.map((e) => [field(e.source, d, s.quoteAll), field(e.target, d, s.quoteAll), s.spell(e.weight)].join(d));
      return bom + ['source', 'target', 'weight'].join(d) + nl + rows.join(nl) + nl;
    }
    case 'json': {
      const body = { nodes: net.nodes, edges: net.edges.map((e) => ({ source: e.source, target: e.target, weight: s.quoteAll ? s.spell(e.weight).trim() : e.weight })) };
      return bom + JSON.stringify(body, null, s.crlf ? 2 : 0).replace(/\n/g, nl);
    }
    case 'graphml':
      return (
        bom +
        [
          '<?xml version="1.0" encoding="UTF-8"?>',
          '<graphml xmlns="http://graphml.graphdrawing.org/xmlns">',
          '  <key id="k0" for="edge" attr.name="coupling" attr.type="double"/>',
          '  <graph id="G" edgedefault="directed">',
          ...net.nodes.map((n) => `    <node id="${escapeXml(n)}"/>`),
          ...net.edges.map((e, i) => `    <edge id="e${i}" source="${escapeXml(e.source)}" target="${escapeXml(e.target)}"><data key="k0">${s.spell(e.weight)}</data></edge>`),
          '  </graph>',
          '</graphml>',
        ].join(nl)
      );
  }
}

/** CSV and TSV carry no node list: nodes come back in order of first appearance, isolated ones gone. */
function expectedNodes(net: Network, format: ImportFormat): string[] {
  if (format === 'json' || format === 'graphml') return net.nodes;
  return [...new Set(net.edges.flatMap((e) => [e.source, e.target]))];
}

describe('round trip over the full accepted range (fast-check)', () => {
  it.each(['csv', 'tsv', 'json', 'graphml'] as const)('%s: any accepted network, written out, reads back exactly', (format) => {
    fc.assert(
      fc.property(network, style, (net, s) => {
        const result = parseEdgeList(write(net, format, s), { format, graphmlWeightKey: 'coupling' });
        if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
        expect(result.warnings).toEqual([]);
        expect(result.edgeList.edges).toEqual(net.edges);
        expect(result.edgeList.nodes).toEqual(expectedNodes(net, format));
      }),
      { numRuns: 150 },
    );
  });

  it('duplicates: "sum" adds the weights of a row written twice, in file order', () => {
    fc.assert(
      fc.property(network, fc.array(weight, { minLength: 1, maxLength: 30 }), style, (net, extra, s) => {
        const doubled = net.edges.map((e, i) => ({ ...e, weight: Math.min(extra[i % extra.length], WEIGHT_RANGE.max) }));
        const text = write({ nodes: net.nodes, edges: [...net.edges, ...doubled] }, 'csv', s);
        const result = parseEdgeList(text, { format: 'csv', duplicates: 'sum' });
        if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
        expect(result.edgeList.edges).toEqual(net.edges.map((e, i) => ({ ...e, weight: e.weight + doubled[i].weight })));
        expect(result.warnings.map((w) => w.code)).toEqual(net.edges.map(() => 'duplicates-summed'));
      }),
      { numRuns: 60 },
    );
  });

  it('undirected: "both-directions" enters each row once each way and nothing else', () => {
    // One row per unordered pair, so the mirrored edges never collide.
    const oneWay = network.map((net) => {
      const seen = new Set<string>();
      const edges = net.edges.filter((e) => {
        const key = [e.source, e.target].sort().join('\u0000');
        return seen.has(key) ? false : (seen.add(key), true);
      });
      return { ...net, edges };
    });
    fc.assert(
      fc.property(oneWay, style, (net, s) => {
        const result = parseEdgeList(write(net, 'tsv', s), { format: 'tsv', undirected: 'both-directions' });
        if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
        expect(result.edgeList.edges).toEqual(net.edges.flatMap((e) => [e, { source: e.target, target: e.source, weight: e.weight }]));
      }),
      { numRuns: 60 },
    );
  });
});
