/**
 * Undirected (symmetric) networks: L is symmetric, hence normal and diagonalisable, so no
 * eigenvalue can respond like a root of ε.
 */
import { eigs } from 'mathjs';
import { analyseBaseline, auditNetwork, auditPerturbation, seededUniform, type SpectralNetwork } from '@/lib/spectral';
import { net, relErr, type EdgeRow } from './helpers';

const ROOT_CLASSES = ['square-root', 'cube-root'];

function undirected(pairs: [string, string, number][]): SpectralNetwork {
  const rows: EdgeRow[] = [];
  for (const [u, v, w] of pairs) rows.push([u, v, w], [v, u, w]);
  return net(rows);
}

/** A connected undirected network: a path through all nodes plus random links. */
function randomUndirected(n: number, extra: number, seed: number): SpectralNetwork {
  const rand = seededUniform(seed);
  const names = Array.from({ length: n }, (_, i) => `u${i}`);
  const pairs = new Map<string, [string, string, number]>();
  for (let i = 0; i + 1 < n; i++) pairs.set(`${i}-${i + 1}`, [names[i], names[i + 1], 0.5 + rand()]);
  while (pairs.size < n - 1 + extra) {
    const a = Math.floor(rand() * n);
    const b = Math.floor(rand() * n);
    if (a === b) continue;
    const key = `${Math.min(a, b)}-${Math.max(a, b)}`;
    if (!pairs.has(key)) pairs.set(key, [names[Math.min(a, b)], names[Math.max(a, b)], 0.5 + rand()]);
  }
  return undirected([...pairs.values()]);
}

describe('single directed edges of a symmetric network', () => {
  // For a normal L, every eigenvalue of L + E lies within ‖E‖₂ of an eigenvalue of L
  // (F. L. Bauer & C. T. Fike, "Norms and exclusion theorems", Numer. Math. 2, 1960 — cited from
  // memory). One edge gives ‖ε·∂L_e‖₂ = √2·|ε|, so Δ is O(ε): never a root-type response.
  it.each([
    ['random, simple λ2', randomUndirected(9, 6, 21)],
    // The undirected 5-cycle has λ2 = 2 − 2cos(2π/5) twice (semisimple, not defective).
    ['5-cycle, double λ2', undirected([['a', 'b', 1], ['b', 'c', 1], ['c', 'd', 1], ['d', 'e', 1], ['e', 'a', 1]])],
  ])('%s: no root-type class, |Δ| ≤ √2|ε|', (_, network) => {
    const r = auditNetwork(network);
    for (const e of r.edges) {
      for (const side of [e.plus, e.minus]) {
        expect(ROOT_CLASSES).not.toContain(side?.class);
        for (const p of side?.points ?? []) {
          expect(Math.abs(p.delta)).toBeLessThanOrEqual(Math.SQRT2 * Math.abs(p.eps) + p.floor);
        }
      }
    }
  });

  it('the 5-cycle really has a double λ2 = 2 − 2cos(2π/5)', () => {
    // Eigenvalues of the undirected n-cycle: 2 − 2cos(2πk/n) (P. J. Davis, Circulant Matrices, 1979).
    const b = analyseBaseline(undirected([['a', 'b', 1], ['b', 'c', 1], ['c', 'd', 1], ['d', 'e', 1], ['e', 'a', 1]]));
    expect(b.cluster.size).toBe(2);
    expect(b.lambda2.re).toBeCloseTo(2 - 2 * Math.cos((2 * Math.PI) / 5), 12);
  });
});

describe('both directions of a link changing together', () => {
  const network = randomUndirected(8, 5, 5);
  const b = analyseBaseline(network);
  const n = network.nodes.length;

  /** Unit Fiedler vector from an outside solver (mathjs, symmetric path). */
  function fiedler(): number[] {
    const rows = Array.from({ length: n }, (_, i) => b.laplacian.slice(i * n, i * n + n));
    const { eigenvectors } = eigs(rows) as unknown as { eigenvectors: { value: number; vector: number[] }[] };
    const sorted = [...eigenvectors].sort((x, y) => x.value - y.value);
    const v = sorted[1].vector as number[];
    const norm = Math.hypot(...v);
    return v.map((x) => x / norm);
  }

  it('has a simple λ2 (so the Fiedler formula applies)', () => {
    expect(b.cluster.size).toBe(1);
    expect(b.lambda2.im).toBe(0);
  });

  it('every link: linear with dλ2/dw = (v_u − v_v)², and |Δ| ≤ 2|ε|', () => {
    // dλ2/dw_uv = (v_u − v_v)² for the unit Fiedler vector v (M. Fiedler, "Algebraic connectivity of
    // graphs", Czech. Math. J. 23, 1973); the symmetric change has ‖ε(∂L_uv + ∂L_vu)‖₂ = 2|ε|, which
    // bounds |Δ| by Weyl's inequality (H. Weyl, Math. Ann. 71, 1912).
    const v = fiedler();
    const index = new Map(network.nodes.map((name, i) => [name, i]));
    let links = 0;
    network.edges.forEach((e, k) => {
      const back = network.edges.findIndex((f) => f.source === e.target && f.target === e.source);
      if (back < k) return; // each link once
      links += 1;
      const expected = (v[index.get(e.source) as number] - v[index.get(e.target) as number]) ** 2;
      const audit = auditPerturbation(network, b, [
        { edgeIndex: k, scale: 1 },
        { edgeIndex: back, scale: 1 },
      ]);
      expect(relErr(audit.sensitivity?.re as number, expected)).toBeLessThan(1e-6);
      expect(Math.abs(audit.sensitivity?.im as number)).toBeLessThan(1e-12);
      for (const side of [audit.plus, audit.minus]) {
        expect(ROOT_CLASSES).not.toContain(side?.class);
        for (const p of side?.points ?? []) expect(Math.abs(p.delta)).toBeLessThanOrEqual(2 * Math.abs(p.eps) + p.floor);
      }
      if (expected > 1e-6) {
        expect(audit.plus?.class).toBe('linear');
        expect(audit.minus?.class).toBe('linear');
        expect(relErr(audit.plus?.prefactor as number, expected)).toBeLessThan(0.02);
        expect(relErr(audit.minus?.prefactor as number, -expected)).toBeLessThan(0.02);
      }
    });
    expect(links).toBe(12);
  });
});
