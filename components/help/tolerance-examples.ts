/**
 * The worked example of the help page: with |Δ| = c·|ε|^p and an allowed
 * change of τ·Re λ2, the largest safe |ε| is (τ·Re λ2 / |c|)^(1/p).
 */
export function toleranceFor(p: number, c: number, tau: number, reLambda2: number): number {
  return (tau * reLambda2 / Math.abs(c)) ** (1 / p);
}

export const helpExample = { reLambda2: 2, tau: 0.01, c: 1 } as const;

export const laws = [
  { key: 'linear', glyph: '╱', name: 'linear', p: 1, words: 'λ2 is simple: it moves in proportion to the weight change.' },
  { key: 'square-root', glyph: '√', name: 'square-root', p: 1 / 2, words: 'two eigenvalues meet in a 2×2 Jordan block; a tiny change splits them apart fast.' },
  { key: 'cube-root', glyph: '∛', name: 'cube-root', p: 1 / 3, words: 'three eigenvalues meet in a 3×3 Jordan block; the most fragile case Hairline names.' },
] as const;
