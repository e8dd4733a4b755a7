import { EngineError } from '../errors.ts';
import { logAddExp } from './log-space.ts';
import { sigmaFromLogTwoSidedP } from './significance.ts';

/** Result of fisherCombination: plain data. */
export interface CombinedTest {
  /** X² = −2 Σ ln p_i; +∞ when some p_i is 0. */
  statistic: number;
  degreesOfFreedom: number;
  logP: number;
  pValue: number;
  sigma: number;
  method: string;
}

/**
 * Fisher's method for combining independent tests (Fisher 1932, Statistical Methods for Research
 * Workers, 4th ed., §21.1): under the joint null hypothesis X² = −2 Σ ln p_i follows χ² with 2m
 * degrees of freedom for m independent p-values. For even degrees of freedom the χ² upper tail
 * has the closed form P(χ²_{2m} > x) = e^(−x/2) Σ_{j<m} (x/2)^j / j! (Abramowitz & Stegun 1964,
 * eq. 26.4.21 with the Poisson sum), evaluated here in log space so that a combined p far below
 * 1e-308 keeps its value and its σ. Takes natural logs of the p-values (each ≤ 0; −∞ allowed).
 * Valid for 1 ≤ m ≤ 10^4. The tests must be independent; the caller says so.
 * Example: p = 0.01, 0.2, 0.5 → X² = 13.8155, 6 d.o.f., p = 0.031766 (scipy.stats.combine_pvalues).
 */
export function fisherCombination(logPValues: readonly number[]): CombinedTest {
  const m = logPValues.length;
  if (m < 1 || m > 1e4) throw new EngineError('logPValues.length', m, '1 … 10000');
  logPValues.forEach((l, i) => {
    if (Number.isNaN(l) || l > 0) throw new EngineError(`logPValues[${i}]`, l, '[-Infinity, 0]');
  });
  const half = -logPValues.reduce((a, b) => a + b, 0); // x/2
  let logP: number;
  if (half === Infinity) logP = -Infinity;
  else if (half === 0) logP = 0;
  else {
    // ln Σ_{j<m} (x/2)^j / j!, summed in log space term by term.
    let logTerm = 0;
    let logSum = 0;
    for (let j = 1; j < m; j++) {
      logTerm += Math.log(half) - Math.log(j);
      logSum = logAddExp(logSum, logTerm);
    }
    logP = Math.min(0, -half + logSum);
  }
  return {
    statistic: 2 * half,
    degreesOfFreedom: 2 * m,
    logP,
    pValue: Math.exp(logP),
    sigma: sigmaFromLogTwoSidedP(logP),
    method:
      "Fisher's method (Fisher 1932): X² = −2 Σ ln p over the constraints, compared with χ² of 2m degrees " +
      'of freedom; it treats the constraints as independent, which observations of different samples are ' +
      'but constraints drawn from one survey need not be',
  };
}
