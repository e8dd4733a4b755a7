import { describe, expect, it } from 'vitest';
// @ts-ignore -- jstat (dev dependency, the reference library) ships no type declarations
import jstat from 'jstat';
import { normalQuantile } from './normal-quantile.ts';
import { standardNormalCdf } from './normal-cdf.ts';

const { jStat } = jstat as unknown as { jStat: { normal: { inv(p: number, m: number, s: number): number; cdf(x: number, m: number, s: number): number } } };

describe('normal quantile (Wichura 1988, AS 241)', () => {
  it('matches textbook quantiles (common practice, no source): 0.975 → 1.959964, 0.8413447 → 1', () => {
    // Values known to 7 digits; AS 241 is good to ~1e-16, so 1e-6 only reflects the digits quoted.
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 6);
    expect(normalQuantile(0.8413447460685429)).toBeCloseTo(1, 6);
    expect(normalQuantile(0.5)).toBe(0);
  });
  it('agrees with jStat.normal.inv in the body of the distribution', () => {
    // jStat inverts its own erf numerically (~1e-9 relative here; it degrades beyond 1e-6 in
    // the tails, so the tails are checked separately below), so the bound is 1e-8 relative.
    for (const p of [1e-5, 0.001, 0.02, 0.1, 0.3, 0.5, 0.7, 0.9, 0.98, 0.999]) {
      const ref = jStat.normal.inv(p, 0, 1);
      expect(Math.abs(normalQuantile(p) - ref)).toBeLessThan(1e-8 * Math.max(1, Math.abs(ref)));
    }
  });
  it('inverts the tail probability given by Laplace\'s continued fraction (Abramowitz & Stegun 26.2.14)', () => {
    // Φ(−x) = φ(x) / (x + 1/(x + 2/(x + 3/(x + …)))), evaluated here in log space with 200 terms,
    // converges to double precision for x > 4; AS 241 claims ~1e-16, so 1e-12 relative in p is loose.
    const logTail = (x: number) => {
      let cf = x;
      for (let k = 200; k >= 1; k--) cf = x + k / cf;
      return -0.5 * x * x - 0.5 * Math.log(2 * Math.PI) - Math.log(cf);
    };
    for (const p of [1e-6, 1e-10, 1e-20, 1e-100, 1e-300]) {
      const z = normalQuantile(p);
      expect(Math.abs(logTail(-z) - Math.log(p))).toBeLessThan(1e-12);
    }
  });
  it('is antisymmetric and infinite at the ends', () => {
    expect(normalQuantile(0.2)).toBeCloseTo(-normalQuantile(0.8), 14);
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
  });
});

describe('normal distribution function (from the engine\'s own normal tail)', () => {
  it('matches R pnorm to 1e-13 relative, far into the lower tail', () => {
    // R 4.x pnorm(x) printed to 16 significant digits; the tail's own accuracy is ~1e-15, and
    // 1e-13 leaves room for the last digit of the printed reference.
    const pnorm: [number, number][] = [
      [0, 0.5],
      [-1, 0.158655253931457],
      [-2, 0.02275013194817921],
      [-3, 0.001349898031630095],
      [-6, 9.865876450376946e-10],
      [-8, 6.22096057427178e-16],
      [2, 0.9772498680518208],
    ];
    for (const [x, p] of pnorm) expect(Math.abs(standardNormalCdf(x) - p) / p, `x = ${x}`).toBeLessThan(1e-13);
  });
  it('agrees with jStat.normal.cdf (an independent erf) where jStat is accurate', () => {
    for (const x of [-3, -1.5, -0.2, 0, 0.7, 2, 4]) {
      expect(Math.abs(standardNormalCdf(x) - jStat.normal.cdf(x, 0, 1))).toBeLessThan(1e-12);
    }
  });
});
