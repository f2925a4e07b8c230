/**
 * Property tests: any valid network written out in any of the four formats
 * reads back as the same network; and no input, however broken, makes the
 * parser throw or return an unlisted code.
 */
import fc from 'fast-check';
import { PROBLEM_CODES, PROBLEM_LIST_CAP, parseEdgeList, type Edge, type ImportFormat } from '../../../lib/formats';
// Internal, imported directly: JSON line numbers rest on the scanner agreeing with the engine.
import { scanJson } from '../../../lib/formats/json-scan';

const name = fc.stringMatching(/^[a-z][a-z0-9 _.-]{0,15}[a-z0-9]$/);
const weight = fc.double({ min: 1e-9, max: 1e9, noNaN: true, noDefaultInfinity: true });

const network = fc
  .uniqueArray(fc.tuple(name, name, weight), { minLength: 1, maxLength: 40, selector: ([s, t]) => `${s}\u0000${t}` })
  .map((rows) => rows.filter(([s, t]) => s !== t).map(([source, target, w]): Edge => ({ source, target, weight: w })))
  .filter((edges) => edges.length > 0);

const escapeXml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/"/g, '&quot;');

function write(edges: Edge[], format: ImportFormat, crlf: boolean): string {
  const nl = crlf ? '\r\n' : '\n';
  switch (format) {
    case 'csv':
      return `\ufeffsource,target,weight${nl}${edges.map((e) => `"${e.source}","${e.target}",${e.weight}`).join(nl)}${nl}`;
    case 'tsv':
      return `source\ttarget\tweight${nl}${edges.map((e) => `${e.source}\t${e.target}\t${e.weight}`).join(nl)}`;
    case 'json':
      return JSON.stringify({ edges }, null, crlf ? 2 : 0);
    case 'graphml':
      return [
        '<?xml version="1.0" encoding="UTF-8"?>',
        '<graphml><key id="k" for="edge" attr.name="weight"/><graph edgedefault="directed">',
        ...edges.map((e) => `<edge source="${escapeXml(e.source)}" target="${escapeXml(e.target)}"><data key="k">${e.weight}</data></edge>`),
        '</graph></graphml>',
      ].join(nl);
  }
}

describe('round trip', () => {
  it.each(['csv', 'tsv', 'json', 'graphml'] as const)('%s: a written network reads back unchanged', (format) => {
    fc.assert(
      fc.property(network, fc.boolean(), (edges, crlf) => {
        const result = parseEdgeList(write(edges, format, crlf), { format, graphmlWeightKey: 'weight' });
        if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
        expect(result.edgeList.edges).toEqual(edges.map((e) => ({ ...e, source: e.source.trim(), target: e.target.trim() })));
        const firstSeen = [...new Set(edges.flatMap((e) => [e.source, e.target]))];
        expect(result.edgeList.nodes).toEqual(firstSeen);
      }),
      { numRuns: 60 },
    );
  });
});

describe('robustness', () => {
  const codes = new Set<string>(PROBLEM_CODES);
  it.each(['csv', 'tsv', 'json', 'graphml'] as const)('%s: arbitrary text never throws and only uses listed codes', (format) => {
    const fragments = fc.constantFrom('source', 'target', 'weight', ',', '\t', '\n', '\r\n', '"', '{', '}', '[', ']', '<', '>', '/', '=', 'edge', 'graph', 'graphml', 'key', 'NaN', '-1', '0', '1e309', 'a', 'b', '&amp;', '&x;', '<!DOCTYPE', ':');
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 200 }), fc.array(fragments, { maxLength: 60 }).map((a) => a.join(''))), (text) => {
        const result = parseEdgeList(text, { format, graphmlWeightKey: 'weight' });
        const listed = result.ok ? result.warnings : result.problems;
        expect(listed.length).toBeLessThanOrEqual(PROBLEM_LIST_CAP + 1);
        for (const p of listed) {
          expect(codes.has(p.code)).toBe(true);
          expect(p.message.length).toBeGreaterThan(10);
        }
        if (result.ok) expect(result.edgeList.edges.every((e) => Number.isFinite(e.weight) && e.weight > 0)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});

describe('JSON scanner agrees with JSON.parse', () => {
  const accepts = (text: string) => {
    try {
      JSON.parse(text);
      return true;
    } catch {
      return false;
    }
  };

  it('accepts everything JSON.stringify writes', () => {
    fc.assert(fc.property(fc.jsonValue(), fc.constantFrom(0, 2), (value, indent) => {
      expect(scanJson(JSON.stringify(value, null, indent)).errorAt).toBeUndefined();
    }), { numRuns: 300 });
  });

  it('rejects exactly what JSON.parse rejects', () => {
    const pieces = fc.constantFrom('{', '}', '[', ']', ',', ':', '"a"', '"\\u00e9"', '"\\x"', '1', '-0.5e3', '01', 'true', 'nul', ' ', '\n', '"edges"');
    fc.assert(fc.property(fc.array(pieces, { maxLength: 20 }).map((a) => a.join('')), (text) => {
      expect(scanJson(text).errorAt === undefined).toBe(accepts(text));
    }), { numRuns: 1000 });
  });
});
