import { describe, expect, it } from 'vitest';
import { errorFunction, probit } from 'simple-statistics';
import { EngineError } from '../errors.ts';
import { logNormalUpperTail } from './normal-tail.ts';
import { sigmaFromLogTwoSidedP, sigmaFromTwoSidedP, twoSidedPFromSigma } from './significance.ts';
import { relativeError } from './testing/exact-reference.ts';
import { jStat } from './testing/jstat-reference.ts';

/**
 * ln Q(z) from the asymptotic series Q(z) = φ(z)/z · Σ (−1)^j (2j − 1)!! / z^(2j)
 * (Abramowitz & Stegun 1964, eq. 26.2.12), summed to j = 5; for z ≥ 10 the error is below the
 * first omitted term, 10395/z^12 ≤ 1.04e-8 relative (≤ 2e-14 for z ≥ 30).
 */
function asymptoticLogQ(z: number): { logQ: number; bound: number } {
  let term = 1;
  let series = 1;
  for (let j = 1; j <= 5; j++) {
    term *= -(2 * j - 1) / (z * z);
    series += term;
  }
  return {
    logQ: -0.5 * z * z - Math.log(z * Math.sqrt(2 * Math.PI)) + Math.log(series),
    bound: (11 * Math.abs(term)) / (z * z),
  };
}

