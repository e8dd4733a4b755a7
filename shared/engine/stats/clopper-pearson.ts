import { logBinomialUpperTail } from './binomial-tail.ts';
import { requireOpenUnit, requireSuccesses } from './validate.ts';

/**
 * Lower Clopper–Pearson limit for 1 ≤ k ≤ n: the L with P(X ≥ k | n, L) = tail, i.e. the beta
 * quantile B⁻¹(tail; k, n − k + 1), found by bisection on the exact binomial tail (which rises
 * with L). Bisection is slow but cannot fail; it stops at a relative width of 1e-15, below the
 * ~1e-13 accuracy of the tail itself.
 */
function lowerLimit(k: number, n: number, logTail: number): number {
  // k = n has the closed form L^n = tail.
  if (k === n) return Math.exp(logTail / n);
  let lo = 0;
  let hi = 1;
  for (let iteration = 0; iteration < 2000 && hi - lo > 1e-15 * hi; iteration++) {
    const mid = 0.5 * (lo + hi);
    if (logBinomialUpperTail(k, n, mid) < logTail) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * The exact ("central") confidence interval for a binomial proportion of Clopper & Pearson
 * (1934, Biometrika 26, 404): the lower limit solves P(X ≥ k | p) = α/2 and the upper limit
 * P(X ≤ k | p) = α/2, with α = 1 − confidence. Coverage is at least `confidence` for every p.
 * k = 0 gives [0, 1 − (α/2)^(1/n)] and k = n gives [(α/2)^(1/n), 1] in closed form; the upper
 * limit is computed as 1 − (lower limit of n − k successes), which is the same equation.
 * Dimensionless fractions. Valid for integers 0 ≤ k ≤ n (n ≥ 1) and 0 < confidence < 1.
 * Example: clopperPearson(682, 925, 0.95) = { lower: 0.7076683, upper: 0.7654066 }
 * (R's binom.test help page, Mendel's peas).
 */
export function clopperPearson(k: number, n: number, confidence: number): { lower: number; upper: number } {
  requireSuccesses('k', k, 'n', n);
  requireOpenUnit('confidence', confidence);
  const logTail = Math.log((1 - confidence) / 2);
  const lower = k === 0 ? 0 : lowerLimit(k, n, logTail);
  // For k = 0 this is −expm1(ln(α/2)/n) = 1 − (α/2)^(1/n) without cancellation at large n.
  const upper = k === n ? 1 : k === 0 ? -Math.expm1(logTail / n) : 1 - lowerLimit(n - k, n, logTail);
  return { lower, upper };
}
