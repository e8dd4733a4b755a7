import { describe, expect, it } from 'vitest';
import { chunkUniform } from '../random.ts';
import { binomialTestTwoSided, binomialTestTwoSidedLog } from './binomial-test.ts';
import { twoSidedPFromSigma } from './significance.ts';
import { exactProbability, simulatedFrequency } from './testing/binomial-simulation.ts';
import { exactBinomialTest, relativeError } from './testing/exact-reference.ts';

describe('binomialTestTwoSided (R binom.test rule)', () => {
  it("reproduces R's help-page example, Mendel's peas: 682 of 925 against 3/4 gives p = 0.3825 (from memory)", () => {
    // R prints four significant digits, so ±5e-5.
    expect(Math.abs(binomialTestTwoSided(682, 925, 0.75) - 0.3825)).toBeLessThan(5e-5);
  });

  it('matches the definition evaluated in exact rational arithmetic', () => {
    // Same rule (sum of outcomes with probability ≤ observed · (1 + 1e-7)) over the whole
    // support, in BigInt. The engine's tails are good to ~1e-13; 1e-11 relative.
    const cases: [number, number, number][] = [[5, 1, 2], [20, 1, 2], [37, 21, 1000], [37, 1, 5], [100, 3, 10], [925, 3, 4]];
    for (const [n, a, b] of cases) {
      for (let k = 0; k <= n; k += Math.max(1, Math.floor(n / 30))) {
        const exact = exactBinomialTest(k, n, a, b);
        if (exact < 1e-290) continue;
        expect(relativeError(binomialTestTwoSided(k, n, a / b), exact)).toBeLessThan(1e-11);
      }
    }
  });

  it('gives 2 · P(X ≤ 3) = 2 · 1351/2^20 for 3 of 20 against ½ (symmetric case, by hand)', () => {
    // P(X ≤ 3) = (1 + 20 + 190 + 1140)/2^20; by symmetry the other tail is equal.
    expect(relativeError(binomialTestTwoSided(3, 20, 0.5), (2 * 1351) / 2 ** 20)).toBeLessThan(1e-13);
  });

  it('is symmetric under k → n − k, p → 1 − p', () => {
    for (const [k, n, p] of [[3, 40, 0.25], [17, 50, 0.125], [0, 12, 0.375]] as const) {
      expect(relativeError(binomialTestTwoSided(k, n, p), binomialTestTwoSided(n - k, n, 1 - p))).toBeLessThan(1e-12);
    }
  });

  it('is exact at p = 0 and p = 1', () => {
    expect(binomialTestTwoSided(0, 30, 0)).toBe(1);
    expect(binomialTestTwoSided(1, 30, 0)).toBe(0);
    expect(binomialTestTwoSided(30, 30, 1)).toBe(1);
    expect(binomialTestTwoSided(29, 30, 1)).toBe(0);
  });

  it('is 1 when the observed count is the most likely one (0 of 37 against 2.1%)', () => {
    // The expected count 0.78 is below 1 and P(0) = 0.979^37 = 0.456 > P(1) = 0.362, so every
    // outcome is no more likely than the observed one.
    expect(binomialTestTwoSided(0, 37, 0.021)).toBe(1);
  });

  it('works at n = 1e7 and agrees with the normal limit there', () => {
    // X ~ Bin(1e7, ½) is symmetric, so p = 2 P(X ≥ 5 010 000); with the continuity correction the
    // normal tail differs from it by the kurtosis term ~ (1 − 6pq)/(npq) · z⁴/24 ≈ 1e-5 relative.
    const n = 1e7;
    const z = (10000 - 0.5) / Math.sqrt(n * 0.25);
    expect(relativeError(binomialTestTwoSided(5_010_000, n, 0.5), twoSidedPFromSigma(z))).toBeLessThan(1e-3);
  });

  it('keeps p-values far below 1e-15 in log form: 0 of 1e6 against ½ is 2 · 2^−1e6', () => {
    // Only the outcomes 0 and n are as unlikely as 0; the closed form is known to ~1e-16 relative.
    const n = 1e6;
    expect(binomialTestTwoSided(0, n, 0.5)).toBe(0); // underflows as a plain number …
    expect(relativeError(binomialTestTwoSidedLog(0, n, 0.5), Math.log(2) + n * Math.log(0.5))).toBeLessThan(1e-12); // … not as a log
  });

  it('always lies in [0, 1] (seeded random cases)', () => {
    const u = chunkUniform('binomial-test-range', 0);
    for (let i = 0; i < 300; i++) {
      const n = 1 + Math.floor(u() * 2000);
      const k = Math.floor(u() * (n + 1));
      const p = u() ** 3; // many small fractions, as for magnetic white dwarfs
      const value = binomialTestTwoSided(k, n, p);
      expect(value).toBeGreaterThanOrEqual(0);
      expect(value).toBeLessThanOrEqual(1);
    }
  });

  it('rejects a true null at most at the nominal rate, by exact sum and by a seeded simulation', () => {
    // Exact size: Σ P(k) over the k the test rejects at α = 0.05 must be ≤ 0.05 (the test is
    // exact). The simulated rejection rate of 20 000 seeded samples must match that size within
    // 4 binomial standard errors √(s(1 − s)/20000).
    const n = 30;
    const p = 0.2;
    const alpha = 0.05;
    const rejects = Array.from({ length: n + 1 }, (_, k) => binomialTestTwoSided(k, n, p) <= alpha);
    const size = exactProbability(rejects, n, p);
    expect(size).toBeLessThanOrEqual(alpha);
    const { frequency, se } = simulatedFrequency(rejects, n, p, 20000, 'binomial-test-size', size);
    expect(Math.abs(frequency - size)).toBeLessThan(4 * se);
  });

  it('rejects invalid input naming the argument', () => {
    expect(() => binomialTestTwoSided(3, 2, 0.5)).toThrow('k = 3 is outside the allowed range integers 0 … 2 (n = 2)');
    expect(() => binomialTestTwoSided(1, 2, 2)).toThrow('p = 2 is outside the allowed range [0, 1]');
    expect(() => binomialTestTwoSided(1, 2.5, 0.5)).toThrow(/^n = 2.5/);
  });
});
