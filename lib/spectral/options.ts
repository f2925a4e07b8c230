import type { ResolvedOptions, SpectralOptions } from './types';
import { SpectralInputError } from './errors';

/** Default ladder: ε = ±w̄·10^(−t) for t = 2, 2.5, …, 7 (11 points per sign). */
export const DEFAULT_LADDER = Object.freeze({ from: 2, to: 7, step: 0.5 });

/** Fill in defaults and reject options that would make the sweep meaningless. */
export function resolveOptions(options: SpectralOptions = {}): ResolvedOptions {
  const ladder = options.ladder ?? DEFAULT_LADDER;
  if (!(ladder.step > 0) || !Number.isFinite(ladder.from) || !Number.isFinite(ladder.to) || ladder.to < ladder.from) {
    throw new SpectralInputError('ladder needs finite from ≤ to and a positive step');
  }
  const tolerance = options.tolerance ?? 0.01;
  if (!(tolerance > 0) || !Number.isFinite(tolerance)) {
    throw new SpectralInputError('tolerance must be a positive number');
  }
  const signs = options.signs ?? ['plus', 'minus'];
  for (const s of signs) {
    if (s !== 'plus' && s !== 'minus') throw new SpectralInputError(`unknown sign ${String(s)}`);
  }
  const convention = options.convention ?? 'in';
  if (convention !== 'in' && convention !== 'out') {
    throw new SpectralInputError(`unknown convention ${String(convention)}`);
  }
  const clusterTolerance = options.clusterTolerance ?? 1e-6;
  if (!(clusterTolerance >= 0)) throw new SpectralInputError('clusterTolerance must be ≥ 0');
  const floorSafety = options.floorSafety ?? 10;
  if (!(floorSafety >= 1)) throw new SpectralInputError('floorSafety must be ≥ 1');
  const method = options.method ?? 'fast';
  if (method !== 'fast' && method !== 'exact') throw new SpectralInputError(`unknown method ${String(method)}`);
  return {
    convention,
    ladder: { from: ladder.from, to: ladder.to, step: ladder.step },
    signs: [...new Set(signs)],
    tolerance,
    clusterTolerance,
    noiseFloor: options.noiseFloor ?? 'auto',
    floorSafety,
    method,
  };
}
