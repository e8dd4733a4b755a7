import { describe, expect, it } from 'vitest';
import { logBinomialPmf } from './binomial-pmf.ts';
import { logBinomialLowerTail, logBinomialUpperTail } from './binomial-tail.ts';
import { exactBinomialTails, relativeError } from './testing/exact-reference.ts';
import { jStat } from './testing/jstat-reference.ts';

describe('binomial tails through the incomplete beta continued fraction', () => {
  it('match exact rational sums of the pmf (BigInt arithmetic)', () => {
    // The continued fraction stops at a relative change of one ulp and the prefactor is Loader's
    // pmf (~1e-15); the complement 1 − (other tail) adds at most ~1e-16 absolute. 1e-12 relative.
    for (const [n, a, b] of [[1, 1, 2], [10, 3, 10], [37, 21, 1000], [200, 3, 4], [925, 3, 4]] as const) {
      const exact = exactBinomialTails(n, a, b);
      for (let k = 0; k <= n; k++) {
        if (exact.lower[k] > 1e-290) expect(relativeError(Math.exp(logBinomialLowerTail(k, n, a / b)), exact.lower[k])).toBeLessThan(1e-12);
        if (exact.upper[k] > 1e-290) expect(relativeError(Math.exp(logBinomialUpperTail(k, n, a / b)), exact.upper[k])).toBeLessThan(1e-12);
      }
    }
  });

  it('agree with jStat.binomial.cdf', () => {
    // jStat rounds its cdf to 10 decimals (and uses a 1e-10 convergence test), so ±2e-10 absolute.
    for (const [n, p] of [[10, 0.3], [50, 0.021], [300, 0.5], [1000, 0.9]] as const) {
      for (let k = 0; k < n; k += Math.max(1, Math.floor(n / 20))) {
        expect(Math.abs(Math.exp(logBinomialLowerTail(k, n, p)) - jStat.binomial.cdf(k, n, p))).toBeLessThan(2e-10);
      }
    }
  });

  it('are complementary, P(X ≤ k) + P(X ≥ k + 1) = 1, also at n = 1e7', () => {
    // Each side is good to ~1e-13 relative; both near 0.5 gives ~1e-13 absolute on the sum.
    for (const [n, p] of [[1000, 0.3], [1e7, 0.5], [1e7, 0.021]] as const) {
      const mean = n * p;
      const sd = Math.sqrt(n * p * (1 - p));
      for (const z of [-3, -0.5, 0, 0.7, 3]) {
        const k = Math.round(mean + z * sd);
        const sum = Math.exp(logBinomialLowerTail(k, n, p)) + Math.exp(logBinomialUpperTail(k + 1, n, p));
        expect(Math.abs(sum - 1)).toBeLessThan(1e-12);
      }
    }
  });

  it('equal direct summation of the pmf deep in the tail at n = 1e7', () => {
    // Direct summation of ~1e4 terms from the tested pmf, a different route from the continued
    // fraction; both carry ~1e-13 relative error, so 1e-11.
    const n = 1e7;
    const p = 0.3;
    const k = Math.round(n * p - 8 * Math.sqrt(n * p * (1 - p))); // 8σ below the mean
    let sum = 0;
    for (let i = k; i >= 0; i--) {
      const term = Math.exp(logBinomialPmf(i, n, p) - logBinomialPmf(k, n, p));
      sum += term;
      if (term < 1e-18) break;
    }
    const direct = logBinomialPmf(k, n, p) + Math.log(sum);
    expect(relativeError(logBinomialLowerTail(k, n, p), direct)).toBeLessThan(1e-11);
  });

  it('keep tails far below the smallest double in log space', () => {
    // Closed forms: P(X ≤ 0) = q^n, P(X ≥ n) = p^n, P(X ≥ n − 1) = (n + 1) p^n at p = ½.
    // Compared to 1e-12 relative: a log of size ~7e5 rounded in a few operations.
    const n = 1e6;
    expect(relativeError(logBinomialLowerTail(0, n, 0.5), n * Math.log(0.5))).toBeLessThan(1e-12);
    expect(relativeError(logBinomialUpperTail(n, n, 0.5), n * Math.log(0.5))).toBeLessThan(1e-12);
    expect(relativeError(logBinomialUpperTail(n - 1, n, 0.5), Math.log(n + 1) + n * Math.log(0.5))).toBeLessThan(1e-12);
  });

  it('are exact at p = 0, p = 1 and at the ends of the support', () => {
    expect(logBinomialLowerTail(0, 10, 0)).toBe(0);
    expect(logBinomialUpperTail(1, 10, 0)).toBe(-Infinity);
    expect(logBinomialUpperTail(10, 10, 1)).toBe(0);
    expect(logBinomialLowerTail(9, 10, 1)).toBe(-Infinity);
    expect(logBinomialUpperTail(0, 10, 0.4)).toBe(0);
    expect(logBinomialLowerTail(10, 10, 0.4)).toBe(0);
  });

  it('rejects invalid input', () => {
    expect(() => logBinomialLowerTail(11, 10, 0.5)).toThrow(/^k = 11/);
    expect(() => logBinomialUpperTail(1, 10, -0.1)).toThrow(/^p = -0.1/);
  });
});
