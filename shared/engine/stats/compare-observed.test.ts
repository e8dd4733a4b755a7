import { describe, expect, it } from 'vitest';
import { binomialTestTwoSided } from './binomial-test.ts';
import { clopperPearson } from './clopper-pearson.ts';
import { MC_ERROR_NEGLIGIBLE_RATIO, compareWithObserved } from './compare-observed.ts';
import { sigmaFromTwoSidedP } from './significance.ts';
import { exactBinomialTest, relativeError } from './testing/exact-reference.ts';

describe('compareWithObserved', () => {
  it('handles zero magnetic among 37 white dwarfs with a detached companion against a 2.1% prediction', () => {
    // 0.78 magnetic are expected and P(0) = 0.979^37 = 0.456 is the most likely count, so the
    // two-sided exact p-value is 1. Observed 95% interval [0, 1 − 0.025^(1/37)] = [0, 0.0949].
    const predicted = Object.freeze({ value: 0.021, se: 0.001 });
    const observed = Object.freeze({ magnetic: 0, total: 37 });
    const result = compareWithObserved(predicted, observed);
    expect(result.pValue).toBe(1);
    expect(result.sigma).toBe(0);
    expect(result.observed.fraction).toBe(0);
    expect(result.observed.interval95[0]).toBe(0);
    expect(relativeError(result.observed.interval95[1], 1 - 0.025 ** (1 / 37))).toBeLessThan(1e-12);
    expect(relativeError(result.observed.interval68[1], 1 - 0.16 ** (1 / 37))).toBeLessThan(1e-12);
    expect(result.predictedInside68).toBe(true);
    expect(result.predictedInside95).toBe(true);
    expect(result.mcErrorMatters).toBe(false); // 0.001 against a 68% half-width of 0.024
    expect(result.summary).toBe(
      'The observed 0 of 37 (0%; 95% interval 0–9.5%) is consistent with the predicted 2.10% ± 0.10% (p = 1, 0.0σ).',
    );
    expect(result.method).toMatch(/binomial test/);
    expect(result.method).toMatch(/Clopper–Pearson/);
  });

  it('words larger predictions against 0 of 37 by their significance, with p and σ from the exact test', () => {
    // Exact rational p-values: 2.374e-6 against 30% (4.7σ) and 6.87e-9 against 40% (5.8σ); the
    // wording thresholds are 3σ ("strong tension") and 5σ ("rules out").
    const strong = compareWithObserved({ value: 0.3, se: 0.002 }, { magnetic: 0, total: 37 });
    expect(relativeError(strong.pValue, exactBinomialTest(0, 37, 3, 10))).toBeLessThan(1e-11);
    expect(relativeError(strong.sigma, sigmaFromTwoSidedP(strong.pValue))).toBeLessThan(1e-12);
    expect(strong.predictedInside95).toBe(false);
    expect(strong.summary).toMatch(/is in strong tension with the predicted 30\.00% ± 0\.20% \(p = 2\.4 × 10⁻⁶, 4\.7σ\)\.$/);
    const excluded = compareWithObserved({ value: 0.4, se: 0.002 }, { magnetic: 0, total: 37 });
    expect(relativeError(excluded.pValue, exactBinomialTest(0, 37, 2, 5))).toBeLessThan(1e-11);
    expect(excluded.summary).toMatch(/rules out the predicted 40\.00% ± 0\.20% \(p = 6\.9 × 10⁻⁹, 5\.8σ\)\.$/);
  });

  it('stays finite for n = 1e6 where the p-value underflows', () => {
    const result = compareWithObserved({ value: 0.5, se: 0 }, { magnetic: 0, total: 1e6 });
    expect(result.pValue).toBe(0);
    expect(Number.isFinite(result.sigma)).toBe(true);
    expect(result.sigma).toBeGreaterThan(1000); // √(2 · 1e6 ln 2) ≈ 1177
    expect(result.summary).toMatch(/p = 2\.0 × 10⁻³⁰¹⁰³⁰/); // 2 · 2^−1e6
    expect(JSON.parse(JSON.stringify(result))).toEqual(result); // all fields finite, JSON-safe
  });

  it('matches its parts for a mid-sized sample and flags the Monte Carlo error above the threshold', () => {
    const observed = { magnetic: 3, total: 20 };
    const ci68 = clopperPearson(3, 20, 0.68);
    const halfWidth = 0.5 * (ci68.upper - ci68.lower);
    const below = compareWithObserved({ value: 0.1, se: 0.99 * MC_ERROR_NEGLIGIBLE_RATIO * halfWidth }, observed);
    const above = compareWithObserved({ value: 0.1, se: 1.01 * MC_ERROR_NEGLIGIBLE_RATIO * halfWidth }, observed);
    expect(below.mcErrorMatters).toBe(false);
    expect(above.mcErrorMatters).toBe(true);
    expect(above.summary).toMatch(/Monte Carlo error is not negligible/);
    expect(below.pValue).toBe(binomialTestTwoSided(3, 20, 0.1));
    expect(below.observed.interval68).toEqual([ci68.lower, ci68.upper]);
    expect(below.predictedInside68).toBe(ci68.lower <= 0.1 && 0.1 <= ci68.upper);
  });

  it('gives sigma = +∞ only when a prediction of exactly 0 meets a magnetic white dwarf', () => {
    const result = compareWithObserved({ value: 0, se: 0 }, { magnetic: 1, total: 10 });
    expect(result.pValue).toBe(0);
    expect(result.sigma).toBe(Infinity);
    expect(result.summary).toMatch(/rules out the predicted 0% \(p = 0, ∞σ\)\.$/);
    expect(compareWithObserved({ value: 0, se: 0 }, { magnetic: 0, total: 10 }).pValue).toBe(1);
  });

  it('returns plain data and does not touch its inputs', () => {
    const predicted = { value: 0.1, se: 0.01 };
    const observed = { magnetic: 3, total: 20 };
    const result = compareWithObserved(predicted, observed);
    expect(structuredClone(result)).toEqual(result);
    expect(predicted).toEqual({ value: 0.1, se: 0.01 });
    expect(observed).toEqual({ magnetic: 3, total: 20 });
    result.predicted.value = 0.5;
    expect(predicted.value).toBe(0.1);
  });

  it('rejects invalid input naming the field', () => {
    expect(() => compareWithObserved({ value: 1.2, se: 0 }, { magnetic: 1, total: 2 })).toThrow(/^predicted.value = 1.2/);
    expect(() => compareWithObserved({ value: 0.2, se: -1 }, { magnetic: 1, total: 2 })).toThrow(/^predicted.se = -1/);
    expect(() => compareWithObserved({ value: 0.2, se: 0 }, { magnetic: 3, total: 2 })).toThrow(
      'observed.magnetic = 3 is outside the allowed range integers 0 … 2 (observed.total = 2)',
    );
    expect(() => compareWithObserved({ value: 0.2, se: 0 }, { magnetic: 0, total: 0 })).toThrow(/^observed.total = 0/);
  });
});
