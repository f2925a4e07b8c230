/**
 * The fast sweep (issue 7): the default method, its contract with the server, its agreement with
 * the exact path on every small network the engine's tests use and on the demo data, its noise
 * floors against closed forms, the Puiseux coefficient, and the counted fallbacks.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { parseEdgeList } from '@/lib/formats';
import {
  analyseBaseline,
  auditEdge,
  auditNetwork,
  auditPerturbation,
  randomNetwork,
  type EdgeResult,
  type SignResponse,
  type SpectralNetwork,
  type SpectralOptions,
} from '@/lib/spectral';
import { edgeIndex, net, relErr, type EdgeRow } from './helpers';
import { compareEdges } from './compare';
import { chainWithProbe, fourCycleWithChords, triangleWithChord, triangleWithListeners } from './networks';

const chainProbe = chainWithProbe();

function undirected(pairs: [string, string, number][]): SpectralNetwork {
  const rows: EdgeRow[] = [];
  for (const [u, v, w] of pairs) rows.push([u, v, w], [v, u, w]);
  return net(rows);
}

function demo(file: string): SpectralNetwork {
  const parsed = parseEdgeList(readFileSync(path.join(__dirname, '../../../seeds/data', file), 'utf8'), { format: 'csv' });
  if (!parsed.ok) throw new Error(`demo file ${file} does not parse`);
  return parsed.edgeList;
}

/** Every small network of the engine's tests, plus the three demo networks. */
const SMALL: [string, SpectralNetwork, SpectralOptions | undefined][] = [
  ['chain with a probe (Jordan 2)', chainProbe, undefined],
  ['triangle with a chord (Jordan 2)', triangleWithChord, undefined],
  ['4-cycle with two chords (Jordan 3)', fourCycleWithChords, undefined],
  ['triangle with listeners', triangleWithListeners, undefined],
  ['DAG with a near tie (identity change)', net([['r', 'a', 1], ['r', 'b', 1.002]]), undefined],
  ['near-degenerate chain (crossover)', chainWithProbe(1.01), undefined],
  ['light edge (truncated minus side)', net([['a', 'b', 1], ['b', 'c', 1], ['c', 'a', 1e-4]]), undefined],
  ['undirected 5-cycle (semisimple double λ2)', undirected([['a', 'b', 1], ['b', 'c', 1], ['c', 'd', 1], ['d', 'e', 1], ['e', 'a', 1]]), undefined],
  ['directed 13-cycle', net(Array.from({ length: 13 }, (_, i) => [`v${i}`, `v${(i + 1) % 13}`, 1] as EdgeRow)), undefined],
  ['random N = 8', randomNetwork({ nodes: 8, edgesPerNode: 3, seed: 77 }), undefined],
  ['triangle, out-degree convention', triangleWithChord, { convention: 'out' }],
  ['Gannet Sound buoy relay (demo)', demo('gannet-sound-buoy-relay.csv'), undefined],
  ['Marrow Fen microgrid (demo)', demo('marrow-fen-microgrid.csv'), undefined],
  ['Quarry Lane depots (demo)', demo('quarry-lane-depots.csv'), undefined],
];

describe('method option', () => {
  it('the fast path is the default; the exact path stays callable', () => {
    const fast = auditNetwork(triangleWithChord);
    expect(fast.method).toBe('fast');
    expect(analyseBaseline(triangleWithChord).fast?.ok).toBe(true);
    const exact = auditNetwork(triangleWithChord, { method: 'exact' });
    expect(exact.method).toBe('exact');
    expect(analyseBaseline(triangleWithChord, { method: 'exact' }).fast).toBeUndefined();
    expect(exact.edges.every((e) => e.fallbacks === 0)).toBe(true);
    expect(fast.fallbacks).toBe(fast.edges.reduce((s, e) => s + (e.fallbacks ?? 0), 0));
  });

  it('a worker given an exact-built baseline builds the fast data itself, and agrees', () => {
    // The fast baseline reads its spectrum off its own Schur form, the exact one off ml-matrix:
    // the two agree to rounding, so the results agree within the comparison's tolerances.
    const network = randomNetwork({ nodes: 12, seed: 1212 });
    const withData = analyseBaseline(network);
    const without = structuredClone(analyseBaseline(network, { method: 'exact' }));
    expect(without.fast).toBeUndefined();
    for (const i of [0, 7, network.edges.length - 1]) {
      const lazily = auditEdge(network, without, i, { method: 'fast' });
      expect(lazily.fallbacks).toBe(0);
      expect(compareEdges(lazily, auditEdge(network, withData, i), false).issues).toEqual([]);
    }
  });

  it('the fast data is plain: it survives structuredClone and JSON with every number intact', () => {
    const b = analyseBaseline(randomNetwork({ nodes: 10, seed: 1010 }));
    expect(structuredClone(b.fast)).toEqual(b.fast);
    expect(JSON.parse(JSON.stringify(b.fast))).toEqual(b.fast);
  });
});

