import { logNormalUpperTail } from '../stats/normal-tail.ts';

/**
 * Standard normal distribution function Φ(x) = Q(−x) = P(Z > −x), from the engine's own upper
 * tail (stats/normal-tail.ts: Q via the regularised incomplete gamma function, Abramowitz &
 * Stegun 1964 eq. 6.5.17, relative error ~1e-15 at any argument), so the far lower tail keeps
 * its relative accuracy instead of the 1.2e-7 of a fitted error function. Used only when a
 * scenario is prepared (the truncation points of a log-normal period distribution), never per
 * system. Valid for all x; Φ(−∞) = 0, Φ(+∞) = 1.
 * Example: standardNormalCdf(−1.959963984540054) = 0.025.
 */
export function standardNormalCdf(x: number): number {
  return Math.exp(logNormalUpperTail(-x));
}
