/**
 * The engine's contract with the server: plain, cloneable data; edge-by-edge audits that a worker
 * can run on any subset; progress and cancellation; input checks.
 */
import {
  analyseBaseline,
  auditEdge,
  auditNetwork,
  randomNetwork,
  resolveOptions,
  SpectralInputError,
  SweepCancelledError,
} from '@/lib/spectral';
import { net, relErr } from './helpers';

const network = randomNetwork({ nodes: 8, edgesPerNode: 3, seed: 77 });

describe('plain data', () => {
  it('baseline and audit survive structuredClone and a JSON round trip unchanged', () => {
    const b = analyseBaseline(network);
    expect(structuredClone(b)).toEqual(b);
    expect(JSON.parse(JSON.stringify(b))).toEqual(b);
    const r = auditNetwork(network);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('a worker with a cloned baseline gets the same result for any subset of edges', () => {
    const whole = auditNetwork(network);
    const cloned = structuredClone(analyseBaseline(network));
    for (const i of [5, 0, network.edges.length - 1]) {
      expect(auditEdge(network, cloned, i)).toEqual(whole.edges[i]);
    }
  });
});

describe('progress and cancellation', () => {
  it('reports (done, total) after every edge', () => {
    const calls: [number, number][] = [];
    auditNetwork(network, {}, { onProgress: (done, total) => calls.push([done, total]) });
    const total = network.edges.length;
    expect(calls).toEqual(Array.from({ length: total }, (_, i) => [i + 1, total]));
  });

  it('stops with SweepCancelledError when asked to', () => {
    let done = 0;
    const run = () =>
      auditNetwork(network, {}, { onProgress: (d) => (done = d), isCancelled: () => done >= 3 });
    expect(run).toThrow(SweepCancelledError);
    expect(done).toBe(3);
    try {
      done = 0;
      run();
    } catch (error) {
      expect((error as SweepCancelledError).done).toBe(3);
      expect((error as SweepCancelledError).total).toBe(network.edges.length);
    }
  });
});

describe('input checks', () => {
  it.each([
    ['unknown node', { nodes: ['a', 'b'], edges: [{ source: 'a', target: 'z', weight: 1 }] }],
    ['negative weight', { nodes: ['a', 'b'], edges: [{ source: 'a', target: 'b', weight: -1 }] }],
    ['non-finite weight', { nodes: ['a', 'b'], edges: [{ source: 'a', target: 'b', weight: Infinity }] }],
    ['duplicate node', { nodes: ['a', 'a'], edges: [] }],
    ['single node', { nodes: ['a'], edges: [] }],
  ])('%s → SpectralInputError', (_, bad) => {
    expect(() => analyseBaseline(bad)).toThrow(SpectralInputError);
  });

  it('rejects bad options and an edge index out of range', () => {
    expect(() => resolveOptions({ tolerance: 0 })).toThrow(SpectralInputError);
    expect(() => resolveOptions({ ladder: { from: 3, to: 2, step: 0.5 } })).toThrow(SpectralInputError);
    const small = net([['a', 'b', 1], ['b', 'a', 1]]);
    expect(() => auditEdge(small, analyseBaseline(small), 2)).toThrow(SpectralInputError);
    expect(() => auditEdge(small, analyseBaseline(small), 0, { convention: 'out' })).toThrow(SpectralInputError);
  });

  it('a custom ladder and one sign are honoured', () => {
    const small = net([['a', 'b', 1], ['b', 'a', 2]]);
    const r = auditNetwork(small, { ladder: { from: 3, to: 5, step: 1 }, signs: ['plus'] });
    expect(r.edges[0].minus).toBeNull();
    // Mean weight 1.5: ε = 1.5·10^(−t) for t = 5, 4, 3.
    const eps = (r.edges[0].plus?.points ?? []).map((p) => p.eps);
    expect(eps).toHaveLength(3);
    [1.5e-5, 1.5e-4, 1.5e-3].forEach((x, i) => expect(relErr(eps[i], x)).toBeLessThan(1e-12));
  });
});
