import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';

/**
 * The exact two-sided binomial test of k of n against a fraction p as R's binom.test defines it
 * (R Core Team, stats package): the total probability of the counts no more likely than k, with
 * R's relative tie tolerance of 1e-7. Built on jstat's binomial pmf, so it is independent of the
 * engine's log-space implementation it checks.
 */
export function binomTestTwoSided(k: number, n: number, p: number): number {
  const observed = jStat.binomial.pdf(k, n, p);
  let total = 0;
  for (let j = 0; j <= n; j++) {
    const pj = jStat.binomial.pdf(j, n, p);
    if (pj <= observed * (1 + 1e-7)) total += pj;
  }
  return Math.min(1, total);
}