describe('sigmaFromTwoSidedP / twoSidedPFromSigma', () => {
  it('gives the conventional 1σ, 2σ, 3σ p-values (common practice, no source)', () => {
    // The p-values are quoted to 4 digits (±5e-5 in p); dσ/dp = 1/(2φ(σ)) turns that into
    // ±1e-4 σ at 1σ, ±5e-4 at 2σ and ±0.01 at 3σ (p = 0.0027 is only 2 significant figures).
    expect(Math.abs(sigmaFromTwoSidedP(0.3173) - 1)).toBeLessThan(1e-4);
    expect(Math.abs(sigmaFromTwoSidedP(0.0455) - 2)).toBeLessThan(5e-4);
    expect(Math.abs(sigmaFromTwoSidedP(0.0027) - 3)).toBeLessThan(0.01);
  });

  it('puts p = 5.7e-10 and 5.65e-10 at 6.2σ (common practice, no source)', () => {
    // Quoted to one decimal in σ, so ±0.05.
    expect(Math.abs(sigmaFromTwoSidedP(5.7e-10) - 6.2)).toBeLessThan(0.05);
    expect(Math.abs(sigmaFromTwoSidedP(5.65e-10) - 6.2)).toBeLessThan(0.05);
  });

  it('gives erfc(1/√2) = 0.31731050786291415 and 2 Q(5) = 5.733031437583878e-7 (tabulated values, from memory)', () => {
    // Both are known to full double precision; the method is good to ~1e-15, so 1e-14.
    expect(relativeError(twoSidedPFromSigma(1), 0.31731050786291415)).toBeLessThan(1e-14);
    expect(relativeError(twoSidedPFromSigma(5), 5.733031437583878e-7)).toBeLessThan(1e-14);
  });

  it('agrees with jStat.normal.inv where jStat is accurate (p ≥ 1e-8)', () => {
    // jStat refines its erfc inverse with two Newton steps on erfc = 1 − erf, good to ~1e-9
    // relative down to p ~ 1e-8 (and no further, see the tail tests below): bound 1e-8.
    for (const p of [0.9, 0.5, 0.1, 0.01, 1e-3, 1e-5, 1e-8]) {
      const ref = -jStat.normal.inv(p / 2, 0, 1);
      expect(relativeError(sigmaFromTwoSidedP(p), ref)).toBeLessThan(1e-8);
    }
  });

  it('follows the asymptotic tail series far beyond double-precision 1 − p/2 (A&S 26.2.12)', () => {
    // Checked in log space up to z = 1000 (p = 10^−217000), where p itself underflows.
    for (const z of [10, 15, 20, 30, 37, 100, 1000]) {
      const { logQ, bound } = asymptoticLogQ(z);
      expect(Math.abs(logNormalUpperTail(z) - logQ)).toBeLessThan(bound + 1e-14 * Math.abs(logQ));
      // the inverse: a relative error ε in p moves σ by ε/(σ · 1) at most in the far tail
      expect(Math.abs(sigmaFromLogTwoSidedP(Math.LN2 + logQ) - z)).toBeLessThan((bound + 1e-14 * Math.abs(logQ)) / z + 1e-13 * z);
    }
  });

  it('inverts itself from 1e-6σ to 37σ', () => {
    // Round trip through a double p: at tiny σ the spacing of doubles near 1 (1.1e-16) limits σ to
    // ~1.4e-16 absolute; elsewhere both directions are good to ~1e-15 relative. (Beyond 37.5σ
    // p < 2.2e-308 is subnormal and has fewer digits; the log form has no such limit.)
    for (const sigma of [1e-6, 0.01, 0.5, 1, 2, 3, 5, 6.2, 8, 10, 20, 30, 37]) {
      expect(Math.abs(sigmaFromTwoSidedP(twoSidedPFromSigma(sigma)) - sigma)).toBeLessThan(1e-12 * sigma + 1e-15);
    }
  });

  it('stays finite and strictly increasing as p falls from 0.1 to 5e-324 and ln p to −1e8', () => {
    let previous = 0;
    for (let j = 1; j <= 323; j++) {
      const sigma = sigmaFromTwoSidedP(10 ** -j);
      expect(Number.isFinite(sigma)).toBe(true);
      expect(sigma).toBeGreaterThan(previous);
      previous = sigma;
    }
    expect(sigmaFromTwoSidedP(5e-324)).toBeGreaterThan(previous);
    for (const logP of [-1e3, -1e4, -1e5, -1e6, -1e7, -1e8]) {
      const sigma = sigmaFromLogTwoSidedP(logP);
      expect(Number.isFinite(sigma)).toBe(true);
      expect(sigma).toBeGreaterThan(previous);
      previous = sigma;
    }
  });

  it('maps p = 1 to 0σ and p = 0 to +∞ (and back)', () => {
    expect(sigmaFromTwoSidedP(1)).toBe(0);
    expect(sigmaFromTwoSidedP(0)).toBe(Infinity);
    expect(twoSidedPFromSigma(0)).toBe(1);
    expect(twoSidedPFromSigma(Infinity)).toBe(0);
  });

  it('rejects invalid input naming the argument', () => {
    expect(() => sigmaFromTwoSidedP(1.5)).toThrow(EngineError);
    expect(() => sigmaFromTwoSidedP(-0.1)).toThrow('p = -0.1 is outside the allowed range [0, 1]');
    expect(() => sigmaFromTwoSidedP(Number.NaN)).toThrow('p = NaN');
    expect(() => twoSidedPFromSigma(-1)).toThrow('sigma = -1 is outside the allowed range [0, Infinity]');
    expect(() => sigmaFromLogTwoSidedP(0.1)).toThrow(/^logP = 0.1/);
  });

  it("documents why simple-statistics' normal functions are not used here", () => {
    // simple-statistics 7.12: errorFunction is Numerical Recipes' erfcc fit (1.2e-7 relative) returned
    // as 1 − erfc, so Q(8) = 6.22e-16 comes out 7% wrong; probit uses Winitzki's closed-form
    // approximation, 1.4e-3 off at 0.975, and is −∞ at 1e-20. Our values are tested above.
    const ssQ8 = 0.5 * (1 - errorFunction(8 / Math.SQRT2));
    expect(relativeError(ssQ8, 6.22096057427178e-16)).toBeGreaterThan(0.01);
    expect(Math.abs(probit(0.975) - 1.959963984540054)).toBeGreaterThan(1e-3);
    expect(probit(1e-20)).toBe(-Infinity);
  });
});
