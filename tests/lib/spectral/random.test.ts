/**
 * A random N = 30 network: λ2 simple, so every edge must respond linearly and its fitted prefactor
 * must agree with first-order perturbation theory.
 *
 * The full sweep runs through the CLI in a child process: inside jest's module sandbox the
 * eigen-solver runs several times slower, and the CLI path gets exercised on a real-sized file.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { analyseBaseline, randomNetwork, type AuditResult, type SpectralNetwork } from '@/lib/spectral';
import { relErr } from './helpers';
import { runAudit } from './cli-run';

const network = randomNetwork({ nodes: 30, seed: 30 });
let result: AuditResult;

beforeAll(() => {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hairline-spectral-'));
  const file = path.join(dir, 'random-30.csv');
  // String(w) is the shortest round-trip form: the file holds exactly these weights.
  writeFileSync(file, ['source,target,weight', ...network.edges.map((e) => `${e.source},${e.target},${String(e.weight)}`)].join('\n'));
  const run = runAudit([file]);
  expect(run.stderr).toBe('');
  expect(run.status).toBe(0);
  result = JSON.parse(run.stdout) as AuditResult;
}, 120_000);

function withWeight(base: SpectralNetwork, index: number, weight: number): SpectralNetwork {
  return { nodes: base.nodes, edges: base.edges.map((e, i) => (i === index ? { ...e, weight } : e)) };
}

describe('random directed network, N = 30, about 5 edges per node', () => {
  it('has a simple λ2, the same as the in-process baseline', () => {
    expect(result.cluster.size).toBe(1);
    expect(result.edges).toHaveLength(150);
    expect(result.lambda2.re).toBeCloseTo(analyseBaseline(network).lambda2.re, 12);
  });

  it('every edge is linear on both signs (issue 3, check "random networks")', () => {
    const notLinear = result.edges.flatMap((e) =>
      (['plus', 'minus'] as const).filter((s) => e[s]?.class !== 'linear').map((s) => `${e.source}→${e.target} ${s}: ${e[s]?.class}`),
    );
    expect(notLinear).toEqual([]);
  });

  it('fitted prefactors match Re dλ2/dw from left and right eigenvectors within 2 %', () => {
    // dλ = yᴴ ∂L x / yᴴ x for a simple eigenvalue (first-order perturbation theory, e.g.
    // J. H. Wilkinson, The Algebraic Eigenvalue Problem, 1965 — cited from memory).
    for (const e of result.edges) {
      const d = e.sensitivity?.re as number;
      expect(relErr(e.plus?.prefactor as number, d)).toBeLessThan(0.02);
      expect(relErr(e.minus?.prefactor as number, -d)).toBeLessThan(0.02);
    }
  });

  it('sensitivities satisfy Σ w_e dλ2/dw_e = λ2', () => {
    // λ2(s·w) = s·λ2(w) (L is linear in the weights), so Euler's theorem on homogeneous functions
    // gives the identity — derived by hand.
    let re = 0;
    let im = 0;
    result.edges.forEach((e) => {
      re += e.weight * (e.sensitivity?.re as number);
      im += e.weight * (e.sensitivity?.im as number);
    });
    expect(re).toBeCloseTo(result.lambda2.re, 9);
    expect(im).toBeCloseTo(result.lambda2.im, 9);
  });

  it('budgets hold when recomputed independently, and are tight within 10 % when a sign limits them', () => {
    const tau = result.tolerance;
    const re0 = result.lambda2.re;
    for (const e of result.edges.slice(0, 12)) {
      const change = (w: number) => Math.abs(analyseBaseline(withWeight(network, e.index, w)).lambda2.re - re0);
      expect(change(e.weight + e.tolerance)).toBeLessThanOrEqual(tau * re0 * (1 + 1e-9));
      expect(change(e.weight - e.tolerance)).toBeLessThanOrEqual(tau * re0 * (1 + 1e-9));
      // Tightness where 10 % more is still a feasible weight change on the limiting side.
      const over = e.tolerance * 1.1;
      if (e.budget.limitedBy === 'plus') expect(change(e.weight + over)).toBeGreaterThan(tau * re0);
      if (e.budget.limitedBy === 'minus' && e.weight - over >= 0) expect(change(e.weight - over)).toBeGreaterThan(tau * re0);
    }
  });
});