describe('fast and exact paths agree on every small test network and the demo data', () => {
  it.each(SMALL)('%s', (_, network, options) => {
    const fast = auditNetwork(network, options);
    const exact = auditNetwork(network, { ...options, method: 'exact' });
    const b = analyseBaseline(network, options);
    const defective = b.cluster.size > 1 && !b.cluster.resolved;
    const problems = fast.edges.flatMap((e, i) =>
      compareEdges(e, exact.edges[i], defective, !b.transposeFloor).issues.map((m) => `${e.source}→${e.target} ${m}`),
    );
    expect(problems).toEqual([]);
    expect(fast.fallbacks).toBe(0);
  });
});

/** Least real part of the roots of a monic polynomial (coefficients highest first), via ml-matrix on its companion matrix. */
function leastRealRoot(coefficients: number[]): number {
  const k = coefficients.length - 1;
  const rows = Array.from({ length: k }, (_, i) => Array.from({ length: k }, (_, j) => (i === 0 ? -coefficients[j + 1] : i === j + 1 ? 1 : 0)));
  return Math.min(...new EigenvalueDecomposition(new Matrix(rows)).realEigenvalues);
}

describe('fast values against closed forms, with floors that bound the fast path’s own error', () => {
  // Characteristic factors beside (μ + 2) (μ = λ − 2): triangle from closed-forms.test.ts; 4-cycle
  // expanded with sympy for this test (1→2: μ³ − εμ² + εμ − ε; 1→3: μ³ − εμ² + ε; 1→4:
  // μ(μ² − εμ − ε); 2→3: μ²(μ − ε)); the chain probe's from μ² − (2 + ε)μ + 1 (by hand). Every
  // point's error must stay within its own floor.
  const cases: [string, string, string, SpectralNetwork, (e: number) => number][] = [
    ['chain probe', 'c', 'b', chainProbe, (e) => (e > 0 ? e / 2 - Math.sqrt(e + (e * e) / 4) : e / 2)],
    ['triangle', '2', '1', triangleWithChord, (e) => leastRealRoot([1, -e, -e])],
    ['triangle', '2', '3', triangleWithChord, (e) => leastRealRoot([1, -e, e])],
    ['triangle', '1', '2', triangleWithChord, (e) => Math.min(0, e)],
    ['4-cycle', '1', '2', fourCycleWithChords, (e) => leastRealRoot([1, -e, e, -e])],
    ['4-cycle', '1', '3', fourCycleWithChords, (e) => leastRealRoot([1, -e, 0, e])],
    ['4-cycle', '1', '4', fourCycleWithChords, (e) => Math.min(0, leastRealRoot([1, -e, -e]))],
    ['4-cycle', '2', '3', fourCycleWithChords, (e) => Math.min(0, e)],
  ];
  it.each(cases)('%s, edge %s→%s', (_, s, t, network, exact) => {
    const e = auditEdge(network, analyseBaseline(network), edgeIndex(network, s, t));
    for (const side of [e.plus, e.minus] as SignResponse[]) {
      for (const p of side.points) expect(Math.abs(p.delta - exact(p.eps))).toBeLessThanOrEqual(p.floor + 1e-14);
    }
  });
});

