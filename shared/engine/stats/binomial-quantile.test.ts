import { jStat } from './testing/jstat-reference.ts';
import { describe, expect, it } from 'vitest';
import { binomialQuantile } from './binomial-quantile.ts';

// Reference: jStat's binomial CDF (a general-purpose library from the registry).
const cdf = (k: number, n: number, p: number) => jStat.binomial.cdf(k, n, p);

describe('binomial quantile (inversion from the mode)', () => {
  it('returns the smallest k with P(X ≤ k) > v, checked against jStat on both sides', () => {
    for (const [n, p] of [[10, 0.5], [50, 0.03], [65536, 0.465], [65536, 1e-4], [1000, 0.999]] as const) {
      for (const v of [0, 1e-9, 0.001, 0.1, 0.3, 0.5, 0.77, 0.99, 0.999999]) {
        const k = binomialQuantile(v, n, p);
        expect(cdf(k, n, p), `n ${n} p ${p} v ${v}`).toBeGreaterThan(v - 1e-9);
        if (k > 0) expect(cdf(k - 1, n, p), `n ${n} p ${p} v ${v}`).toBeLessThanOrEqual(v + 1e-9);
      }
    }
  });

  it('gives the worked example and the degenerate cases', () => {
    expect(binomialQuantile(0.5, 10, 0.5)).toBe(5);
    expect(binomialQuantile(0.3, 100, 0)).toBe(0);
    expect(binomialQuantile(0.3, 100, 1)).toBe(100);
    expect(binomialQuantile(0.3, 0, 0.4)).toBe(0);
    expect(() => binomialQuantile(1, 10, 0.5)).toThrow(/v = 1 is outside the allowed range/);
  });
});
