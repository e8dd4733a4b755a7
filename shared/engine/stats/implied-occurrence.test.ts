import { describe, expect, it } from 'vitest';
import { chunkUniform } from '../random.ts';
import { binomialTestTwoSided } from './binomial-test.ts';
import { impliedMultiplier, impliedMultiplierFromPoints, type MultiplierResponse } from './implied-occurrence.ts';

/** Brute force: smallest and largest m on a grid of `steps` in [0, mMax] whose f(m) the test accepts. */
function scanMultipliers(f: (m: number) => number, mMax: number, k: number, n: number, alpha: number, steps: number) {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i <= steps; i++) {
    const m = (mMax * i) / steps;
    if (binomialTestTwoSided(k, n, f(m)) >= alpha) {
      lo = Math.min(lo, m);
      hi = Math.max(hi, m);
    }
  }
  return lo <= hi ? [lo, hi] : null;
}

const linear: MultiplierResponse = { whiteDwarfs: 1000, multiplierEdges: [0, 1, 2, 3, 4], magneticAt: [0, 40, 80, 120, 160] };

describe('impliedMultiplier', () => {
  it('finds the multipliers a brute-force scan of the exact test allows, for a linear response', () => {
    // f(m) = 0.04 m. A scan of 8001 points over [0, 4] (step 5e-4) must agree within a step.
    const f = (m: number) => 0.04 * m;
    for (const observed of [{ magnetic: 3, total: 20 }, { magnetic: 0, total: 37 }, { magnetic: 12, total: 100 }]) {
      const result = impliedMultiplier(linear, observed);
      for (const [interval, alpha] of [[result.interval68, 0.32], [result.interval95, 0.05]] as const) {
        const scanned = scanMultipliers(f, 4, observed.magnetic, observed.total, alpha, 8000);
        expect(interval).not.toBeNull();
        expect(scanned).not.toBeNull();
        expect(Math.abs(interval![0] - scanned![0])).toBeLessThanOrEqual(5e-4);
        expect(Math.abs(interval![1] - scanned![1])).toBeLessThanOrEqual(5e-4);
      }
      expect(result.bestFit).toBeCloseTo(observed.magnetic / observed.total / 0.04, 12);
    }
  });

  it('says "at the edge" when an end sits at m = 0 or at the largest multiplier', () => {
    const zero = impliedMultiplier(linear, { magnetic: 0, total: 37 });
    expect(zero.interval95![0]).toBe(0);
    expect(zero.bestFit).toBe(0);
    expect(zero.summary).toMatch(/^The observed 0 of 37 \(0%\) implies a multiplier between 0 and .+ \(68%; lower end at the edge\)/);
    const high = impliedMultiplier(linear, { magnetic: 3, total: 20 }); // 15% needs m = 3.75, near the top
    expect(high.interval95![1]).toBe(4);
    expect(high.summary).toMatch(/upper end at the edge/);
  });

  it('returns null intervals and says so when no multiplier fits', () => {
    const result = impliedMultiplier(linear, { magnetic: 15, total: 20 }); // 75% against at most 16%
    expect(result.interval68).toBeNull();
    expect(result.interval95).toBeNull();
    expect(result.bestFit).toBe(4);
    expect(result.summary).toMatch(/is not reproduced by any multiplier from 0 to 4\.0 at 95%/);
  });

  it('can allow multipliers at 95% but none at 68%', () => {
    // 6 of 20 (30%) against f(m) ≤ 16%: the 68% range of fractions starts near 19% (above the
    // curve), the 95% range near 13%, reached at m ≈ 3.3.
    const result = impliedMultiplier(linear, { magnetic: 6, total: 20 });
    expect(result.interval68).toBeNull();
    expect(result.interval95).not.toBeNull();
    expect(result.interval95![1]).toBe(4);
    expect(result.summary).toMatch(/implies no multiplier at 68% and between 3\.\d+ and 4\.0+ \(95%; upper end at the edge\)/);
  });

  it('handles flat stretches and uneven edges', () => {
    // No magnetic white dwarfs until m = 0.5, then f rises to 2% at m = 0.7 and 15% at m = 3.
    const response = { whiteDwarfs: 10000, multiplierEdges: [0, 0.5, 0.7, 3], magneticAt: [0, 0, 200, 1500] };
    const f = (m: number) => (m <= 0.5 ? 0 : m <= 0.7 ? (0.02 * (m - 0.5)) / 0.2 : 0.02 + (0.13 * (m - 0.7)) / 2.3);
    const one = impliedMultiplier(response, { magnetic: 1, total: 50 }); // 2% = f(0.7)
    expect(one.bestFit).toBeCloseTo(0.7, 12);
    expect(one.curve).toEqual([
      { multiplier: 0, fraction: 0 },
      { multiplier: 0.5, fraction: 0 },
      { multiplier: 0.7, fraction: 0.02 },
      { multiplier: 3, fraction: 0.15 },
    ]);
    // f = 0 is rejected outright for 1 observed (p = 0), so the lower end lies on the rising
    // segment above m = 0.5; a 6001-point scan (step 5e-4) must agree within a step.
    const scanned = scanMultipliers(f, 3, 1, 50, 0.05, 6000);
    expect(one.interval95![0]).toBeGreaterThan(0.5);
    expect(Math.abs(one.interval95![0] - scanned![0])).toBeLessThanOrEqual(5e-4);
    expect(Math.abs(one.interval95![1] - scanned![1])).toBeLessThanOrEqual(5e-4);
    // 0 observed: the whole flat stretch fits exactly; the best fit is its smallest m.
    const none = impliedMultiplier(response, { magnetic: 0, total: 50 });
    expect(none.bestFit).toBe(0);
    expect(none.interval68![0]).toBe(0);
  });

  it('nests 68% inside 95% for random monotone responses (seeded)', () => {
    const u = chunkUniform('implied-nesting', 0);
    for (let i = 0; i < 40; i++) {
      const whiteDwarfs = 1000 + Math.floor(u() * 1e6);
      const edges = [0];
      const counts = [Math.floor(u() * 0.05 * whiteDwarfs)];
      for (let j = 1; j < 12; j++) {
        edges.push(edges[j - 1] + 0.05 + u());
        counts.push(Math.min(whiteDwarfs, counts[j - 1] + Math.floor(u() * 0.05 * whiteDwarfs)));
      }
      const total = 5 + Math.floor(u() * 500);
      const magnetic = Math.floor(u() * 0.3 * total);
      const result = impliedMultiplier({ whiteDwarfs, multiplierEdges: edges, magneticAt: counts }, { magnetic, total });
      if (result.interval68) {
        expect(result.interval95).not.toBeNull();
        expect(result.interval95![0]).toBeLessThanOrEqual(result.interval68[0]);
        expect(result.interval95![1]).toBeGreaterThanOrEqual(result.interval68[1]);
      }
      expect(result.bestFit).toBeGreaterThanOrEqual(0);
      expect(result.bestFit).toBeLessThanOrEqual(edges[edges.length - 1]);
    }
  });

  it('says so in the method when the accepted fractions have a gap (1 of 30 at 95%)', () => {
    // See the test-inversion tests: the exact test accepts ~0.0018–0.163 and again ~0.175–0.177.
    // f(m) = 0.04 m up to m = 5 (f = 20%), so the outer pocket maps to m ≈ 4.4–4.43.
    const wider = { whiteDwarfs: 1000, multiplierEdges: [0, 1, 2, 3, 4, 5], magneticAt: [0, 40, 80, 120, 160, 200] };
    const result = impliedMultiplier(wider, { magnetic: 1, total: 30 });
    expect(result.method).toMatch(/accepted fractions have gaps, so each interval is their hull/);
    expect(result.interval95![1]).toBeGreaterThan(0.175 / 0.04);
    expect(result.interval95![1]).toBeLessThan(0.178 / 0.04);
    expect(impliedMultiplier(linear, { magnetic: 3, total: 20 }).method).not.toMatch(/gaps/);
  });

  it('states the method, resolution and the Monte Carlo error of the curve', () => {
    const result = impliedMultiplier(linear, { magnetic: 3, total: 20 });
    expect(result.method).toMatch(/^exact response from one run with common random numbers \(N = 1000 white dwarfs\)/);
    expect(result.method).toMatch(/largest spacing Δm = 1\.0/);
    expect(result.method).toMatch(/Monte Carlo error/);
    expect(structuredClone(result)).toEqual(result);
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });

  it('rejects malformed responses naming the field', () => {
    const observed = { magnetic: 1, total: 10 };
    expect(() => impliedMultiplier({ ...linear, multiplierEdges: [0.1, 1, 2, 3, 4] }, observed)).toThrow(/^response.multiplierEdges\[0\] = 0.1/);
    expect(() => impliedMultiplier({ ...linear, multiplierEdges: [0, 1, 1, 3, 4] }, observed)).toThrow(/^response.multiplierEdges\[2\] = 1/);
    expect(() => impliedMultiplier({ ...linear, magneticAt: [0, 40, 30, 120, 160] }, observed)).toThrow(/^response.magneticAt\[2\] = 30/);
    expect(() => impliedMultiplier({ ...linear, magneticAt: [0, 40, 80, 120, 1600] }, observed)).toThrow(/^response.magneticAt\[4\] = 1600/);
    expect(() => impliedMultiplier({ ...linear, magneticAt: [0, 40] }, observed)).toThrow(/^response.magneticAt = /);
    expect(() => impliedMultiplier({ ...linear, whiteDwarfs: 0 }, observed)).toThrow(/^response.whiteDwarfs = 0/);
    expect(() => impliedMultiplier(linear, { magnetic: 11, total: 10 })).toThrow(/^observed.magnetic = 11/);
  });
});

