import { describe, expect, it } from 'vitest';
import { fisherCombination } from './fisher-combination.ts';
import { relativeError } from './testing/exact-reference.ts';

describe("fisherCombination (Fisher 1932, §21.1)", () => {
  it('matches scipy.stats.combine_pvalues(method="fisher")', () => {
    // scipy 1.17.1, computed once: [0.01, 0.2, 0.5] → X² = 13.815510557964274, p = 0.03176629677613493;
    // [0.3, 0.04] → X² = 8.845697258388274, p = 0.06507418355032964. Closed-form Poisson sum: 1e-12.
    const a = fisherCombination([0.01, 0.2, 0.5].map(Math.log));
    expect(relativeError(a.statistic, 13.815510557964274)).toBeLessThan(1e-12);
    expect(a.degreesOfFreedom).toBe(6);
    expect(relativeError(a.pValue, 0.03176629677613493)).toBeLessThan(1e-12);
    const b = fisherCombination([0.3, 0.04].map(Math.log));
    expect(relativeError(b.pValue, 0.06507418355032964)).toBeLessThan(1e-12);
  });

  it('is the χ² upper tail of scipy.stats.chi2.sf for even degrees of freedom', () => {
    // chi2.sf(10, 6) = 0.12465201948308108, chi2.sf(50, 10) = 2.669083424904495e-07 (scipy 1.17.1).
    // X² = 10 over 3 tests: ln p's summing to −5; X² = 50 over 5 tests: summing to −25.
    expect(relativeError(fisherCombination([-1, -2, -2]).pValue, 0.12465201948308108)).toBeLessThan(1e-12);
    expect(relativeError(fisherCombination([-5, -5, -5, -5, -5]).pValue, 2.669083424904495e-7)).toBeLessThan(1e-11);
  });

  it('keeps a combined σ far beyond double range and is exact for one test', () => {
    const one = fisherCombination([Math.log(0.05)]);
    expect(relativeError(one.pValue, 0.05)).toBeLessThan(1e-13);
    const far = fisherCombination([-2000, -0.1]);
    expect(far.pValue).toBe(0);
    expect(Number.isFinite(far.sigma)).toBe(true);
    expect(far.sigma).toBeGreaterThan(60);
    expect(fisherCombination([-Infinity, -1]).sigma).toBe(Infinity);
    expect(() => fisherCombination([])).toThrow(/logPValues.length = 0/);
    expect(() => fisherCombination([0.5])).toThrow(/logPValues\[0\] = 0.5/);
  });
});
