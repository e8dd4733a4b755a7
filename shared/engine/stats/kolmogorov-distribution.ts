import { EngineError } from '../errors.ts';

/**
 * Upper tail of Kolmogorov's limiting distribution, Q_KS(λ) = P(√n D_n > λ) as n → ∞:
 * Q_KS(λ) = 2 Σ_{j≥1} (−1)^(j−1) e^(−2 j² λ²) (Kolmogorov 1933, Giornale dell'Istituto Italiano
 * degli Attuari 4, 83; as written in Press et al. 2007, Numerical Recipes, 3rd ed., eq. 6.14.56).
 * For small λ that alternating series converges slowly and cancels, so below λ = 1.18 the
 * equivalent theta-function form 1 − Q_KS(λ) = (√(2π)/λ) Σ_{j≥1} e^(−(2j−1)² π² / (8 λ²))
 * (Numerical Recipes eq. 6.14.57) is used instead; both converge to machine precision in a few terms.
 * Dimensionless. Valid for λ ≥ 0 (Q_KS(0) = 1, Q_KS(∞) = 0).
 * Example: kolmogorovUpperTail(1.36) = 0.04949 (the familiar 5% point of the KS test).
 */
export function kolmogorovUpperTail(lambda: number): number {
  if (Number.isNaN(lambda) || lambda < 0) throw new EngineError('lambda', lambda, '[0, Infinity]');
  if (lambda === 0) return 1;
  if (lambda === Infinity) return 0;
  if (lambda < 1.18) {
    const y = Math.exp((-Math.PI * Math.PI) / (8 * lambda * lambda));
    // Σ y^((2j−1)²) = y + y^9 + y^25 + y^49 …; y < 0.42 here, so four terms reach 1e-16.
    const sum = y + Math.pow(y, 9) + Math.pow(y, 25) + Math.pow(y, 49) + Math.pow(y, 81);
    return Math.min(1, Math.max(0, 1 - (Math.sqrt(2 * Math.PI) / lambda) * sum));
  }
  const x = Math.exp(-2 * lambda * lambda);
  // x ≤ 0.062 here: x − x⁴ + x⁹ − x¹⁶ … reaches 1e-16 relative within four terms.
  return Math.max(0, 2 * (x - Math.pow(x, 4) + Math.pow(x, 9) - Math.pow(x, 16)));
}
