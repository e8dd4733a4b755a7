import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { logBinomialPmf } from './binomial-pmf.ts';
import { binomialNumerators, toNumber } from './testing/exact-reference.ts';
import { jStat } from './testing/jstat-reference.ts';

describe('logBinomialPmf (Loader 2000 saddle-point form)', () => {
  it('matches exact rational probabilities C(n,k) p^k q^(n−k) (BigInt arithmetic)', () => {
    // Loader's terms are each at most |ln P| in size and carry a few ulps of rounding, so the log
    // is good to ~1e-15 · max(1, |ln P|); 1e-13 · max(1, |ln P|) leaves a wide margin.
    for (const [n, a, b] of [[1, 1, 2], [10, 1, 3], [37, 21, 1000], [200, 3, 4], [1000, 1, 1000], [925, 3, 4]] as const) {
      const { nums, den } = binomialNumerators(n, a, b);
      for (let k = 0; k <= n; k++) {
        const exact = toNumber({ num: nums[k], den });
        if (exact < 1e-290) continue; // below what toNumber represents
        const logExact = Math.log(exact);
        expect(Math.abs(logBinomialPmf(k, n, a / b) - logExact)).toBeLessThan(1e-13 * Math.max(1, -logExact));
      }
    }
  });

  it('agrees with jStat.binomial.pdf for small n', () => {
    // jStat multiplies a factorial ratio from its gamma function by Math.pow terms; that is good
    // to ~1e-13 relative for n ≤ 100, so 1e-11 leaves room without hiding a real error.
    for (const n of [5, 20, 100]) {
      for (const p of [0.01, 0.3, 0.5, 0.92]) {
        for (let k = 0; k <= n; k += Math.max(1, Math.floor(n / 10))) {
          const ref = jStat.binomial.pdf(k, n, p);
          if (ref < 1e-250) continue;
          expect(Math.abs(Math.exp(logBinomialPmf(k, n, p)) / ref - 1)).toBeLessThan(1e-11);
        }
      }
    }
  });

  it('keeps the exact ratio P(k+1)/P(k) = (n−k)p/((k+1)q) at n = 1e7', () => {
    // A difference of log-gamma values would carry ~1e-8 absolute rounding at n = 1e7
    // (ln Γ(n+1) ≈ 1.5e8); the saddle-point form must do far better, so 1e-10 is asked for.
    const n = 1e7;
    for (const p of [1e-6, 0.1, 0.5, 0.9]) {
      const mean = n * p;
      const sd = Math.sqrt(n * p * (1 - p));
      for (const z of [-5, -1, 0, 2, 6]) {
        const k = Math.max(0, Math.round(mean + z * sd));
        if (k >= n) continue;
        const step = logBinomialPmf(k + 1, n, p) - logBinomialPmf(k, n, p);
        const exact = Math.log((n - k) / (k + 1)) + Math.log(p) - Math.log1p(-p);
        expect(Math.abs(step - exact)).toBeLessThan(1e-10);
      }
    }
  });

  it('sums to 1 over all outcomes (n = 1000 and n = 1e5)', () => {
    // 1e3–1e5 terms each with ~1e-14 relative error; the sum is then good to ~1e-13.
    for (const [n, p] of [[1000, 0.37], [100000, 0.021]] as const) {
      let sum = 0;
      for (let k = 0; k <= n; k++) sum += Math.exp(logBinomialPmf(k, n, p));
      expect(Math.abs(sum - 1)).toBeLessThan(1e-12);
    }
  });

  it('is exact at the ends and at p = 0 and p = 1', () => {
    expect(logBinomialPmf(0, 50, 0)).toBe(0);
    expect(logBinomialPmf(3, 50, 0)).toBe(-Infinity);
    expect(logBinomialPmf(50, 50, 1)).toBe(0);
    expect(logBinomialPmf(49, 50, 1)).toBe(-Infinity);
    expect(logBinomialPmf(0, 1e6, 1e-9)).toBeCloseTo(1e6 * Math.log1p(-1e-9), 15);
    expect(logBinomialPmf(1e6, 1e6, 0.5)).toBe(1e6 * Math.log(0.5));
  });

  it('rejects invalid input naming the argument, value and range', () => {
    expect(() => logBinomialPmf(5, 4, 0.5)).toThrow(EngineError);
    expect(() => logBinomialPmf(5, 4, 0.5)).toThrow('k = 5 is outside the allowed range integers 0 … 4 (n = 4)');
    expect(() => logBinomialPmf(-1, 4, 0.5)).toThrow(/^k = -1/);
    expect(() => logBinomialPmf(1.5, 4, 0.5)).toThrow(/^k = 1.5/);
    expect(() => logBinomialPmf(0, 0, 0.5)).toThrow(/^n = 0/);
    expect(() => logBinomialPmf(1, 4, 1.5)).toThrow('p = 1.5 is outside the allowed range [0, 1]');
    expect(() => logBinomialPmf(1, 4, Number.NaN)).toThrow('p = NaN');
  });
});
