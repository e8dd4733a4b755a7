import { describe, expect, it } from 'vitest';
import { chunkUniform } from '../random.ts';
import { fractionWithError, monteCarloStandardError } from './mc-error.ts';
import { relativeError } from './testing/exact-reference.ts';

/** Sample standard deviation and the standard error of that estimate, ≈ sd/√(2(R − 1)) for near-normal data. */
function spread(values: number[]): { sd: number; seOfSd: number } {
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (values.length - 1));
  return { sd, seOfSd: sd / Math.sqrt(2 * (values.length - 1)) };
}

describe('monteCarloStandardError', () => {
  it('is √(f(1 − f)/n) (binomial variance)', () => {
    expect(relativeError(monteCarloStandardError(1000, 100000), Math.sqrt((0.01 * 0.99) / 1e5))).toBeLessThan(1e-15);
    expect(monteCarloStandardError(0, 500)).toBe(0);
    expect(monteCarloStandardError(500, 500)).toBe(0);
    expect(relativeError(monteCarloStandardError(30, 100), monteCarloStandardError(70, 100))).toBeLessThan(1e-15);
    expect(fractionWithError(210, 10000)).toEqual({ value: 0.021, se: monteCarloStandardError(210, 10000) });
  });

  it('matches the scatter of k/N over 2000 seeded runs', () => {
    // f = 0.1, N = 1000: the standard deviation of 2000 replicate fractions estimates σ_f to
    // ±1.6% (its own standard error); allow 4 of those.
    const runs = Array.from({ length: 2000 }, (_, r) => {
      const u = chunkUniform('mc-error-whole', r);
      let k = 0;
      for (let i = 0; i < 1000; i++) if (u() < 0.1) k++;
      return k / 1000;
    });
    const { sd, seOfSd } = spread(runs);
    expect(Math.abs(sd - Math.sqrt((0.1 * 0.9) / 1000))).toBeLessThan(4 * seOfSd);
  });

  it('serves a sub-population fraction k/m when passed the sub-population size m', () => {
    // 30% of N = 2000 draws fall in the sub-population (m is random, ~600), 20% of those are
    // magnetic. The replicate scatter of k/m must match the mean of √(f(1 − f)/m) within 4
    // standard errors of the scatter; conditioning on m is what makes the formula carry over.
    const fractions: number[] = [];
    const predicted: number[] = [];
    for (let r = 0; r < 2000; r++) {
      const u = chunkUniform('mc-error-sub', r);
      let m = 0;
      let k = 0;
      for (let i = 0; i < 2000; i++) {
        if (u() < 0.3) {
          m++;
          if (u() < 0.2) k++;
        }
      }
      fractions.push(k / m);
      predicted.push(Math.sqrt((0.2 * 0.8) / m));
    }
    const { sd, seOfSd } = spread(fractions);
    const meanPredicted = predicted.reduce((s, v) => s + v, 0) / predicted.length;
    expect(Math.abs(sd - meanPredicted)).toBeLessThan(4 * seOfSd);
  });

  it('rejects invalid counts', () => {
    expect(() => monteCarloStandardError(11, 10)).toThrow(/^k = 11/);
    expect(() => monteCarloStandardError(0, 0)).toThrow(/^n = 0/);
  });
});
