import { parseEdgeList } from '../../../lib/formats';
import { csvLines, edgeListOf, fixture, onlyProblem, problemsOf } from './helpers';

describe('CSV import, happy paths', () => {
  it('reads a file with a byte-order mark and CRLF line ends', () => {
    const text = fixture('korrin-relays.csv');
    expect(text.charCodeAt(0)).toBe(0xfeff);
    expect(text).toContain('\r\n');
    const list = edgeListOf(parseEdgeList(text, { format: 'csv' }));
    expect(list.nodes).toEqual(['mast-north-ridge', 'relay-harbour', 'pump-saltmarsh', 'tank-lighthouse']);
    expect(list.edges).toHaveLength(5);
    expect(list.edges[0]).toEqual({ source: 'mast-north-ridge', target: 'relay-harbour', weight: 0.75 });
    // No stray \r left on the last column.
    expect(list.edges[3]).toEqual({ source: 'tank-lighthouse', target: 'mast-north-ridge', weight: 2 });
  });

  it('maps columns whose names differ, in any order and any case, ignoring extra columns', () => {
    const list = edgeListOf(
      parseEdgeList(fixture('korrin-relays-mapped.csv'), {
        format: 'csv',
        columns: { source: 'mast from', target: 'MAST TO', weight: 'link gain' },
      }),
    );
    expect(list.edges[1]).toEqual({ source: 'relay-harbour', target: 'pump-saltmarsh', weight: 1.2 });
    expect(list.edges).toHaveLength(5);
  });

  it('accepts common header synonyms without a mapping', () => {
    const list = edgeListOf(parseEdgeList(csvLines('From,To,Gain', 'well-a,well-b,3'), { format: 'csv' }));
    expect(list.edges).toEqual([{ source: 'well-a', target: 'well-b', weight: 3 }]);
  });

  it('reads quoted names holding commas, quotes and spaces, and trims the spaces around names', () => {
    const text = csvLines('source,target,weight', '"pier 4, east","the ""old"" mast", 1.5 ', '  buoy-7 ,pier 4, east_x,2');
    const result = parseEdgeList(text.replace('pier 4, east_x', '"pier 4, east"'), { format: 'csv' });
    const list = edgeListOf(result);
    expect(list.nodes).toEqual(['pier 4, east', 'the "old" mast', 'buoy-7']);
    expect(list.edges[0].weight).toBe(1.5);
  });

  it('skips blank lines but keeps counting them for line numbers', () => {
    const text = csvLines('source,target,weight', '', 'a,b,1', '   ', 'b,c,zero');
    const p = onlyProblem(parseEdgeList(text, { format: 'csv' }), 'not-a-number');
    expect(p.line).toBe(5);
    expect(p.message).toMatch(/^line 5: /);
  });

  it('tolerates empty trailing cells a spreadsheet added', () => {
    const list = edgeListOf(parseEdgeList(csvLines('source,target,weight', 'a,b,1,,'), { format: 'csv' }));
    expect(list.edges).toEqual([{ source: 'a', target: 'b', weight: 1 }]);
  });

  it('accepts decimal spellings: exponent, leading point, plus sign', () => {
    const text = csvLines('source,target,weight', 'a,b,1e-3', 'b,c,.5', 'c,a,+2.')
    expect(edgeListOf(parseEdgeList(text, { format: 'csv' })).edges.map((e) => e.weight)).toEqual([0.001, 0.5, 2]);
  });
});

describe('TSV import', () => {
  it('reads tab-separated files', () => {
    const list = edgeListOf(parseEdgeList(fixture('korrin-relays.tsv'), { format: 'tsv' }));
    expect(list.edges).toHaveLength(5);
    expect(list.edges[4]).toEqual({ source: 'relay-harbour', target: 'tank-lighthouse', weight: 0.05 });
  });

  it('keeps commas inside TSV names, since the delimiter is the tab', () => {
    const list = edgeListOf(parseEdgeList(csvLines('source\ttarget\tweight', 'pier 4, east\tbuoy-7\t0.3'), { format: 'tsv' }));
    expect(list.nodes).toEqual(['pier 4, east', 'buoy-7']);
  });
});

describe('CSV structure problems', () => {
  it('reports a missing column on line 1 with what it looked for and what the header holds', () => {
    const p = onlyProblem(parseEdgeList(csvLines('source,target,cost', 'a,b,1'), { format: 'csv' }), 'missing-column');
    expect(p.line).toBe(1);
    expect(p.column).toBe('weight');
    expect(p.message).toMatch(/^line 1: no weight column found/);
    expect(p.message).toContain("'cost'");
  });

  it('reports every missing column at once, and a mapped name that is absent', () => {
    const result = parseEdgeList(csvLines('alpha,beta,gamma', 'a,b,1'), { format: 'csv', columns: { weight: 'delta' } });
    const missing = problemsOf(result).filter((p) => p.code === 'missing-column');
    expect(missing.map((p) => p.column)).toEqual(['source', 'target', 'delta']);
    expect(missing[2].message).toContain("column mapping says the weight is in column 'delta'");
  });

  it('hints that a header-less file starts with data', () => {
    const p = problemsOf(parseEdgeList(csvLines('a,b,0.5', 'b,c,1'), { format: 'csv' }))[0];
    expect(p.code).toBe('missing-column');
    expect(p.message).toContain('looks like an edge rather than a header');
  });

  it('refuses a header that names the weight column twice', () => {
    const p = onlyProblem(parseEdgeList(csvLines('source,target,weight,Weight', 'a,b,1,2'), { format: 'csv' }), 'duplicate-column');
    expect(p.message).toContain('columns 3 and 4');
  });

  it('refuses a mapping that uses one column for two roles', () => {
    const result = parseEdgeList(csvLines('a,b,w', 'x,y,1'), { format: 'csv', columns: { source: 'a', target: 'a' } });
    expect(onlyProblem(result, 'duplicate-column').message).toContain('both source and target');
  });

  it('reports rows with too few or too many fields by line', () => {
    const text = csvLines('source,target,weight', 'a,b,1', 'b,c', 'pier 4, east,c,2');
    const result = parseEdgeList(text, { format: 'csv' });
    const lines = problemsOf(result).filter((p) => p.code === 'field-count').map((p) => p.line);
    expect(lines).toEqual([3, 4]);
    expect(problemsOf(result)[1].message).toMatch(/^line 4: .*must be in double quotes/);
  });

  it('reports an unclosed quote as malformed on the line where it opens', () => {
    const text = csvLines('source,target,weight', 'a,b,1', '"harbour,c,2', 'c,d,3');
    const p = problemsOf(parseEdgeList(text, { format: 'csv' })).find((x) => x.code === 'malformed');
    expect(p?.line).toBe(3);
    expect(p?.message).toMatch(/^line 3: /);
  });

  it('counts lines correctly after a quoted name that spans two lines', () => {
    const text = csvLines('source,target,weight', '"two\nlines",b,1', 'b,c,oops');
    const result = parseEdgeList(text, { format: 'csv' });
    expect(onlyProblem(result, 'bad-name').line).toBe(2);
    expect(onlyProblem(result, 'not-a-number').line).toBe(4);
  });

  it('says a header with no rows under it is empty', () => {
    const p = onlyProblem(parseEdgeList('source,target,weight\r\n\r\n', { format: 'csv' }), 'empty-file');
    expect(p.message).toContain('no edge rows');
  });
});
