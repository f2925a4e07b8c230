import { checkClaimedFormat, detectFormat, parseEdgeList, type ImportFormat } from '../../../lib/formats';
import { fixture, onlyProblem } from './helpers';

describe('detectFormat', () => {
  it.each([
    ['korrin-relays.csv', 'csv'],
    ['korrin-relays.tsv', 'tsv'],
    ['pump-ring.json', 'json'],
    ['pump-ring-directed.graphml', 'graphml'],
  ] as const)('recognises %s by content alone', (file, format) => {
    expect(detectFormat(fixture(file)).format).toBe(format);
  });

  it('notices a file name that disagrees with the content', () => {
    const d = detectFormat(fixture('korrin-relays.tsv'), 'relays.csv');
    expect(d).toEqual({ format: 'tsv', byName: 'csv', byContent: 'tsv', mismatch: true });
    expect(detectFormat(fixture('pump-ring.json'), 'PUMPS.JSON').mismatch).toBe(false);
  });

  it('falls back to the file name when the content cannot tell', () => {
    expect(detectFormat('source\n', 'one-column.tsv')).toMatchObject({ format: 'tsv', byContent: 'unknown' });
  });

  it('recognises binary content such as a spreadsheet workbook', () => {
    expect(detectFormat('PK\u0003\u0004\u0014\u0000\u0006', 'network.csv')).toMatchObject({ byContent: 'binary', format: 'csv' });
  });
});

describe('a file that is not the format it claims', () => {
  const cases: [string, ImportFormat, RegExp][] = [
    ['pump-ring.json', 'csv', /looks like JSON, not CSV \(comma-separated\); choose JSON/],
    ['pump-ring-directed.graphml', 'json', /looks like GraphML, not JSON/],
    ['korrin-relays.tsv', 'csv', /looks like TSV \(tab-separated\), not CSV/],
    ['korrin-relays.csv', 'tsv', /looks like CSV \(comma-separated\), not TSV/],
    ['korrin-relays.csv', 'graphml', /looks like CSV \(comma-separated\), not GraphML/],
    ['korrin-relays.csv', 'json', /looks like CSV/],
  ];
  it.each(cases)('%s claimed as %s', (file, format, message) => {
    const p = onlyProblem(parseEdgeList(fixture(file), { format, graphmlWeightKey: 'd1' }), 'wrong-format');
    expect(p.message).toMatch(message);
  });

  it('refuses a workbook saved with a .csv name', () => {
    const p = onlyProblem(parseEdgeList('PK\u0003\u0004\u0014\u0000binary', { format: 'csv' }), 'wrong-format');
    expect(p.message).toContain('binary file');
  });

  it('explains semicolon-separated files', () => {
    const p = onlyProblem(parseEdgeList('source;target;weight\na;b;0,5\n', { format: 'csv' }), 'wrong-format');
    expect(p.message).toContain('separated by semicolons');
  });

  it('does not object to the right format, or to commas inside quoted TSV names', () => {
    expect(checkClaimedFormat('csv', fixture('korrin-relays.csv'))).toBeUndefined();
    expect(checkClaimedFormat('tsv', '"a, b"\ttarget\tweight\n')).toBeUndefined();
  });
});
