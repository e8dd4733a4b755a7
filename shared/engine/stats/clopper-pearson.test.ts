import { describe, expect, it } from 'vitest';
import { chunkUniform } from '../random.ts';
import { clopperPearson } from './clopper-pearson.ts';
import { exactProbability, simulatedFrequency } from './testing/binomial-simulation.ts';
import { relativeError } from './testing/exact-reference.ts';
import { jStat } from './testing/jstat-reference.ts';

describe('clopperPearson (Clopper & Pearson 1934)', () => {
  it("reproduces R's binom.test help page: 682 of 925 → 0.7076683–0.7654066 at 95% (from memory)", () => {
    // R prints 7 significant digits: ±5e-8.
    const { lower, upper } = clopperPearson(682, 925, 0.95);
    expect(Math.abs(lower - 0.7076683)).toBeLessThan(5e-8);
    expect(Math.abs(upper - 0.7654066)).toBeLessThan(5e-8);
  });

  it('equals the beta quantiles B⁻¹(α/2; k, n − k + 1) and B⁻¹(1 − α/2; k + 1, n − k) of jStat', () => {
    // jStat's ibetainv stops its Halley iteration at a 1e-8 relative step, so its quantiles are
    // good to ~1e-8: bound 1e-7 relative.
    for (const n of [1, 2, 5, 10, 37, 100, 1000]) {
      for (const confidence of [0.68, 0.9, 0.95, 0.99]) {
        const alpha = 1 - confidence;
        for (let k = 0; k <= n; k += Math.max(1, Math.floor(n / 15))) {
          const { lower, upper } = clopperPearson(k, n, confidence);
          if (k > 0) expect(relativeError(lower, jStat.beta.inv(alpha / 2, k, n - k + 1))).toBeLessThan(1e-7);
          if (k < n) expect(relativeError(upper, jStat.beta.inv(1 - alpha / 2, k + 1, n - k))).toBeLessThan(1e-7);
        }
      }
    }
  });

  it('has the closed forms for k = 0 and k = n: [0, 1 − (α/2)^(1/n)] and [(α/2)^(1/n), 1]', () => {
    for (const n of [1, 37, 1e6]) {
      const zero = clopperPearson(0, n, 0.95);
      expect(zero.lower).toBe(0);
      expect(relativeError(zero.upper, 1 - 0.025 ** (1 / n))).toBeLessThan(1e-9); // 1 − x cancels ~1e-10 at n = 1e6
      const all = clopperPearson(n, n, 0.95);
      expect(all.upper).toBe(1);
      expect(relativeError(all.lower, 0.025 ** (1 / n))).toBeLessThan(1e-15);
    }
  });

  it('gives the rule of three for 0 of n: one-sided 95% (two-sided 90%) upper limit ≈ 3/n', () => {
    // Hanley & Lippman-Hand 1983, JAMA 249, 1743: upper 95% bound −ln(0.05)/n ≈ 3/n for large n.
    // The two-sided 95% interval puts α/2 = 0.025 in the tail instead, −ln(0.025)/n ≈ 3.69/n.
    // For n ≥ 1000 the exact 1 − (α/2)^(1/n) differs from −ln(α/2)/n by < 0.2%; 3 vs 2.996 is 0.15%.
    for (const n of [1000, 1e5, 1e7]) {
      expect(Math.abs(n * clopperPearson(0, n, 0.9).upper - 3) / 3).toBeLessThan(0.005);
      expect(Math.abs(n * clopperPearson(0, n, 0.95).upper + Math.log(0.025))).toBeLessThan(0.002 * 3.69);
    }
  });

  it('approaches the Poisson limits of Gehrels 1986 (ApJ 303, 336, Tables 1 and 2; from memory) for k ≪ n', () => {
    // Tabulated to 3–4 digits (±5e-4); binomial and Poisson limits differ by O(μ/n) ~ 1e-6 at n = 1e7.
    const n = 1e7;
    const sigma1 = 0.6826894921370859; // the 1σ two-sided confidence, as in Gehrels' 0.8413 column
    expect(Math.abs(n * clopperPearson(0, n, sigma1).upper - 1.841)).toBeLessThan(5e-4);
    expect(Math.abs(n * clopperPearson(1, n, sigma1).upper - 3.3)).toBeLessThan(5e-4);
    expect(Math.abs(n * clopperPearson(1, n, 0.95).upper - 5.572)).toBeLessThan(5e-4);
    expect(Math.abs(n * clopperPearson(1, n, sigma1).lower - 0.173)).toBeLessThan(5e-4);
    expect(Math.abs(n * clopperPearson(1, n, 0.95).lower - 0.0253)).toBeLessThan(5e-5);
  });

  it('covers k/n, shrinks with confidence and grows with k (properties)', () => {
    const u = chunkUniform('clopper-pearson-properties', 0);
    for (let i = 0; i < 200; i++) {
      const n = 1 + Math.floor(u() ** 2 * 5000);
      const k = Math.floor(u() * (n + 1));
      const c68 = clopperPearson(k, n, 0.68);
      const c95 = clopperPearson(k, n, 0.95);
      expect(c68.lower).toBeLessThanOrEqual(k / n);
      expect(c68.upper).toBeGreaterThanOrEqual(k / n);
      expect(c95.lower).toBeLessThanOrEqual(c68.lower);
      expect(c95.upper).toBeGreaterThanOrEqual(c68.upper);
      if (k < n) expect(clopperPearson(k + 1, n, 0.95).lower).toBeGreaterThan(c95.lower);
    }
  });

  it('handles n = 1e6 and n = 1e7 near the middle (normal limit)', () => {
    // For k = n/2 the limits approach ½ ± 1.96 √(1/(4n)); the error of the normal limit is O(1/n).
    for (const n of [1e6, 1e7]) {
      const { lower, upper } = clopperPearson(n / 2, n, 0.95);
      const half = 1.959963984540054 * Math.sqrt(0.25 / n);
      expect(Math.abs(upper - 0.5 - half) / half).toBeLessThan(1e-3);
      expect(Math.abs(0.5 - lower - half) / half).toBeLessThan(1e-3);
    }
  });

  it('covers the true fraction at least 95% of the time: exact sum and seeded simulation', () => {
    // Exact coverage Σ P(k | p) 1[p ∈ CI(k)] must be ≥ 0.95 (the Clopper–Pearson guarantee); the
    // coverage of 20 000 seeded samples must match it within 4 binomial standard errors.
    const n = 40;
    const intervals = Array.from({ length: n + 1 }, (_, k) => clopperPearson(k, n, 0.95));
    for (const [chunk, p] of [0.05, 0.3].entries()) {
      const covers = intervals.map(({ lower, upper }) => lower <= p && p <= upper);
      const exact = exactProbability(covers, n, p);
      expect(exact).toBeGreaterThanOrEqual(0.95);
      const { frequency, se } = simulatedFrequency(covers, n, p, 20000, 'clopper-pearson-coverage', exact, chunk);
      expect(Math.abs(frequency - exact)).toBeLessThan(4 * se);
    }
  });

  it('rejects invalid input naming the argument', () => {
    expect(() => clopperPearson(3, 2, 0.95)).toThrow(/^k = 3/);
    expect(() => clopperPearson(1, 2, 1)).toThrow('confidence = 1 is outside the allowed range (0, 1) exclusive');
    expect(() => clopperPearson(1, 2, 0)).toThrow(/^confidence = 0/);
    expect(() => clopperPearson(1, 0, 0.5)).toThrow(/^n = 0/);
  });
});
