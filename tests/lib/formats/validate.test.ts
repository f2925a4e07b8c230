/**
 * The shared checks, each asserted with its code and the line its message names.
 * CSV is used as the carrier because its line numbers are the easiest to read here.
 */
import { parseEdgeList, type ImportOptions } from '../../../lib/formats';
import { csvLines, edgeListOf, onlyProblem, problemsOf, warningsOf } from './helpers';

const HEADER = 'source,target,weight';
const csv = (rows: string[], options: Partial<ImportOptions> = {}) => parseEdgeList(csvLines(HEADER, ...rows), { format: 'csv', ...options });

describe('weights', () => {
  it.each([
    ['abc', 'not-a-number', /weight 'abc' is not a number; use a decimal such as 0.75/],
    ['"0,75"', 'not-a-number', /weight '0,75' is not a number.*decimal comma/],
    ['NaN', 'not-a-number', /weight 'NaN' means "not a number"/],
    ['Infinity', 'not-finite', /weight 'Infinity' is infinite/],
    ['-inf', 'not-finite', /is infinite/],
    ['1e309', 'not-finite', /weight '1e309' is too large to store \(it overflows to infinity\)/],
    ['-0.5', 'weight-not-positive', /weight '-0.5' is negative/],
    ['0', 'weight-not-positive', /weight '0' is zero/],
    ['-0.0', 'weight-not-positive', /is zero/],
    ['1e-400', 'weight-not-positive', /rounds to zero/],
    ['', 'empty-weight', /the weight is empty/],
    ['0x10', 'not-a-number', /is not a number/],
  ])('weight %p on line 3 → %s', (weight, code, message) => {
    const p = onlyProblem(csv(['mast-a,mast-b,1', `mast-b,mast-c,${weight}`]), code);
    expect(p.line).toBe(3);
    expect(p.column).toBe('weight');
    expect(p.message.startsWith('line 3: ')).toBe(true);
    expect(p.message).toMatch(message);
  });

  it('names the header of a mapped weight column', () => {
    const result = parseEdgeList(csvLines('from,to,Link Gain', 'a,b,x'), { format: 'csv', columns: { weight: 'link gain' } });
    expect(onlyProblem(result, 'not-a-number').column).toBe('Link Gain');
  });
});

describe('names', () => {
  it('refuses an empty source name, naming the line and column', () => {
    const p = onlyProblem(csv(['a,b,1', ' ,b,1']), 'empty-name');
    expect(p).toMatchObject({ line: 3, column: 'source' });
    expect(p.message).toMatch(/^line 3: the source name is empty/);
  });

  it('refuses names longer than 200 characters and accepts exactly 200', () => {
    const ok = 'm'.repeat(200);
    expect(edgeListOf(csv([`${ok},b,1`])).nodes[0]).toBe(ok);
    const p = onlyProblem(csv([`a,${'m'.repeat(201)},1`]), 'name-too-long');
    expect(p).toMatchObject({ line: 2, column: 'target' });
    expect(p.message).toContain('201 characters');
  });
});

describe('edges', () => {
  it('refuses a self-loop', () => {
    const p = onlyProblem(csv(['a,b,1', 'a,c,1', 'tower-9,tower-9,0.4']), 'self-loop');
    expect(p.line).toBe(4);
    expect(p.message).toMatch(/^line 4: the edge 'tower-9' → 'tower-9' starts and ends at the same node/);
  });

  it('refuses a duplicate edge and names both lines', () => {
    const p = onlyProblem(csv(['a,b,1', 'b,c,1', 'c,a,1', 'a,b,2']), 'duplicate-edge');
    expect(p.line).toBe(5);
    expect(p.message).toMatch(/^line 5: the edge 'a' → 'b' is already given at line 2;/);
  });

  it('does not call opposite directions a duplicate', () => {
    expect(edgeListOf(csv(['a,b,1', 'b,a,1'])).edges).toHaveLength(2);
  });

  it('sums duplicates when asked, with a warning that lists every merged line', () => {
    const result = csv(['a,b,0.5', 'b,c,1', 'a,b,0.25', 'a,b,1'], { duplicates: 'sum' });
    const list = edgeListOf(result);
    expect(list.edges).toEqual([
      { source: 'a', target: 'b', weight: 1.75 },
      { source: 'b', target: 'c', weight: 1 },
    ]);
    const [w] = warningsOf(result);
    expect(w.code).toBe('duplicates-summed');
    expect(w.line).toBe(2);
    expect(w.message).toContain('line 2, line 4 and line 5');
    expect(w.message).toContain('1.75');
  });

  it('still refuses bad weights among summed duplicates', () => {
    const p = onlyProblem(csv(['a,b,0.5', 'a,b,-1'], { duplicates: 'sum' }), 'weight-not-positive');
    expect(p.line).toBe(3);
  });
});

