/**
 * Property tests (fast-check) of invariants the engine must keep whatever the
 * network. Small networks only (N ≤ 8, few runs): ml-matrix's eigen-solver is
 * several times slower inside jest than in plain node.
 *
 * Where each invariant comes from:
 * - Row sums of the Laplacian are zero: the definition L = D − A (each row
 *   holds a node's weighted in-degree on the diagonal and minus the same
 *   weights off it). Common practice, no source.
 * - Permuting node order leaves the spectrum unchanged: relabelling is
 *   L ↦ P L Pᵀ with P a permutation matrix, Pᵀ = P⁻¹, a similarity
 *   transform, and similar matrices have the same characteristic polynomial
 *   (G. Strang, Linear Algebra and Its Applications, 4th ed., 2006, the
 *   section on similar matrices; cited from memory).
 * - Scaling every weight by c > 0 scales every eigenvalue by c and leaves
 *   exponents and classes unchanged: L is linear in the weights, so
 *   (cL)x = (cλ)x — linearity of the eigenvalue problem, common practice, no
 *   source. The ladder is ε = ±w̄·10^(−t) and w̄ scales with c, so every
 *   point becomes (cε, cΔ): both axes of the log–log fit shift by log c and
 *   every slope is the same (derived here).
 *
 * The scaling property is checked on generic networks (random weights, hence
 * simple eigenvalues), and on the defective triangle 1→2, 2→3, 3→1, 2→1 whose
 * −ε class of 1→2 and 3→1 was once seen to flip from `linear` to `other` with
 * every weight 15.419474700104644. Two kinds of scale dependence exist:
 * - Defects: anything computed on a quantity that does not scale with the
 *   weights. Scaling by a power of two is exact in floating point, so then
 *   every Δ and every floor must come out exactly c times the original. That
 *   check found the fast path's floor anchor bisecting on log η between
 *   log(1e-30·s) and log(1e-2·s), whose rounding depends on c: on the
 *   four-cycle the flat-side floors moved by 3× under c = 2 (now bisected on
 *   log(η/s)). The same search found an absolute 1e-9·max(maxDegree, 1) guard.
 * - Round-off: for a general c the solves round differently. Near a Jordan
 *   block of size k the perturbed λ2 is ill-conditioned (error ~u‖L‖²/|ε| for
 *   k = 2), so the smallest-ε points differ by a few per cent between scalings,
 *   and whether a point just above its floor (floor = 10 × estimated error)
 *   enters the run is decided by that round-off. Such a point shifts log|Δ| by
 *   at most log10(1.1) ≈ 0.041; in the 11-point whole-run fit (x spaced 0.5)
 *   an end point's leverage is 2.5/27.5, so the fitted exponent moves by about
 *   0.004 per point — two points per comparison give the 0.01 used below. The
 *   class slope (three smallest points, one decade) moves by up to ~0.045,
 *   inside the ±0.07 window around the triangle's exact 1 and 1/2 only while
 *   the floor estimate is honest; a side that is exactly flat stays flat only
 *   while every rounding Δ stays under its floor. Both are races between
 *   round-off and an estimate of it, which is why the triangle is checked at
 *   the named factors rather than at random ones (over 150 random factors in
 *   [1e-3, 1e3] the triangle kept its classes; the four-cycle's flat +ε of 2→3
 *   came out `other`/low-signal at 3 of them; see lib/spectral/README.md).
 */
import fc from 'fast-check';
import { analyseBaseline, auditEdge, buildLaplacian, edgeSlots, summariseNetwork, type Complex, type Convention, type EdgeResult, type SpectralNetwork } from '@/lib/spectral';
import { fourCycleWithChords, triangleWithChord } from './networks';

/** Rooted networks of 3…maxNodes nodes: a directed cycle through every node plus random extra edges. */
function generic(maxNodes: number): fc.Arbitrary<SpectralNetwork> {
  return fc.integer({ min: 3, max: maxNodes }).chain((n) =>
    fc
      .record({
        order: fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }),
        extra: fc.uniqueArray(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), { maxLength: 2 * n, selector: ([s, t]) => s * n + t }),
        weights: fc.array(fc.double({ min: 0.2, max: 5, noNaN: true }), { minLength: 3 * n, maxLength: 3 * n }),
      })
      .map(({ order, extra, weights }) => {
        const nodes = Array.from({ length: n }, (_, i) => `korrin-${i}`);
        const pairs = new Map<number, [number, number]>();
        order.forEach((s, i) => pairs.set(s * n + order[(i + 1) % n], [s, order[(i + 1) % n]]));
        for (const [s, t] of extra) if (s !== t) pairs.set(s * n + t, [s, t]);
        const edges = [...pairs.values()].map(([s, t], k) => ({ source: nodes[s], target: nodes[t], weight: weights[k % weights.length] }));
        return { nodes, edges };
      }),
  );
}