describe('impliedMultiplierFromPoints', () => {
  it('gives the same intervals as the matching exact response, whatever the order of the points', () => {
    const inOrder = linear.multiplierEdges.map((multiplier, j) => ({
      multiplier,
      magnetic: linear.magneticAt[j],
      whiteDwarfs: linear.whiteDwarfs,
    }));
    const points = [2, 0, 4, 1, 3].map((j) => inOrder[j]);
    const copy = structuredClone(points);
    const fromPoints = impliedMultiplierFromPoints(points, { magnetic: 3, total: 20 });
    const fromResponse = impliedMultiplier(linear, { magnetic: 3, total: 20 });
    expect(points).toEqual(copy); // not reordered
    expect(fromPoints.interval68).toEqual(fromResponse.interval68);
    expect(fromPoints.interval95).toEqual(fromResponse.interval95);
    expect(fromPoints.bestFit).toBe(fromResponse.bestFit);
    expect(fromPoints.method).toMatch(/^response measured at 5 sweep points from separate runs/);
  });

  it('takes the hull of all allowed m when Monte Carlo noise makes the curve non-monotone', () => {
    // f = 10%, 14%, 12%, 20% at m = 0, 1, 2, 3 (different N per point).
    const points = [
      { multiplier: 0, magnetic: 100, whiteDwarfs: 1000 },
      { multiplier: 1, magnetic: 280, whiteDwarfs: 2000 },
      { multiplier: 2, magnetic: 120, whiteDwarfs: 1000 },
      { multiplier: 3, magnetic: 400, whiteDwarfs: 2000 },
    ];
    const result = impliedMultiplierFromPoints(points, { magnetic: 130, total: 1000 }); // 13%
    expect(result.method).toMatch(/not monotone/);
    // 13% is crossed first between m = 0 and 1 (at 0.75): the smallest crossing is the best fit.
    expect(result.bestFit).toBeCloseTo(0.75, 12);
    const f = (m: number) => (m <= 1 ? 0.1 + 0.04 * m : m <= 2 ? 0.14 - 0.02 * (m - 1) : 0.12 + 0.08 * (m - 2));
    const scanned = scanMultipliers(f, 3, 130, 1000, 0.05, 6000);
    expect(Math.abs(result.interval95![0] - scanned![0])).toBeLessThanOrEqual(5e-4);
    expect(Math.abs(result.interval95![1] - scanned![1])).toBeLessThanOrEqual(5e-4);
  });

  it('rejects malformed points', () => {
    const observed = { magnetic: 1, total: 10 };
    expect(() => impliedMultiplierFromPoints([{ multiplier: 0, magnetic: 1, whiteDwarfs: 10 }], observed)).toThrow(/^points = /);
    expect(() =>
      impliedMultiplierFromPoints([{ multiplier: 1, magnetic: 1, whiteDwarfs: 10 }, { multiplier: 1, magnetic: 2, whiteDwarfs: 10 }], observed),
    ).toThrow(/^points.multiplier = 1/);
    expect(() =>
      impliedMultiplierFromPoints([{ multiplier: -1, magnetic: 1, whiteDwarfs: 10 }, { multiplier: 1, magnetic: 2, whiteDwarfs: 10 }], observed),
    ).toThrow(/^points\[0\].multiplier = -1/);
    expect(() =>
      impliedMultiplierFromPoints([{ multiplier: 0, magnetic: 11, whiteDwarfs: 10 }, { multiplier: 1, magnetic: 2, whiteDwarfs: 10 }], observed),
    ).toThrow(/^points\[0\].magnetic = 11/);
  });
});
