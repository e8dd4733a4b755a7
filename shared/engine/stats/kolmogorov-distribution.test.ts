import { describe, expect, it } from 'vitest';
import { kolmogorovUpperTail } from './kolmogorov-distribution.ts';
import { relativeError } from './testing/exact-reference.ts';

describe('kolmogorovUpperTail (Kolmogorov 1933; Numerical Recipes eqs. 6.14.56–57)', () => {
  it('matches scipy.stats.kstwobign.sf on both sides of the switch at λ = 1.18', () => {
    // scipy 1.17.1, computed once: python3 -c "from scipy import stats; print(stats.kstwobign.sf(lam))".
    // Both series converge to double precision, so 1e-12 relative.
    const reference: [number, number][] = [
      [0.5, 0.9639452436648751],
      [0.8, 0.5441424115741981],
      [1.0, 0.26999967167735456],
      [1.36, 0.049485876755377876],
      [1.63, 0.009846364888486529],
      [2.0, 0.0006709252557796953],
    ];
    for (const [lambda, q] of reference) expect(relativeError(kolmogorovUpperTail(lambda), q)).toBeLessThan(1e-12);
  });

  it('is 1 at 0, 0 at infinity, and refuses negative λ', () => {
    expect(kolmogorovUpperTail(0)).toBe(1);
    expect(kolmogorovUpperTail(Infinity)).toBe(0);
    expect(() => kolmogorovUpperTail(-0.1)).toThrow(/lambda = -0.1 is outside the allowed range/);
  });
});
