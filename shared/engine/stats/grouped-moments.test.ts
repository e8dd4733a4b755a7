import { describe, expect, it } from 'vitest';
import { groupedMoments } from './grouped-moments.ts';

describe("groupedMoments (Sheppard 1898's correction)", () => {
  it('recovers the σ of a normal law from wide bins only after the h²/12 correction', () => {
    // Counts: 1e7 × (Φ(b) − Φ(a)) of N(0.66, 0.13) on 0.1-wide bins from 0.1 to 1.3, rounded
    // (scipy.stats.norm.cdf, scipy 1.17.1). Grouped sd is 0.13315, corrected 0.12999 (numpy): the
    // correction's remainder is O(h⁴) (Kendall & Stuart §3.18), well under 2e-4 here; the
    // rounding of counts and the cut tails move the mean by < 1e-5.
    const edges = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1, 1.2, 1.3];
    const counts = [1930, 26082, 199407, 864545, 2130016, 2986356, 2384009, 1083224, 279786, 41000, 3400, 159];
    const m = groupedMoments(edges, counts)!;
    expect(Math.abs(m.mean - 0.66)).toBeLessThan(1e-5);
    expect(Math.abs(m.sd - 0.13)).toBeLessThan(2e-4);
    expect(m.se).toBeCloseTo(m.sd / Math.sqrt(m.count), 15);
  });

  it('gives the worked example of its doc comment and null when empty', () => {
    const m = groupedMoments([0, 1, 2, 3], [1, 2, 1])!;
    expect(m.mean).toBe(1.5);
    expect(m.sd).toBeCloseTo(Math.sqrt(0.5 - 1 / 12), 14);
    expect(groupedMoments([0, 1], [0])).toBeNull();
    expect(() => groupedMoments([0, 1], [1, 2])).toThrow(/counts.length = 2/);
  });
});
