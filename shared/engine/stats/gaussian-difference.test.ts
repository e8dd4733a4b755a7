import { describe, expect, it } from 'vitest';
import { gaussianDifferenceTest } from './gaussian-difference.ts';

describe('gaussianDifferenceTest (errors in quadrature, two-sided normal p)', () => {
  it('gives z = 0.8989, p = 0.3687 for 0.118 ± 0.001 against 0.10 ± 0.02', () => {
    // scipy 1.17.1: 2 · norm.sf(0.018 / hypot(0.02, 0.001)) = 0.368718124222824.
    const r = gaussianDifferenceTest(0.118, 0.001, 0.1, 0.02);
    expect(r.z).toBeCloseTo(0.8988771049900601, 12);
    expect(r.pValue).toBeCloseTo(0.368718124222824, 12);
    expect(r.sigma).toBeCloseTo(0.8988771049900601, 10);
  });

  it('gives the normal log-density as its log-likelihood and refuses two zero errors', () => {
    // ln φ(0)/σ = −ln σ − ½ ln 2π (common practice, no source).
    expect(gaussianDifferenceTest(1, 0, 1, 0.5).logLikelihood).toBeCloseTo(-Math.log(0.5) - 0.5 * Math.log(2 * Math.PI), 14);
    expect(() => gaussianDifferenceTest(1, 0, 1, 0)).toThrow(/error = 0/);
  });
});