/**
 * Pairs each eigenvalue of `a` with the nearest one left in `b` and checks the distance. A
 * well-separated eigenvalue is computed to ~u·‖L‖; members of a close group (a near-defective
 * eigenvalue, as the shrinker likes to find) only to ~‖L‖·u^(1/k) each (k ≤ 3 here), while their
 * mean stays accurate — which is why the engine reports a cluster's mean as λ2.
 */
function expectSameSpectrum(a: Complex[], b: Complex[], scale: number): void {
  expect(b).toHaveLength(a.length);
  const gap = (z: Complex) => Math.min(...a.filter((w) => w !== z).map((w) => Math.hypot(w.re - z.re, w.im - z.im)));
  const left = [...b];
  for (const z of a) {
    const distance = (w: Complex) => Math.hypot(w.re - z.re, w.im - z.im);
    const best = left.reduce((bi, w, i) => (distance(w) < distance(left[bi]) ? i : bi), 0);
    const allowed = gap(z) > 1e-3 * scale ? 1e-9 * scale : 1e-5 * scale;
    expect(distance(left[best])).toBeLessThanOrEqual(allowed);
    left.splice(best, 1);
  }
}

const normF = (net: SpectralNetwork) => {
  const L = buildLaplacian(net.nodes.length, edgeSlots(net, 'in'), net.edges.map((e) => e.weight));
  return Math.sqrt(L.reduce((s, x) => s + x * x, 0));
};

