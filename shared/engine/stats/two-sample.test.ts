import { describe, expect, it } from 'vitest';
import { chunkUniform } from '../random.ts';
import { logHypergeometricPmf } from './hypergeometric-pmf.ts';
import { sigmaFromLogTwoSidedP, sigmaFromTwoSidedP, twoSidedPFromSigma } from './significance.ts';
import { choose, exactFisherTest, relativeError, toNumber } from './testing/exact-reference.ts';
import { jStat } from './testing/jstat-reference.ts';
import { sameFractionTest } from './two-sample.ts';

describe('logHypergeometricPmf (Loader 2000, through three binomial terms)', () => {
  it('matches C(K,x) C(N−K,n−x) / C(N,n) in exact arithmetic and jStat.hypgeom.pdf', () => {
    // Three Loader log terms, each good to ~1e-15 · max(1, |ln P|) (see logBinomialPmf), so the
    // log of the result to 1e-13 · max(1, |ln P|). jStat's scaled product is good to ~1e-12.
    for (const [marked, unmarked, drawn] of [[4, 4, 4], [12, 18, 17], [30, 500, 80], [700, 1300, 1000]] as const) {
      const total = marked + unmarked;
      for (let x = Math.max(0, drawn - unmarked); x <= Math.min(drawn, marked); x += 3) {
        const exact = toNumber({ num: choose(marked, x) * choose(unmarked, drawn - x), den: choose(total, drawn) });
        if (exact < 1e-290) continue;
        const logValue = logHypergeometricPmf(x, marked, unmarked, drawn);
        expect(Math.abs(logValue - Math.log(exact))).toBeLessThan(1e-13 * Math.max(1, -Math.log(exact)));
        const value = Math.exp(logValue);
        const ref = jStat.hypgeom.pdf(x, total, marked, drawn);
        if (ref > 1e-250) expect(relativeError(value, ref)).toBeLessThan(1e-10);
      }
    }
  });
});

describe('sameFractionTest (Fisher exact, two-sided as R fisher.test)', () => {
  it("gives 34/70 = 0.4857 for the tea-tasting table [[3, 1], [1, 3]] (R's fisher.test help page; by hand)", () => {
    // Tables x = 0 … 4 have probabilities (1, 16, 36, 16, 1)/70; those ≤ 16/70 sum to 34/70.
    const result = sameFractionTest(3, 4, 1, 4);
    expect(relativeError(result.pValue, 34 / 70)).toBeLessThan(1e-13);
    expect(relativeError(result.sigma, sigmaFromTwoSidedP(34 / 70))).toBeLessThan(1e-13);
    expect(result.method).toMatch(/Fisher's exact test/);
  });

  it("gives 0.0005367 for R's Convictions table [[2, 15], [10, 3]] (help page; two-sided value from memory)", () => {
    // Four significant digits printed: ±5e-8.
    expect(Math.abs(sameFractionTest(2, 17, 10, 13).pValue - 0.0005367)).toBeLessThan(5e-8);
  });

  it('matches the definition in exact rational arithmetic', () => {
    // The same rule over every table with these margins, in BigInt. Tail sums of ~1e-15-accurate
    // terms, stopped at 1e-17 of the total: 1e-11 relative.
    const u = chunkUniform('fisher-exact-reference', 0);
    for (let i = 0; i < 60; i++) {
      const n1 = 1 + Math.floor(u() * 120);
      const n2 = 1 + Math.floor(u() * 120);
      const k1 = Math.floor(u() * (n1 + 1));
      const k2 = Math.floor(u() * (n2 + 1));
      const exact = exactFisherTest(k1, n1, k2, n2);
      if (exact < 1e-290) continue;
      expect(relativeError(sameFractionTest(k1, n1, k2, n2).pValue, exact)).toBeLessThan(1e-11);
    }
  });

  it('does not depend on which sample is first or which class is counted', () => {
    for (const [k1, n1, k2, n2] of [[0, 37, 20, 200], [5, 11, 2, 40], [90, 1000, 130, 1100]] as const) {
      const p = sameFractionTest(k1, n1, k2, n2).pValue;
      expect(relativeError(sameFractionTest(k2, n2, k1, n1).pValue, p)).toBeLessThan(1e-12);
      expect(relativeError(sameFractionTest(n1 - k1, n1, n2 - k2, n2).pValue, p)).toBeLessThan(1e-12);
    }
  });

  it('gives p = 1 for equal fractions and for tables with only one possible arrangement', () => {
    expect(sameFractionTest(5, 50, 10, 100).pValue).toBe(1);
    expect(sameFractionTest(0, 10, 0, 30).pValue).toBe(1);
    expect(sameFractionTest(10, 10, 30, 30).sigma).toBe(0);
  });

  it('agrees with the pooled two-proportion z-test for samples of 1e6 (normal limit)', () => {
    // 100 000 of 1e6 vs 101 000 of 1e6: z = (Δf − 1/n)/√(f̄(1 − f̄)(2/n)) with continuity
    // correction. The hypergeometric skewness here is ~0.004, which shifts the tail by ~2e-3σ; 0.01σ.
    const n = 1e6;
    const pooled = 201000 / (2 * n);
    const z = (1000 / n - 1 / n) / Math.sqrt(pooled * (1 - pooled) * (2 / n));
    const result = sameFractionTest(100000, n, 101000, n);
    expect(Math.abs(result.sigma - z)).toBeLessThan(0.01);
    expect(relativeError(result.pValue, twoSidedPFromSigma(z))).toBeLessThan(0.05);
  });

  it('keeps a finite sigma when the p-value underflows: 0 of 1e6 vs 1e6 of 1e6', () => {
    // Only the two extreme tables qualify: p = 2 / C(2e6, 1e6), and ln C(2m, m) =
    // 2m ln 2 − ½ ln(πm) − 1/(8m) + O(m⁻³) (Stirling); the omitted terms are < 1e-18 here.
    const m = 1e6;
    const logP = Math.LN2 - (2 * m * Math.LN2 - 0.5 * Math.log(Math.PI * m) - 1 / (8 * m));
    const result = sameFractionTest(0, m, m, m);
    expect(result.pValue).toBe(0);
    expect(Number.isFinite(result.sigma)).toBe(true);
    expect(relativeError(result.sigma, sigmaFromLogTwoSidedP(logP))).toBeLessThan(1e-9);
  });

  it('returns plain data and rejects invalid input', () => {
    const result = sameFractionTest(3, 4, 1, 4);
    expect(structuredClone(result)).toEqual(result);
    expect(() => sameFractionTest(5, 4, 1, 4)).toThrow('k1 = 5 is outside the allowed range integers 0 … 4 (n1 = 4)');
    expect(() => sameFractionTest(1, 4, 1, 0)).toThrow(/^n2 = 0/);
    expect(() => sameFractionTest(1, 4, -1, 4)).toThrow(/^k2 = -1/);
  });
});
