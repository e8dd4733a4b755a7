import { requireSuccesses } from './validate.ts';

/**
 * Monte Carlo standard error of a fraction estimated as f = k/n from n independent draws,
 * σ_f = √(f(1 − f)/n): k is Binomial(n, f), whose variance n f(1 − f) divided by n² gives this
 * (common practice, no source needed beyond the binomial variance).
 * The same formula serves a fraction of a sub-population, f = k/m with m the (random) number of
 * draws that fell in it: given m, k is Binomial(m, f), so pass n = m. For a fraction of the whole
 * run that only counts a subset (k of them, out of all n), pass the run's n.
 * It is 0 at k = 0 and k = n, where it is not a useful error bar: with k = 0 the fraction can
 * still be as large as ~3/n (use clopperPearson for that case).
 * Dimensionless. Valid for integers 0 ≤ k ≤ n, n ≥ 1.
 * Example: monteCarloStandardError(1000, 100000) = √(0.01 · 0.99 / 1e5) = 3.146e-4.
 */
export function monteCarloStandardError(k: number, n: number): number {
  requireSuccesses('k', k, 'n', n);
  const f = k / n;
  return Math.sqrt((f * (1 - f)) / n);
}

/**
 * A Monte Carlo fraction with its standard error, { value: k/n, se }, the shape that
 * compareWithObserved takes as its prediction. Same source and range as monteCarloStandardError.
 * Example: fractionWithError(210, 10000) = { value: 0.021, se: 0.00143 }.
 */
export function fractionWithError(k: number, n: number): { value: number; se: number } {
  return { value: k / n, se: monteCarloStandardError(k, n) };
}
