/**
 * The five numerical pitfalls of issue 3, each on a network where getting it wrong changes the answer.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { analyseBaseline, auditEdge, auditNetwork, buildLaplacian, edgeSlots, summariseNetwork, type SignResponse } from '@/lib/spectral';
import { edgeIndex, net, relErr } from './helpers';
import { chainWithProbe, fourCycleWithChords, triangleWithChord, triangleWithListeners } from './networks';

function usedRunIsContiguousAndAboveFloor(side: SignResponse): void {
  const used = side.points.map((p) => p.used);
  const first = used.indexOf(1);
  const last = used.lastIndexOf(1);
  if (first >= 0) expect(used.slice(first, last + 1).every((u) => u === 1)).toBe(true);
  for (const p of side.points) if (p.used) expect(Math.abs(p.delta)).toBeGreaterThan(p.floor);
}

describe('pitfall 1: baseline of a rounding-split cluster', () => {
  // Spectrum by hand: the triangle is the only leader group, so L is block triangular with the
  // triangle block (0, 2, 2 — Jordan block, see closed-forms.test.ts) and the listener block
  // [[3.2, 0], [−2.6, 3.5]] (eigenvalues 3.2 and 3.5). So λ2 = 2 exactly, defective.
  const b = analyseBaseline(triangleWithListeners);

  it('the computed least real part is off by ~√u, the baseline (cluster mean) is not', () => {
    // The solver's own λ2 on this matrix (independent call): rounding splits the double root along
    // the real axis here, so its real part misses 2 by far more than u‖L‖.
    const n = 5;
    const m = new Matrix(Array.from({ length: n }, (_, i) => b.laplacian.slice(i * n, i * n + n)));
    const e = new EigenvalueDecomposition(m);
    const re = e.realEigenvalues.filter((x, i) => Math.hypot(x, e.imaginaryEigenvalues[i]) > 1e-9);
    expect(Math.abs(Math.min(...re) - 2)).toBeGreaterThan(1e-9);
    // …whereas the engine's reference value is exact to rounding.
    expect(b.cluster.size).toBe(2);
    expect(b.cluster.resolved).toBe(false);
    expect(Math.abs(b.baselineRe - 2)).toBeLessThan(1e-13);
    expect(Math.abs(summariseNetwork(triangleWithListeners).lambda2.re - 2)).toBeLessThan(1e-13);
  });

  it('so the linear edge 2→3 (+ε, c = +1/2) is fitted right even at ε ~ 1e-7', () => {
    // c = +1/2: characteristic polynomial of the perturbed 2-block, derived by hand (closed-forms.test.ts).
    const e = auditEdge(triangleWithListeners, b, edgeIndex(triangleWithListeners, '2', '3'));
    expect(e.plus?.class).toBe('linear');
    expect(relErr(e.plus?.prefactor as number, 0.5)).toBeLessThan(0.02);
    const smallest = e.plus?.points[0];
    expect(smallest?.used).toBe(1);
    expect(relErr(smallest?.delta as number, 0.5 * (smallest?.eps as number))).toBeLessThan(0.02);
    expect(e.minus?.class).toBe('square-root');
  });
});

describe('pitfall 2: noise floor', () => {
  const r = auditNetwork(triangleWithChord);

  it('an exactly flat response next to a Jordan block is classed flat although Δ is not zero', () => {
    // +ε on 1→2 keeps λ = 2 a double root exactly (closed form by hand), so every non-zero Δ is
    // rounding of the defective eigenvalue.
    const e = r.edges[edgeIndex(triangleWithChord, '1', '2')];
    const side = e.plus as SignResponse;
    expect(side.class).toBe('flat');
    expect(side.points.some((p) => p.delta !== 0)).toBe(true);
    for (const p of side.points) {
      expect(Math.abs(p.delta)).toBeLessThanOrEqual(p.floor);
      expect(p.used).toBe(0);
    }
  });

  it('floors never decrease toward smaller |ε| (running maximum) and fitted runs sit above them', () => {
    for (const e of r.edges) {
      for (const side of [e.plus, e.minus] as SignResponse[]) {
        for (let i = 1; i < side.points.length; i++) expect(side.points[i - 1].floor).toBeGreaterThanOrEqual(side.points[i].floor);
        usedRunIsContiguousAndAboveFloor(side);
      }
    }
  });

  it('a 3-block swamps the smallest points of a linear edge in a full solve: they are left out of the fit', () => {
    // 4-cycle with chords (Jordan block of size 3 at 2): −ε on 2→3 is linear (c = −1, issue 3).
    // This is the full solve's pitfall (method 'exact'); the fast path computes these points from
    // a 3×3 reduced problem and is far less noisy there (fast.test.ts checks its floors).
    const exactBaseline = analyseBaseline(fourCycleWithChords, { method: 'exact' });
    const side = auditEdge(fourCycleWithChords, exactBaseline, edgeIndex(fourCycleWithChords, '2', '3')).minus as SignResponse;
    expect(side.class).toBe('linear');
    expect(side.points[0].used).toBe(0);
    expect(side.points[0].floor).toBeGreaterThan(Math.abs(side.points[0].eps));
    expect(relErr(side.prefactor as number, -1)).toBeLessThan(0.02);
  });

  it('fewer than three points above the floor: low signal, no class', () => {
    const shortLadder = { ladder: { from: 2, to: 2.5, step: 0.5 } };
    const e = auditNetwork(triangleWithChord, shortLadder).edges[edgeIndex(triangleWithChord, '2', '1')];
    expect(e.plus?.points).toHaveLength(2);
    expect(e.plus?.class).toBe('other');
    expect(e.plus?.flags).toContain('low-signal');
  });
});

describe('pitfall 3: identity change', () => {
  // DAG: eigenvalues are the in-degrees 0, 1, 1.002 (derived by hand). Raising r→a by ε moves λ_a to
  // 1 + ε, so for ε > 0.002 the least real part belongs to b: Re λ2 = min(1 + ε, 1.002).
  const dag = net([
    ['r', 'a', 1],
    ['r', 'b', 1.002],
  ]);
  const r = auditNetwork(dag);

  it('points where b took over are dropped; the fit of λ2’s own branch stays exactly linear', () => {
    const side = r.edges[edgeIndex(dag, 'r', 'a')].plus as SignResponse;
    expect(side.flags).toContain('identity-change');
    for (const p of side.points) {
      const overtaken = p.eps > 0.002;
      expect(p.tracked).toBe(overtaken ? 0 : 1);
      if (overtaken) expect(p.used).toBe(0);
    }
    expect(side.class).toBe('linear');
    expect(side.exponent as number).toBeCloseTo(1, 6);
    expect(side.slopeLarge as number).toBeCloseTo(1, 6);
    expect(side.prefactor as number).toBeCloseTo(1, 6);
    // Those points were real: the plateau at 1.002 is what a fit without the rule would have bent to.
    const last = side.points[side.points.length - 1];
    expect(last.delta).toBeCloseTo(0.002, 12);
  });

  it('lowering r→b past λ_a: b overtakes, a’s branch is flat', () => {
    const side = r.edges[edgeIndex(dag, 'r', 'b')].minus as SignResponse;
    expect(side.class).toBe('flat');
    expect(side.flags).toContain('identity-change');
    expect(side.points.filter((p) => p.tracked === 0).every((p) => p.eps < -0.002)).toBe(true);
  });

  it('but the budget counts the overtaking eigenvalue (it sets the convergence rate)', () => {
    // |Δ| ≤ τ·λ2 = 0.01 on the minus side of r→b holds until 1.002 − ε = 0.99, i.e. ε = 0.012.
    const e = r.edges[edgeIndex(dag, 'r', 'b')];
    expect(e.tolerance).toBeLessThanOrEqual(0.012 * (1 + 1e-9));
    expect(e.tolerance).toBeGreaterThan(0.012 / 1.011);
  });
});

describe('pitfall 4: sign dependence', () => {
  const chain = chainWithProbe();

  it('a square-root split is real on one sign and complex on the other', () => {
    // μ² − (2+ε)μ + 1 = 0 (closed form by hand): discriminant ε + ε²/4 > 0 for ε > 0, < 0 for −4 < ε < 0.
    const lambda2At = (eps: number) => {
      const slots = edgeSlots(chain, 'in');
      const L = buildLaplacian(3, slots, [1, 1, eps]);
      const d = new EigenvalueDecomposition(new Matrix([L.slice(0, 3), L.slice(3, 6), L.slice(6, 9)]));
      const i = d.realEigenvalues
        .map((re, k) => ({ re, im: d.imaginaryEigenvalues[k] }))
        .filter((z) => Math.hypot(z.re, z.im) > 1e-9)
        .sort((x, y) => x.re - y.re)[0];
      return i;
    };
    const up = lambda2At(1e-4);
    const down = lambda2At(-1e-4);
    expect(up.im).toBe(0);
    expect(up.re).toBeCloseTo(1 + 5e-5 - Math.sqrt(1e-4 + 2.5e-9), 12);
    expect(Math.abs(down.im)).toBeCloseTo(Math.sqrt(1e-4 - 2.5e-9), 10);
    expect(down.re).toBeCloseTo(1 - 5e-5, 12);
    const e = auditNetwork(chain).edges[edgeIndex(chain, 'c', 'b')];
    expect(e.plus?.class).toBe('square-root');
    expect(e.plus?.prefactor as number).toBeLessThan(0);
    expect(e.minus?.class).toBe('linear');
    expect(e.plus?.flags).toContain('sign-change');
    expect(e.minus?.flags).toContain('sign-change');
    expect(e.plus?.flags).toContain('probe');
    // A probe's minus side is a formal negative weight: it is kept whole (not cut at w/2 = 0).
    expect(e.minus?.points).toHaveLength(11);
  });

  it('an edge can be exactly flat on one sign and linear on the other', () => {
    const e = auditNetwork(triangleWithChord).edges[edgeIndex(triangleWithChord, '3', '1')];
    expect(e.plus?.class).toBe('flat');
    expect(e.minus?.class).toBe('linear');
    expect(e.plus?.flags).toContain('sign-change');
  });

  it('the minus side of a real edge stops at half its weight', () => {
    const light = net([['a', 'b', 1], ['b', 'c', 1], ['c', 'a', 1e-4]]);
    const e = auditNetwork(light).edges[edgeIndex(light, 'c', 'a')];
    const w = 1e-4;
    expect(e.minus?.flags).toContain('truncated');
    expect((e.minus?.points ?? []).every((p) => Math.abs(p.eps) <= w / 2)).toBe(true);
    expect(e.minus?.points.length).toBeLessThan(e.plus?.points.length as number);
  });
});

describe('pitfall 5: near-degenerate cluster, crossover', () => {
  // Chain with a → b of weight 1 + δ and the probe c → b: μ² − (2+δ+ε)μ + 1 + δ = 0 (by hand), so
  // Re λ2 − 1 = (δ+ε)/2 − √((δ+ε)²/4 + ε): ≈ −ε/δ for ε ≪ δ² and ≈ −√ε for ε ≫ δ². The two laws meet
  // at ε = δ²; the exact derivative at 0 is −1/δ.
  const delta = 0.01;
  const chain = chainWithProbe(1 + delta);
  const e = auditNetwork(chain).edges[edgeIndex(chain, 'c', 'b')];
  const side = e.plus as SignResponse;

  it('the local slope drifts from 1 toward 1/2 and the crossover is flagged near δ²', () => {
    expect(side.flags).toContain('crossover');
    expect(Math.abs((side.slopeSmall as number) - 1)).toBeLessThan(0.07);
    expect(side.slopeLarge as number).toBeLessThan(0.65);
    expect(side.crossoverEps as number).toBeGreaterThan(delta ** 2 / 3);
    expect(side.crossoverEps as number).toBeLessThan(delta ** 2 * 3);
  });

  it('classifies from the small-ε end: linear with c = −1/δ, matching first order', () => {
    expect(side.class).toBe('linear');
    expect(relErr(side.prefactor as number, -1 / delta)).toBeLessThan(0.02);
    expect(relErr(e.sensitivity?.re as number, -1 / delta)).toBeLessThan(1e-6);
  });

  it('its budget follows the exact law, not the linear one', () => {
    // |Δ| = τ·Re λ2 = τ (τ = 0.01). With s = δ + ε: √(s²/4 + ε) − s/2 = τ ⇒ ε = τ² + τs
    // ⇒ ε = τ(τ + δ)/(1 − τ) (by hand).
    const exact = (1e-4 + 0.01 * delta) / 0.99;
    expect(e.tolerance).toBeLessThanOrEqual(exact * (1 + 1e-9));
    expect(e.tolerance).toBeGreaterThan(exact / 1.011);
  });
});