describe('both directions for files without a direction flag', () => {
  it('enters each row both ways and says so', () => {
    const result = csv(['a,b,0.5', 'b,c,2'], { undirected: 'both-directions' });
    expect(edgeListOf(result).edges).toEqual([
      { source: 'a', target: 'b', weight: 0.5 },
      { source: 'b', target: 'a', weight: 0.5 },
      { source: 'b', target: 'c', weight: 2 },
      { source: 'c', target: 'b', weight: 2 },
    ]);
    expect(warningsOf(result).map((w) => w.code)).toEqual(['entered-both-directions']);
  });

  it('reports a link given in both orders once, naming both lines', () => {
    const result = csv(['a,b,0.5', 'c,d,1', 'b,a,0.5'], { undirected: 'both-directions' });
    const p = onlyProblem(result, 'duplicate-edge');
    expect(p.line).toBe(4);
    expect(p.message).toMatch(/^line 4: .*already given at line 2 \(an undirected link entered in both directions\)/);
  });
});

describe('every problem at once', () => {
  it('lists problems from many lines in file order', () => {
    // Row-shape problems are found while reading and the rest afterwards; the list is still in line order.
    const result = csv(['a,b,1', 'b,b,1', 'c,d,abc', 'x,y', 'e,f,-2', 'a,b,3', ',g,1', 'z']);
    expect(problemsOf(result).map((p) => [p.code, p.line])).toEqual([
      ['self-loop', 3],
      ['not-a-number', 4],
      ['field-count', 5],
      ['weight-not-positive', 6],
      ['duplicate-edge', 7],
      ['empty-name', 8],
      ['field-count', 9],
    ]);
  });

  it('caps a long list at 200 and says how many more there are', () => {
    // Every fifth row is cut short (found by the reader); the others have bad weights (found later).
    const rows = Array.from({ length: 1000 }, (_, i) => (i % 5 === 4 ? `n${i}` : `n${i},m${i},bad`));
    const problems = problemsOf(csv(rows));
    expect(problems).toHaveLength(201);
    expect(problems.slice(0, 200).map((p) => p.line)).toEqual(Array.from({ length: 200 }, (_, i) => i + 2));
    expect(problems[4]).toMatchObject({ code: 'field-count', line: 6 });
    expect(problems[200].code).toBe('too-many-problems');
    expect(problems[200].message).toContain('800 more problems');
  });
});

describe('limits', () => {
  it('defaults to 2,000 nodes: refuses node 2,001 and names the line where it appears', () => {
    const rows = Array.from({ length: 1001 }, (_, i) => `p${2 * i},p${2 * i + 1},1`);
    const p = onlyProblem(csv(rows), 'too-many-nodes');
    expect(p.line).toBe(1002);
    expect(p.message).toMatch(/^line 1002: the network has 2,002 nodes, more than the limit of 2,000/);
    expect(edgeListOf(csv(rows.slice(0, 1000))).nodes).toHaveLength(2000);
  });

  it('defaults to 20,000 edges and puts the limit first, even after 200 other problems', () => {
    const rows = Array.from({ length: 20001 }, (_, i) => `h${i % 100},k${Math.floor(i / 100)},${i < 300 ? 'x' : 1}`);
    const problems = problemsOf(csv(rows));
    expect(problems[0]).toMatchObject({ code: 'too-many-edges', line: 20002 });
    expect(problems[0].message).toContain('20,001 edges, more than the limit of 20,000');
    expect(problems[problems.length - 1].code).toBe('too-many-problems');
  });

  it('honours configured limits', () => {
    const result = csv(['a,b,1', 'b,c,1', 'c,d,1'], { limits: { maxEdges: 2, maxNodes: 3 } });
    expect(onlyProblem(result, 'too-many-edges').line).toBe(4);
    expect(onlyProblem(result, 'too-many-nodes').line).toBe(4);
  });
});

describe('options', () => {
  it('rejects options that do not fit the schema', () => {
    const result = parseEdgeList('source,target,weight\na,b,1\n', { format: 'csv', duplicates: 'merge' } as unknown as ImportOptions);
    expect(problemsOf(result)[0].code).toBe('invalid-options');
    expect(problemsOf(result)[0].message).toContain('duplicates');
  });

  it('refuses an empty or whitespace-only file', () => {
    for (const format of ['csv', 'tsv', 'json', 'graphml'] as const) {
      expect(onlyProblem(parseEdgeList('\ufeff \r\n\n', { format }), 'empty-file').message).toContain('empty');
    }
  });
});