describe('leading Puiseux coefficient of root-type edges', () => {
  // Expected c from the same characteristic factors: μ² ≈ ε·ψ (square-root) or μ³ ≈ ε·ψ
  // (cube-root), c the least real part over the roots (see closed-forms.test.ts).
  it.each([
    ['chain probe', 'c', 'b', 'plus', -1, chainProbe],
    ['triangle', '2', '1', 'plus', -1, triangleWithChord],
    ['triangle', '2', '3', 'minus', -1, triangleWithChord],
    ['4-cycle', '1', '2', 'plus', -0.5, fourCycleWithChords],
    ['4-cycle', '1', '2', 'minus', -1, fourCycleWithChords],
    ['4-cycle', '1', '3', 'plus', -1, fourCycleWithChords],
    ['4-cycle', '1', '3', 'minus', -0.5, fourCycleWithChords],
    ['4-cycle', '1', '4', 'plus', -1, fourCycleWithChords],
  ] as const)('%s %s→%s, %s side: c = %p', (_, s, t, side, c, network) => {
    const e = auditEdge(network, analyseBaseline(network), edgeIndex(network, s, t));
    const response = e[side] as SignResponse;
    expect(['square-root', 'cube-root']).toContain(response.class);
    expect(response.puiseux as number).toBeCloseTo(c, 9);
    expect(relErr(response.prefactor as number, c)).toBeLessThan(0.02);
  });

  it('linear and flat sides carry none', () => {
    const e = auditEdge(triangleWithChord, analyseBaseline(triangleWithChord), edgeIndex(triangleWithChord, '1', '2'));
    expect(e.plus?.class).toBe('flat');
    expect(e.minus?.class).toBe('linear');
    expect(e.plus?.puiseux).toBeUndefined();
    expect(e.minus?.puiseux).toBeUndefined();
  });
});

describe('fallbacks are counted', () => {
  function points(e: EdgeResult): number {
    return (e.plus?.points.length ?? 0) + (e.minus?.points.length ?? 0) + e.budget.checks * 2;
  }

  it('a network the fast path does not take (not rooted): every point falls back, and says why', () => {
    // Two leader groups {a} and {b} (nobody reaches both): 0 is a double eigenvalue.
    const split = net([['a', 'c', 1], ['b', 'c', 1], ['c', 'd', 1]]);
    const fast = auditNetwork(split);
    const exact = auditNetwork(split, { method: 'exact' });
    expect(fast.fallbackReason).toMatch(/not rooted/);
    for (const [i, e] of fast.edges.entries()) {
      expect(e.fallbacks).toBe(points(e));
      expect({ ...e, fallbacks: 0 }).toEqual(exact.edges[i]);
    }
  });

  it('a change along two listening rows (both directions of a link): every point falls back', () => {
    const network = undirected([['a', 'b', 1], ['b', 'c', 2], ['c', 'a', 1.5], ['c', 'd', 1]]);
    const b = analyseBaseline(network);
    const terms = [
      { edgeIndex: edgeIndex(network, 'a', 'b'), scale: 1 },
      { edgeIndex: edgeIndex(network, 'b', 'a'), scale: 1 },
    ];
    const fast = auditPerturbation(network, b, terms);
    const exact = auditPerturbation(network, analyseBaseline(network, { method: 'exact' }), terms);
    const points = (fast.plus?.points.length ?? 0) + (fast.minus?.points.length ?? 0) + 2 * fast.budget.checks;
    expect(fast.fallbacks).toBe(points);
    const asEdge = (a: typeof fast) => ({ index: 0, source: 'a', target: 'b', weight: 1, tolerance: a.budget.eps, ...a });
    expect(compareEdges(asEdge(fast), asEdge(exact), false).issues).toEqual([]);
    expect(relErr(fast.sensitivity?.re as number, exact.sensitivity?.re as number)).toBeLessThan(1e-9);
  });

  it('another eigenvalue overtaking λ2 on a ladder point is confirmed by a full solve', () => {
    // DAG: eigenvalues are the in-degrees 0, 1, 1.2 (by hand). Lowering r→b by more than 0.2 puts
    // λ_b below λ_a = 1: an identity change, reached by a ladder that goes up to ε = w̄.
    const dag = net([['r', 'a', 1], ['r', 'b', 1.2]]);
    const options = { ladder: { from: 0, to: 2, step: 0.5 } };
    const fast = auditNetwork(dag, options);
    const exact = auditNetwork(dag, { ...options, method: 'exact' });
    const e = fast.edges[edgeIndex(dag, 'r', 'b')];
    const overtaken = (e.minus as SignResponse).points.filter((p) => p.tracked === 0).length;
    expect(overtaken).toBeGreaterThan(0);
    expect(e.fallbacks).toBe(overtaken);
    expect(e.minus?.flags).toContain('identity-change');
    expect(compareEdges(e, exact.edges[edgeIndex(dag, 'r', 'b')], false).issues).toEqual([]);
  });
});
