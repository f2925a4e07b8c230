import { importOptionsSchema, LIMIT_CEILING, parseEdgeList } from '../../../lib/formats';
import { edgeListOf } from './helpers';

describe('importOptionsSchema', () => {
  it('accepts a full set of options', () => {
    const options = {
      format: 'graphml',
      columns: { source: 'from site' },
      graphmlWeightKey: 'coupling',
      undirected: 'both-directions',
      duplicates: 'sum',
      limits: { maxNodes: 10, maxEdges: 50 },
    };
    expect(importOptionsSchema.parse(options)).toEqual(options);
  });

  it.each([
    [{ format: 'xlsx' }, 'format'],
    [{ format: 'csv', duplicates: 'merge' }, 'duplicates'],
    [{ format: 'csv', columns: { weight: '  ' } }, 'columns'],
    [{ format: 'csv', limits: { maxEdges: 0 } }, 'limits'],
    [{ format: 'csv', limits: { maxNodes: 2.5 } }, 'limits'],
    [{ format: 'csv', limits: { maxEdges: LIMIT_CEILING.maxEdges + 1 } }, 'limits'],
    [{ format: 'csv', delimiter: ';' }, ''],
  ])('refuses %j', (options, path) => {
    const result = importOptionsSchema.safeParse(options);
    expect(result.success).toBe(false);
    if (!result.success) expect(result.error.issues[0].path.join('.')).toContain(path);
  });

  it('trims mapped column names before they are matched', () => {
    const options = importOptionsSchema.parse({ format: 'csv', columns: { source: ' A ', target: 'b ', weight: ' c' } });
    expect(edgeListOf(parseEdgeList('a,b,c\nx,y,1\n', options)).edges).toEqual([{ source: 'x', target: 'y', weight: 1 }]);
  });
});
