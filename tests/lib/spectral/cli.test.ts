/**
 * The audit CLI: one JSON document on stdout; on bad input a non-zero exit and one stderr line
 * naming the file and the line.
 */
import path from 'node:path';
import type { AuditResult } from '@/lib/spectral';
import { runAudit } from './cli-run';

const fixture = (name: string) => path.join('tests', 'fixtures', 'spectral', name);
const CLASSES = ['linear', 'square-root', 'cube-root', 'quadratic', 'flat', 'other'];

describe('audit CLI', () => {
  it('prints the audit of a CSV as one JSON document', () => {
    const run = runAudit([fixture('triangle.csv')]);
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('');
    const doc = JSON.parse(run.stdout) as AuditResult;
    expect(doc.convention).toBe('in');
    expect(doc.lambda2.re).toBeCloseTo(2, 12);
    expect(doc.rooted).toBe(true);
    expect(doc.cluster).toMatchObject({ size: 2 });
    expect(doc.spectrum).toHaveLength(3);
    expect(doc.edges).toHaveLength(4);
    for (const e of doc.edges) {
      expect(typeof e.source).toBe('string');
      expect(typeof e.tolerance).toBe('number');
      for (const side of [e.plus, e.minus]) {
        expect(CLASSES).toContain(side?.class);
        expect(Array.isArray(side?.flags)).toBe(true);
        for (const p of side?.points ?? []) {
          expect(Object.values(p).every((v) => typeof v === 'number')).toBe(true);
        }
      }
    }
    // Same laws as the in-process closed-form test: 2→1 is square-root on +ε.
    expect(doc.edges.find((e) => e.source === '2' && e.target === '1')?.plus?.class).toBe('square-root');
  });

  it('honours --convention and --tolerance', () => {
    const run = runAudit([fixture('triangle.csv'), '--convention', 'out', '--tolerance', '0.05']);
    expect(run.status).toBe(0);
    const doc = JSON.parse(run.stdout) as AuditResult;
    expect(doc.convention).toBe('out');
    expect(doc.tolerance).toBe(0.05);
    // Out-degree Laplacian rows (1, −1, 0), (−1, 2, −1), (−1, 0, 1): trace 4 and principal 2×2 minors
    // summing to 4 give μ(μ − 2)² — λ2 = 2 again (derived by hand).
    expect(doc.lambda2.re).toBeCloseTo(2, 12);
    for (const e of doc.edges) expect(e.budget.allowedDelta).toBeCloseTo(0.05 * doc.lambda2.re, 12);
  });

  it('bad row: non-zero exit, one stderr line with file and line number, nothing on stdout', () => {
    const run = runAudit([fixture('bad-weight.csv')]);
    expect(run.status).not.toBe(0);
    expect(run.stdout).toBe('');
    const lines = run.stderr.split('\n').filter(Boolean);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain(`${fixture('bad-weight.csv')}:3`);
  });

  it('missing file and bad options: one stderr line each', () => {
    for (const args of [['no-such-file.csv'], [fixture('triangle.csv'), '--convention', 'sideways'], []]) {
      const run = runAudit(args);
      expect(run.status).not.toBe(0);
      expect(run.stdout).toBe('');
      expect(run.stderr.split('\n').filter(Boolean)).toHaveLength(1);
    }
    expect(runAudit(['no-such-file.csv']).stderr).toContain('no-such-file.csv');
  });

});
