import { describe, expect, it } from 'vitest';
import { continuedFraction } from './continued-fraction.ts';
import { log1mExp, logAddExp } from './log-space.ts';
import { logConcaveTailSum } from './log-concave-tail-sum.ts';
import { firstTrueIndex } from './monotone-search.ts';
import { relativeError } from './testing/exact-reference.ts';

describe('numerical building blocks', () => {
  it('continuedFraction: golden ratio 1 + 1/(1 + 1/…) and √2 = 1 + 1/(2 + 1/(2 + …))', () => {
    // Lentz multiplies ~40 correction factors, each rounded: a few ulps, so 1e-15 relative.
    expect(relativeError(continuedFraction(1, () => 1, () => 1, 200), (1 + Math.sqrt(5)) / 2)).toBeLessThan(1e-15);
    expect(relativeError(continuedFraction(1, () => 1, () => 2, 200), Math.SQRT2)).toBeLessThan(1e-15);
  });

  it('continuedFraction: tan x = x/(1 − x²/(3 − x²/(5 − …))) (Lambert 1768)', () => {
    const x = 0.7;
    const tan = continuedFraction(0, (j) => (j === 1 ? x : -x * x), (j) => 2 * j - 1, 200);
    expect(relativeError(tan, Math.tan(x))).toBeLessThan(1e-15);
  });

  it('continuedFraction throws instead of returning an unconverged value', () => {
    expect(() => continuedFraction(1, () => 1, () => 1, 5)).toThrow(/did not converge in 5 terms/);
  });

  it('log1mExp and logAddExp keep tiny and near-1 probabilities', () => {
    expect(log1mExp(Math.log(0.25))).toBeCloseTo(Math.log(0.75), 15);
    expect(log1mExp(-1e-20)).toBeCloseTo(Math.log(1e-20), 12); // 1 − e^(−ε) = ε
    expect(log1mExp(-800)).toBe(-0); // e^−800 is below the smallest double: ln(1 − 0) = 0
    expect(logAddExp(-1000, -1000)).toBeCloseTo(-1000 + Math.LN2, 12);
    expect(logAddExp(-Infinity, -3)).toBe(-3);
    expect(logAddExp(-Infinity, -Infinity)).toBe(-Infinity);
  });

  it('logConcaveTailSum sums geometric and Poisson tails', () => {
    // Σ_{i=1}^{60} 2^−i = 1 − 2^−60; the Poisson(3) upper tail from 10 has the closed form
    // 1 − e^−3 Σ_{i<10} 3^i/i!.
    expect(logConcaveTailSum(1, 60, (i) => -i * Math.LN2)).toBeCloseTo(Math.log1p(-(2 ** -60)), 15);
    const logPoisson = (i: number) => i * Math.log(3) - 3 - lnFactorial(i);
    let below = 0;
    for (let i = 0; i < 10; i++) below += Math.exp(logPoisson(i));
    // 1 − below loses ~1e-16/0.0011 ≈ 1e-13 to cancellation; 1e-11 relative.
    expect(relativeError(Math.exp(logConcaveTailSum(10, 400, logPoisson)), 1 - below)).toBeLessThan(1e-11);
    expect(logConcaveTailSum(5, 0, (i) => -(5 - i) * 2)).toBeCloseTo(Math.log((1 - Math.exp(-12)) / (1 - Math.exp(-2))), 14);
  });

  it('firstTrueIndex finds the edge of a monotone predicate, or hi + 1', () => {
    expect(firstTrueIndex(0, 1e7, (i) => i >= 1234567)).toBe(1234567);
    expect(firstTrueIndex(3, 9, () => true)).toBe(3);
    expect(firstTrueIndex(3, 9, () => false)).toBe(10);
  });
});

function lnFactorial(n: number): number {
  let s = 0;
  for (let i = 2; i <= n; i++) s += Math.log(i);
  return s;
}