describe('Laplacian: every row sums to zero (definition of L = D − A)', () => {
  it('for any weights, weight-0 probes and self-loops, in both conventions', () => {
    const anyNetwork = fc.integer({ min: 1, max: 12 }).chain((n) =>
      fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1), fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 1e6, noNaN: true }))), { maxLength: 40 }).map((rows) => ({
        nodes: Array.from({ length: n }, (_, i) => `gannet-${i}`),
        edges: rows.map(([s, t, w]) => ({ source: `gannet-${s}`, target: `gannet-${t}`, weight: w })),
      })),
    );
    fc.assert(
      fc.property(anyNetwork, fc.constantFrom<Convention>('in', 'out'), (net, convention) => {
        const n = net.nodes.length;
        const slots = edgeSlots(net, convention);
        const L = buildLaplacian(n, slots, net.edges.map((e) => e.weight));
        for (let r = 0; r < n; r++) {
          const row = L.slice(r * n, (r + 1) * n);
          // Exact in real arithmetic; in floating point each addition into the row may round by half an ulp
          // of the weights written there (a self-loop adds and removes its weight in the same cell).
          const written = slots.reduce((s, slot, k) => (slot.row === r ? s + 2 * net.edges[k].weight : s), 0);
          expect(Math.abs(row.reduce((s, x) => s + x, 0))).toBeLessThanOrEqual(2 * (net.edges.length + n) * Number.EPSILON * written);
          row.forEach((x, c) => (c === r ? expect(x).toBeGreaterThanOrEqual(0) : expect(x).toBeLessThanOrEqual(0)));
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('permuting node and edge order leaves the spectrum unchanged (similarity transform)', () => {
  it('same eigenvalues, same λ2, same reachability', () => {
    fc.assert(
      fc.property(generic(8), fc.infiniteStream(fc.nat()), (net, draws) => {
        const it = draws[Symbol.iterator]();
        const shuffle = <T>(xs: T[]) => {
          const out = [...xs];
          for (let i = out.length - 1; i > 0; i--) {
            const j = it.next().value % (i + 1);
            [out[i], out[j]] = [out[j], out[i]];
          }
          return out;
        };
        const permuted = { nodes: shuffle(net.nodes), edges: shuffle(net.edges) };
        const a = summariseNetwork(net);
        const b = summariseNetwork(permuted);
        const tol = 1e-9 * (1 + normF(net));
        expectSameSpectrum(a.spectrum, b.spectrum, 1 + normF(net));
        expect(Math.abs(a.lambda2.re - b.lambda2.re)).toBeLessThanOrEqual(tol);
        expect(Math.abs(Math.abs(a.lambda2.im) - Math.abs(b.lambda2.im))).toBeLessThanOrEqual(tol);
        expect(b.rooted).toBe(a.rooted);
        expect([...b.roots].sort()).toEqual([...a.roots].sort());
      }),
      { numRuns: 40 },
    );
  });
});

describe('scaling every weight by c scales every eigenvalue by c (linearity of the eigenvalue problem)', () => {
  const factor = fc.double({ min: Math.log(1e-3), max: Math.log(1e3), noNaN: true }).map(Math.exp);
  const scale = (net: SpectralNetwork, c: number): SpectralNetwork => ({ nodes: net.nodes, edges: net.edges.map((e) => ({ ...e, weight: e.weight * c })) });

  it('spectrum and λ2 are c times the originals', () => {
    fc.assert(
      fc.property(generic(8), factor, (net, c) => {
        const a = summariseNetwork(net);
        const b = summariseNetwork(scale(net, c));
        const tol = 1e-9 * (1 + normF(net));
        expectSameSpectrum(a.spectrum, b.spectrum.map((z) => ({ re: z.re / c, im: z.im / c })), 1 + normF(net));
        expect(Math.abs(b.lambda2.re / c - a.lambda2.re)).toBeLessThanOrEqual(tol);
      }),
      { numRuns: 40 },
    );
  });

  it('classes and exponents are unchanged, and tolerances scale by c', () => {
    fc.assert(
      fc.property(generic(5), factor, fc.nat(), (net, c, pick) => {
        const scaled = scale(net, c);
        const base = analyseBaseline(net);
        const baseScaled = analyseBaseline(scaled);
        for (const k of [pick % net.edges.length, (pick + 1) % net.edges.length]) {
          const r = auditEdge(net, base, k);
          const s = auditEdge(scaled, baseScaled, k);
          for (const sign of ['plus', 'minus'] as const) {
            expect(s[sign]?.class).toBe(r[sign]?.class);
            if (r[sign]?.exponent != null) expect(Math.abs(s[sign]!.exponent! - r[sign]!.exponent!)).toBeLessThanOrEqual(1e-4);
          }
          expect(Math.abs(s.tolerance / c - r.tolerance)).toBeLessThanOrEqual(1e-6 * r.tolerance);
        }
      }),
      { numRuns: 8 },
    );
  });
  const auditAll = (net: SpectralNetwork): EdgeResult[] => {
    const base = analyseBaseline(net);
    return net.edges.map((_, k) => auditEdge(net, base, k));
  };

  it.each([
    ['triangle with a chord (Jordan 2)', triangleWithChord],
    ['4-cycle with chords (Jordan 3)', fourCycleWithChords],
  ])('%s: a power-of-two factor scales every Δ and every floor exactly', (_, net) => {
    const reference = auditAll(net);
    for (const c of [2 ** -20, 2 ** -7, 2, 2 ** 13]) {
      const scaled = auditAll(scale(net, c));
      scaled.forEach((s, k) => {
        const r = reference[k];
        for (const sign of ['plus', 'minus'] as const) {
          expect(s[sign]?.class).toBe(r[sign]?.class);
          expect(s[sign]!.points.map((p) => [p.eps / c, p.delta / c, p.floor / c, p.used])).toEqual(r[sign]!.points.map((p) => [p.eps, p.delta, p.floor, p.used]));
          // log10 of c·x is log10 c + log10 x only up to rounding, so the fitted slope may move in its last bits.
          if (r[sign]?.exponent != null) expect(Math.abs(s[sign]!.exponent! - r[sign]!.exponent!)).toBeLessThanOrEqual(1e-12);
        }
        expect(Math.abs(s.tolerance / c - r.tolerance)).toBeLessThanOrEqual(1e-12 * r.tolerance);
      });
    }
  });

  it('triangle with a chord at 1e-3, 0.37, 15.4194747…, 1e3: same classes, exponents within round-off', () => {
    const reference = auditAll(triangleWithChord);
    // The closed forms (closed-forms.test.ts) fix what the reference must say, so a shared wrong answer cannot pass.
    expect(reference.map((e) => [e.plus?.class, e.minus?.class])).toEqual([
      ['flat', 'linear'],
      ['linear', 'square-root'],
      ['flat', 'linear'],
      ['square-root', 'linear'],
    ]);
    for (const c of [1e-3, 0.37, 15.419474700104644, 1e3]) {
      const scaled = auditAll(scale(triangleWithChord, c));
      scaled.forEach((s, k) => {
        const r = reference[k];
        for (const sign of ['plus', 'minus'] as const) {
          expect({ c, edge: k, sign, cls: s[sign]?.class }).toEqual({ c, edge: k, sign, cls: r[sign]?.class });
          if (r[sign]?.exponent != null) expect(Math.abs(s[sign]!.exponent! - r[sign]!.exponent!)).toBeLessThanOrEqual(0.01);
          else expect(s[sign]?.exponent).toBeNull();
        }
        expect(Math.abs(s.tolerance / c - r.tolerance)).toBeLessThanOrEqual(1e-6 * r.tolerance);
      });
    }
  });
});
