import { describe, expect, it } from 'vitest';
import { chunkUniform } from '../random.ts';
import { binomialTestTwoSided } from './binomial-test.ts';
import { acceptedFractionRanges } from './test-inversion.ts';
import { exactProbability, simulatedFrequency } from './testing/binomial-simulation.ts';

/** Brute force: the smallest and largest of 20 001 evenly spaced p in [a, b] the test accepts. */
function scan(k: number, n: number, alpha: number, a: number, b: number): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i <= 20000; i++) {
    const p = a + ((b - a) * i) / 20000;
    if (binomialTestTwoSided(k, n, p) >= alpha) {
      lo = Math.min(lo, p);
      hi = Math.max(hi, p);
    }
  }
  return [lo, hi];
}

describe('acceptedFractionRanges (inversion of the exact two-sided binomial test)', () => {
  it('finds the same ends as a brute-force scan of the test over all p', () => {
    // The scan step is (b − a)/20000; the ends must agree to within one step, and the returned
    // ends must be accepted while a point just beyond (relative 1e-9) is rejected.
    for (const [k, n] of [[3, 20], [0, 37], [20, 20], [1, 5], [682, 925]] as const) {
      const [r68, r95] = acceptedFractionRanges(k, n, [0.68, 0.95]);
      for (const [range, alpha] of [[r68, 0.32], [r95, 0.05]] as const) {
        const a = Math.max(0, range.lower - 0.05);
        const b = Math.min(1, range.upper + 0.05);
        const step = (b - a) / 20000;
        const [lo, hi] = scan(k, n, alpha, a, b);
        expect(Math.abs(range.lower - lo)).toBeLessThanOrEqual(step);
        expect(Math.abs(range.upper - hi)).toBeLessThanOrEqual(step);
        expect(binomialTestTwoSided(k, n, range.lower)).toBeGreaterThanOrEqual(alpha);
        expect(binomialTestTwoSided(k, n, range.upper)).toBeGreaterThanOrEqual(alpha);
        if (range.lower > 0) expect(binomialTestTwoSided(k, n, range.lower * (1 - 1e-9))).toBeLessThan(alpha);
        if (range.upper < 1) expect(binomialTestTwoSided(k, n, range.upper * (1 + 1e-9))).toBeLessThan(alpha);
      }
    }
  });

  it('reports the hull and the gap when the accepted set is not an interval (Fay 2010)', () => {
    // A 20 001-point scan shows that for 1 of 30 at 95% the test accepts p up to ~0.163, rejects
    // ~0.164–0.175 and accepts again up to ~0.177; 3 of 21 at 68% has a pocket near 0.26–0.27.
    // The hull must reach the outer pocket (within one scan step) and flag the gap.
    for (const [k, n, confidence] of [[1, 30, 0.95], [3, 21, 0.68]] as const) {
      const [range] = acceptedFractionRanges(k, n, [confidence]);
      const [, hi] = scan(k, n, 1 - confidence, 0, 0.5);
      expect(Math.abs(range.upper - hi)).toBeLessThanOrEqual(0.5 / 20000);
      expect(range.gaps).toBe(true);
    }
    expect(acceptedFractionRanges(3, 20, [0.95])[0].gaps).toBe(false);
  });

  it('puts the ends at 0 for k = 0 and at 1 for k = n, and contains k/n', () => {
    const [zero] = acceptedFractionRanges(0, 37, [0.95]);
    expect(zero.lower).toBe(0);
    const [all] = acceptedFractionRanges(37, 37, [0.95]);
    expect(all.upper).toBe(1);
    const [mid] = acceptedFractionRanges(5, 37, [0.95]);
    expect(mid.lower).toBeLessThan(5 / 37);
    expect(mid.upper).toBeGreaterThan(5 / 37);
  });

  it('nests the 68% range inside the 95% range (seeded random cases, n up to 1e5)', () => {
    const u = chunkUniform('inversion-nesting', 0);
    for (let i = 0; i < 40; i++) {
      const n = 1 + Math.floor(u() ** 3 * 1e5);
      const k = Math.floor(u() ** 2 * (n + 1));
      const [r68, r95] = acceptedFractionRanges(k, n, [0.68, 0.95]);
      expect(r95.lower).toBeLessThanOrEqual(r68.lower);
      expect(r95.upper).toBeGreaterThanOrEqual(r68.upper);
      expect(r68.lower).toBeLessThanOrEqual(k / n);
      expect(r68.upper).toBeGreaterThanOrEqual(k / n);
    }
  });

  it('covers the true fraction at least 95% of the time: exact sum and seeded simulation', () => {
    // An exact test rejects a true p with probability ≤ α, so Σ P(k | p) 1[p ∈ range(k)] ≥ 0.95.
    // 20 000 seeded samples must match that exact coverage within 4 binomial standard errors.
    const n = 30;
    const p = 0.15;
    const ranges = Array.from({ length: n + 1 }, (_, k) => acceptedFractionRanges(k, n, [0.95])[0]);
    const covers = ranges.map((r) => r.lower <= p && p <= r.upper);
    const exact = exactProbability(covers, n, p);
    expect(exact).toBeGreaterThanOrEqual(0.95);
    const { frequency, se } = simulatedFrequency(covers, n, p, 20000, 'inversion-coverage', exact);
    expect(Math.abs(frequency - exact)).toBeLessThan(4 * se);
  });

  it('rejects invalid input naming the argument', () => {
    expect(() => acceptedFractionRanges(3, 2, [0.95])).toThrow(/^k = 3/);
    expect(() => acceptedFractionRanges(1, 2, [0.95, 1])).toThrow(/^confidences\[1\] = 1/);
  });
});
