import { render, screen } from '@testing-library/react';
import { HelpScreen } from '@/components/help/help-screen';
import { toleranceFor } from '@/components/help/tolerance-examples';

describe('help page tolerance example', () => {
  test('|ε| ≤ (τ·Re λ2/|c|)^(1/p): the inverse of |Δ| = c|ε|^p (closed form, derived by hand)', () => {
    expect(toleranceFor(1, 1, 0.01, 2)).toBeCloseTo(0.02, 12);
    expect(toleranceFor(1 / 2, 1, 0.01, 2)).toBeCloseTo(4e-4, 12);
    expect(toleranceFor(1 / 3, 1, 0.01, 2)).toBeCloseTo(8e-6, 12);
    expect(toleranceFor(1 / 2, -0.5, 0.01, 2)).toBeCloseTo(1.6e-3, 12);
  });

  test('the page states the three tolerances and the ratio it derives from them', () => {
    render(<HelpScreen />);
    expect(screen.getByText('|ε| ≤ 0.020')).toBeTruthy();
    expect(screen.getByText('|ε| ≤ 4.0×10⁻⁴')).toBeTruthy();
    expect(screen.getByText('|ε| ≤ 8.0×10⁻⁶')).toBeTruthy();
    expect(screen.getByText(/about 2500 times/)).toBeTruthy();
  });
});
