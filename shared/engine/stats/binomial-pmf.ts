import { requireProbability, requireSuccesses } from './validate.ts';

const LN_2PI = Math.log(2 * Math.PI);
const LN_SQRT_2PI = 0.5 * LN_2PI;

// Stirling-series coefficients B_2j / (2j (2j − 1)) with Bernoulli numbers B2 = 1/6,
// B4 = −1/30, B6 = 1/42, B8 = −1/30, B10 = 5/66 (Abramowitz & Stegun 1964, eq. 6.1.40).
const S0 = 1 / 12;
const S1 = 1 / 360;
const S2 = 1 / 1260;
const S3 = 1 / 1680;
const S4 = 1 / 1188;

// 0!, 1!, …, 15!: all exact in a double (< 2^53), so small n need no series.
const FACTORIALS = Array.from({ length: 16 }, (_, n) => {
  let f = 1;
  for (let i = 2; i <= n; i++) f *= i;
  return f;
});

/**
 * Error of Stirling's formula, stirlerr(n) = ln n! − ln(√(2πn) (n/e)^n), for a positive
 * integer n (Loader 2000). Exact factorials up to 15; above, five terms of the Stirling
 * series, whose first omitted term is below 2e-16 at n = 16.
 */
function stirlingError(n: number): number {
  if (n <= 15) return Math.log(FACTORIALS[n]) - (n + 0.5) * Math.log(n) + n - LN_SQRT_2PI;
  const nn = n * n;
  return (S0 - (S1 - (S2 - (S3 - S4 / nn) / nn) / nn) / nn) / n;
}

/**
 * Loader's deviance term bd0(x, μ) = x ln(x/μ) + μ − x ≥ 0. When x is near μ the two halves
 * nearly cancel, so the series in v = (x − μ)/(x + μ) is summed instead (Loader 2000).
 */
function devianceTerm(x: number, mu: number): number {
  if (Math.abs(x - mu) < 0.1 * (x + mu)) {
    const v = (x - mu) / (x + mu);
    let sum = (x - mu) * v;
    let term = 2 * x * v;
    for (let j = 1; j < 100; j++) {
      term *= v * v;
      const next = sum + term / (2 * j + 1);
      if (next === sum) return next;
      sum = next;
    }
    return sum;
  }
  return x * Math.log(x / mu) + mu - x;
}

/**
 * Natural log of the binomial probability P(X = k) for X ~ Binomial(n, p), by the saddle-point
 * expansion of Loader (2000, "Fast and Accurate Computation of Binomial Probabilities",
 * technical note; the algorithm behind R's dbinom):
 *   ln P = stirlerr(n) − stirlerr(k) − stirlerr(n−k) − bd0(k, np) − bd0(n−k, nq)
 *          − ½ ln(2π k (n−k)/n).
 * Unlike a difference of log-gamma values (each ~ n ln n ≈ 1.6e8 at n = 1e7, so ~1e-8 absolute
 * rounding), every term here is small, and the result keeps ~1e-14 relative accuracy for any n.
 * Valid for integers 0 ≤ k ≤ n (n ≥ 1) and 0 ≤ p ≤ 1; p = 0 and p = 1 are exact (0 or −∞).
 * Example: logBinomialPmf(3, 10, 0.5) = ln(120/1024) = −2.1439800628174073.
 */
export function logBinomialPmf(k: number, n: number, p: number): number {
  requireSuccesses('k', k, 'n', n);
  requireProbability('p', p);
  return logBinomialPmfUnchecked(k, n, p);
}

/** logBinomialPmf without input checks, for loops whose arguments are already valid. */
export function logBinomialPmfUnchecked(k: number, n: number, p: number): number {
  if (p === 0) return k === 0 ? 0 : -Infinity;
  if (p === 1) return k === n ? 0 : -Infinity;
  // log1p keeps n ln(1 − p) accurate when p is tiny; 1 − p itself would round.
  if (k === 0) return n * Math.log1p(-p);
  if (k === n) return n * Math.log(p);
  const q = 1 - p;
  const lc =
    stirlingError(n) - stirlingError(k) - stirlingError(n - k) -
    devianceTerm(k, n * p) - devianceTerm(n - k, n * q);
  const lf = LN_2PI + Math.log(k) + Math.log1p(-k / n);
  return lc - 0.5 * lf;
}
