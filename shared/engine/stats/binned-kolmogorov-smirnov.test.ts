import { describe, expect, it } from 'vitest';
import { binnedKolmogorovSmirnov } from './binned-kolmogorov-smirnov.ts';

// 25 values drawn once with numpy (default_rng(1).random(25), rounded to 6 digits).
const UNIFORM_SAMPLE = [
  0.511822, 0.950464, 0.14416, 0.948649, 0.311831, 0.423326, 0.827703, 0.409199, 0.549594, 0.027559, 0.753513, 0.538143, 0.329732,
  0.788429, 0.303195, 0.453498, 0.134042, 0.403113, 0.203455, 0.262313, 0.750365, 0.280409, 0.485191, 0.980737, 0.961657,
];

describe('binnedKolmogorovSmirnov (grouped KS, Noether 1963 / Conover 1972; Stephens 1970)', () => {
  it('approaches scipy.stats.kstest against the uniform law as the bins narrow and the model grows', () => {
    // scipy 1.17.1 kstest(UNIFORM_SAMPLE, "uniform"): D = 0.130406, p = 0.741035 (exact n = 25).
    // With 1000 bins of width h = 0.001 and no two values in one bin, the edge statistic lies within
    // h of the continuous one. The model (1e6 per bin) makes n m/(n+m) = 25 to 1e-6. Stephens'
    // finite-n form is within ~2% of the exact distribution for n ≥ 10 (checked against
    // scipy.stats.kstwo.sf at n = 10 … 100); with the h shift in D, 5% relative on p.
    const edges = Array.from({ length: 1001 }, (_, i) => i / 1000);
    const model = new Array(1000).fill(1_000_000);
    const r = binnedKolmogorovSmirnov(edges, model, UNIFORM_SAMPLE);
    expect(Math.abs(r.statistic - 0.130406)).toBeLessThanOrEqual(0.001);
    expect(Math.abs(r.pValue - 0.741035) / 0.741035).toBeLessThan(0.05);
    expect(r.observedCount).toBe(25);
    expect(r.effectiveCount).toBeCloseTo(25, 3);
  });

  it('gives the worked example of its doc comment: D = 0.5, p = 0.2036', () => {
    // p = scipy.stats.kstwobign.sf((√N + 0.12 + 0.11/√N) · 0.5) with N = 4·100/104 (scipy 1.17.1): 0.20355257550390918.
    const r = binnedKolmogorovSmirnov([0, 0.5, 1], [50, 50], [0.1, 0.2, 0.3, 0.4]);
    expect(r.statistic).toBe(0.5);
    expect(r.atEdge).toBe(0.5);
    expect(r.pValue).toBeCloseTo(0.20355257550390918, 12);
    expect(r.observedPerBin).toEqual([4, 0]);
  });

  it("carries the model's Monte Carlo error: a small model weakens the test", () => {
    // The effective size n m/(n + m) < n, so the same D is less significant (Smirnov 1939).
    const values = Array.from({ length: 40 }, (_, i) => 0.3 + (0.4 * i) / 40);
    const big = binnedKolmogorovSmirnov([0, 0.25, 0.5, 0.75, 1], [1e6, 1e6, 1e6, 1e6], values);
    const small = binnedKolmogorovSmirnov([0, 0.25, 0.5, 0.75, 1], [10, 10, 10, 10], values);
    expect(small.statistic).toBe(big.statistic);
    expect(small.sigma).toBeLessThan(big.sigma);
    expect(small.sigmaModelExact).toBeCloseTo(big.sigmaModelExact, 3);
  });

  it('counts values outside the edges apart and names bad input', () => {
    const r = binnedKolmogorovSmirnov([0, 1, 2], [5, 5], [-1, 0.5, 1.5, 2]);
    expect(r.outside).toBe(2);
    expect(r.observedCount).toBe(2);
    expect(() => binnedKolmogorovSmirnov([0, 1], [0], [0.5])).toThrow(/modelCounts = 0 is outside the allowed range a positive total/);
    expect(() => binnedKolmogorovSmirnov([0, 1], [3], [5])).toThrow(/observed = .*none inside/);
    expect(() => binnedKolmogorovSmirnov([0, 1], [3], [Number.NaN])).toThrow(/observed\[0\] = NaN/);
  });
});
