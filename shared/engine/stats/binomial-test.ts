import { logBinomialPmfUnchecked } from './binomial-pmf.ts';
import { logBinomialLowerTail, logBinomialUpperTail } from './binomial-tail.ts';
import { logAddExp } from './log-space.ts';
import { firstTrueIndex } from './monotone-search.ts';
import { requireProbability, requireSuccesses } from './validate.ts';

// R's binom.test counts an outcome as "no more likely" when its probability is within a
// relative 1e-7 of the observed one, so that ties broken by rounding still count.
const LOG_REL_ERR = Math.log1p(1e-7);

/**
 * Natural log of the two-sided exact binomial p-value of k successes in n trials against a
 * success probability p: the total probability of all outcomes no more likely than the observed
 * one — the "minimum likelihood" two-sided rule (Fay 2010, The R Journal 2(1), 53) as coded in
 * R's binom.test (R Core Team, stats package), including its relative tie tolerance of 1e-7.
 * The pmf is unimodal, so the outcomes on the far side of the mean that qualify form a tail whose
 * edge is found by bisection; both tails come from the incomplete beta function, which keeps the
 * cost at O(√n) for n up to 1e7 and beyond. p = 0 and p = 1 are exact (the p-value is 1 or 0).
 * Valid for integers 0 ≤ k ≤ n (n ≥ 1), 0 ≤ p ≤ 1. Returns a value ≤ 0 (−∞ for an impossible k).
 * Example: binomialTestTwoSidedLog(682, 925, 0.75) ≈ ln 0.3825 (R's binom.test help page).
 */
export function binomialTestTwoSidedLog(k: number, n: number, p: number): number {
  requireSuccesses('k', k, 'n', n);
  requireProbability('p', p);
  if (p === 0) return k === 0 ? 0 : -Infinity;
  if (p === 1) return k === n ? 0 : -Infinity;
  const mean = n * p;
  if (k === mean) return 0;
  const threshold = logBinomialPmfUnchecked(k, n, p) + LOG_REL_ERR;
  const noMoreLikely = (i: number) => logBinomialPmfUnchecked(i, n, p) <= threshold;
  let logP: number;
  if (k < mean) {
    // The pmf does not increase from ceil(mean) on, so the qualifying outcomes there are j … n.
    const j = firstTrueIndex(Math.ceil(mean), n, noMoreLikely);
    if (j === k + 1) return 0; // 0 … k and k + 1 … n: every outcome counts, p = 1 exactly
    const far = j <= n ? logBinomialUpperTail(j, n, p) : -Infinity;
    logP = logAddExp(logBinomialLowerTail(k, n, p), far);
  } else {
    // The pmf does not decrease up to floor(mean), so the qualifying outcomes there are 0 … j.
    const j = firstTrueIndex(0, Math.floor(mean), (i) => !noMoreLikely(i)) - 1;
    if (j === k - 1) return 0; // every outcome counts, p = 1 exactly
    const far = j >= 0 ? logBinomialLowerTail(j, n, p) : -Infinity;
    logP = logAddExp(far, logBinomialUpperTail(k, n, p));
  }
  return Math.min(0, logP);
}

/**
 * Two-sided exact binomial p-value of k successes in n trials against probability p, in [0, 1];
 * see binomialTestTwoSidedLog for the method and source. Below ~1e-308 it underflows to 0: use
 * the log form for significances.
 * Example: binomialTestTwoSided(682, 925, 0.75) ≈ 0.3825 (R's binom.test help page, Mendel's peas).
 */
export function binomialTestTwoSided(k: number, n: number, p: number): number {
  return Math.exp(binomialTestTwoSidedLog(k, n, p));
}
