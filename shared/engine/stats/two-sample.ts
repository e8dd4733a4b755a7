import { logHypergeometricPmf } from './hypergeometric-pmf.ts';
import { logAddExp } from './log-space.ts';
import { logConcaveTailSum } from './log-concave-tail-sum.ts';
import { firstTrueIndex } from './monotone-search.ts';
import { sigmaFromLogTwoSidedP } from './significance.ts';
import { requireSuccesses } from './validate.ts';

// As R's fisher.test: tables within a relative 1e-7 of the observed probability count as ties.
const LOG_REL_ERR = Math.log1p(1e-7);

/** Result of sameFractionTest: plain data, safe to send between workers or over HTTP. */
export interface SameFractionResult {
  pValue: number;
  sigma: number;
  method: string;
}

/**
 * Do two samples (k1 magnetic of n1, k2 of n2) share one underlying fraction? Fisher's exact
 * test of the 2×2 table (Fisher 1934, Statistical Methods for Research Workers, 5th ed., §21.02;
 * Fisher 1935, J. R. Stat. Soc. 98, 39, as cited by R's fisher.test help page), two-sided as in
 * R's fisher.test (R Core Team, stats package): with both margins fixed, k1 is hypergeometric, and the p-value sums the
 * probabilities of all tables no more likely than the observed one (relative tolerance 1e-7).
 * The pmf is unimodal, so the qualifying tables form two tails whose inner edges are found by
 * bisection and whose sums stop once the rest is negligible (cost ~ the width of the pmf, not
 * the size of the samples). Computed in log space; `sigma` is its Gaussian-equivalent
 * significance and stays finite when the p-value underflows.
 * Valid for integers 0 ≤ k1 ≤ n1, 0 ≤ k2 ≤ n2, n1, n2 ≥ 1.
 * Example: sameFractionTest(3, 4, 1, 4) → pValue = 34/70 = 0.4857 (R's fisher.test help page,
 * tea tasting, two-sided; from memory).
 */
export function sameFractionTest(k1: number, n1: number, k2: number, n2: number): SameFractionResult {
  requireSuccesses('k1', k1, 'n1', n1);
  requireSuccesses('k2', k2, 'n2', n2);
  const marked = k1 + k2;
  const unmarked = n1 + n2 - marked;
  const logP = logFisherTwoSided(k1, marked, unmarked, n1);
  return {
    pValue: Math.exp(logP),
    sigma: sigmaFromLogTwoSidedP(logP),
    method:
      "Fisher's exact test of the 2×2 table, two-sided (sum of the hypergeometric probabilities " +
      "of all tables no more likely than the observed one, relative tolerance 1e-7, as R's " +
      'fisher.test); sigma is the Gaussian-equivalent two-sided significance',
  };
}

function logFisherTwoSided(x: number, marked: number, unmarked: number, drawn: number): number {
  const lo = Math.max(0, drawn - unmarked);
  const hi = Math.min(drawn, marked);
  if (lo === hi) return 0; // only one table has these margins
  const logPmf = (i: number) => logHypergeometricPmf(i, marked, unmarked, drawn);
  const mode = Math.min(hi, Math.max(lo, Math.floor(((drawn + 1) * (marked + 1)) / (marked + unmarked + 2))));
  const threshold = logPmf(x) + LOG_REL_ERR;
  // The pmf rises up to the mode and falls after it, so the qualifying tables are lo … a and b … hi.
  const a = firstTrueIndex(lo, mode, (i) => logPmf(i) > threshold) - 1;
  const b = firstTrueIndex(mode, hi, (i) => logPmf(i) <= threshold);
  if (a >= b - 1) return 0;
  const left = a >= lo ? logConcaveTailSum(a, lo, logPmf) : -Infinity;
  const right = b <= hi ? logConcaveTailSum(b, hi, logPmf) : -Infinity;
  return Math.min(0, logAddExp(left, right));
}
