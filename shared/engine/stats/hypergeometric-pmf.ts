import { logBinomialPmfUnchecked } from './binomial-pmf.ts';

/**
 * Natural log of the hypergeometric probability of x marked items in a draw of `drawn` from a
 * population of `marked` + `unmarked`, written through three binomial probabilities with a common
 * p = drawn/(marked + unmarked) so that each comes from Loader's accurate saddle-point formula
 * (Loader 2000, "Fast and Accurate Computation of Binomial Probabilities"; as in R's dhyper):
 *   ln P = ln b(x; marked, p) + ln b(drawn − x; unmarked, p) − ln b(drawn; marked + unmarked, p).
 * The powers of p and 1 − p cancel exactly, leaving C(marked, x) C(unmarked, drawn − x) / C(N, drawn).
 * Unchecked: callers pass integers with max(0, drawn − unmarked) ≤ x ≤ min(drawn, marked),
 * 1 ≤ drawn ≤ N − 1 and marked, unmarked ≥ 1.
 * Example: logHypergeometricPmf(3, 4, 4, 4) = ln(16/70) (Fisher's tea-tasting table).
 */
export function logHypergeometricPmf(x: number, marked: number, unmarked: number, drawn: number): number {
  const p = drawn / (marked + unmarked);
  return (
    logBinomialPmfUnchecked(x, marked, p) +
    logBinomialPmfUnchecked(drawn - x, unmarked, p) -
    logBinomialPmfUnchecked(drawn, marked + unmarked, p)
  );
}
