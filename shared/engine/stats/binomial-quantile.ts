import { logBinomialPmf } from './binomial-pmf.ts';
import { logBinomialLowerTail } from './binomial-tail.ts';

/**
 * The binomial quantile: the smallest k with P(X ≤ k) > v, X ~ Binomial(n, p), for v in [0, 1):
 * a Binomial(n, p) variate from one uniform by inversion (Devroye 1986, Non-Uniform Random Variate
 * Generation, §X.4.3, sequential search started at the mode: from memory). The cumulative
 * probability at the mode comes from the incomplete-beta tail (binomial-tail.ts), the pmf from
 * Loader's saddle-point form (binomial-pmf.ts); the search walks from the mode with the pmf ratio
 * P(k + 1)/P(k) = (n − k) p / ((k + 1) q), about √(n p q) steps. Cost: microseconds per call.
 * Example: n = 10, p = 0.5, v = 0.5 → 5 (P(X ≤ 4) = 0.377, P(X ≤ 5) = 0.623).
 */
export function binomialQuantile(v: number, n: number, p: number): number {
  if (!(v >= 0 && v < 1)) throw new RangeError(`v = ${v} is outside the allowed range [0, 1)`);
  if (!(Number.isInteger(n) && n >= 0)) throw new RangeError(`n = ${n} is outside the allowed range (integers ≥ 0)`);
  if (!(p >= 0 && p <= 1)) throw new RangeError(`p = ${p} is outside the allowed range [0, 1]`);
  if (n === 0 || p === 0) return 0;
  if (p === 1) return n;
  const odds = p / (1 - p);
  let k = Math.min(n, Math.floor((n + 1) * p));
  let cdf = Math.exp(logBinomialLowerTail(k, n, p));
  let pmf = Math.exp(logBinomialPmf(k, n, p));
  if (v < cdf) {
    while (k > 0 && cdf - pmf > v) {
      cdf -= pmf;
      pmf *= k / ((n - k + 1) * odds);
      k--;
    }
    return k;
  }
  while (k < n && cdf <= v) {
    pmf *= ((n - k) / (k + 1)) * odds;
    k++;
    cdf += pmf;
  }
  return k;
}
