import { EngineError } from '../errors.ts';
import { kolmogorovUpperTail } from './kolmogorov-distribution.ts';
import { sigmaFromLogTwoSidedP } from './significance.ts';

/** Result of binnedKolmogorovSmirnov: plain data. */
export interface BinnedKsResult {
  /** Largest |observed CDF − model CDF| over the model's bin edges. */
  statistic: number;
  /** Where it was reached (an edge, in the unit of the edges). */
  atEdge: number;
  /** Observed values used (those inside the model's edges). */
  observedCount: number;
  /** Observed values outside the model's edges, left out. */
  outside: number;
  modelCount: number;
  /** n m / (n + m): the two-sample size that carries the model's Monte Carlo error. */
  effectiveCount: number;
  pValue: number;
  sigma: number;
  /** The same test with the model treated as exact (n in place of n m/(n+m)). */
  sigmaModelExact: number;
  /** Per bin: the observed values that fall in it (for overlays and the binned log-likelihood). */
  observedPerBin: number[];
  method: string;
}

export const BINNED_KS_METHOD =
  'Kolmogorov–Smirnov test on grouped data: the largest difference between the observed and the predicted ' +
  'cumulative distributions is taken only at the model’s bin edges, where both are known exactly, so no shape ' +
  'is assumed inside a bin; for a grouped (discontinuous) null distribution the continuous-case p-value is then ' +
  'conservative (Noether 1963, Metrika 7, 115; Conover 1972, J. Am. Stat. Assoc. 67, 591). The model is a ' +
  'finite Monte Carlo sample of m white dwarfs, so the two-sample form is used (Smirnov 1939): effective size ' +
  'n m/(n + m), p from Kolmogorov’s distribution with Stephens’ (1970, J. R. Stat. Soc. B 32, 115) ' +
  'finite-size correction λ = (√N + 0.12 + 0.11/√N) D (Press et al. 2007, Numerical Recipes, 3rd ed., §14.3.3)';

function pOf(statistic: number, size: number): number {
  const root = Math.sqrt(size);
  return kolmogorovUpperTail((root + 0.12 + 0.11 / root) * statistic);
}

/**
 * One list of observed values (masses, log fields, log periods …) against a predicted
 * distribution known as a histogram of m model counts: see BINNED_KS_METHOD for the method and
 * its sources. Accounts for the bin width by never interpolating inside a bin; the price is a
 * conservative p-value (the true p is at most the one given) when bins are wide compared with the
 * differences between the distributions.
 * Units: observed values in the unit of the edges. Valid for edges strictly increasing, counts
 * integers ≥ 0 with a positive total, at least one observed value inside the edges.
 * Example: edges [0, 0.5, 1], model counts [50, 50], observed [0.1, 0.2, 0.3, 0.4] → D = 0.5 at
 * the edge 0.5, effective size 4·100/104 = 3.85, p = 0.20.
 */
export function binnedKolmogorovSmirnov(edges: readonly number[], modelCounts: readonly number[], observed: readonly number[]): BinnedKsResult {
  if (modelCounts.length !== edges.length - 1 || modelCounts.length < 1) {
    throw new EngineError('modelCounts.length', modelCounts.length, `${edges.length - 1} (one per bin, at least 1)`);
  }
  let m = 0;
  modelCounts.forEach((c, i) => {
    if (!Number.isSafeInteger(c) || c < 0) throw new EngineError(`modelCounts[${i}]`, c, 'integers ≥ 0');
    if (!(edges[i + 1] > edges[i])) throw new EngineError(`edges[${i + 1}]`, edges[i + 1], `above edges[${i}] = ${edges[i]}`);
    m += c;
  });
  if (m === 0) throw new EngineError('modelCounts', 0, 'a positive total');
  const perBin = new Array<number>(modelCounts.length).fill(0);
  let outside = 0;
  observed.forEach((x, i) => {
    if (!Number.isFinite(x)) throw new EngineError(`observed[${i}]`, x, 'finite numbers');
    if (x < edges[0] || x >= edges[edges.length - 1]) {
      outside++;
      return;
    }
    // Bisection for the bin [edges[j], edges[j+1]) holding x.
    let lo = 0;
    let hi = modelCounts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (edges[mid] <= x) lo = mid;
      else hi = mid - 1;
    }
    perBin[lo]++;
  });
  const n = observed.length - outside;
  if (n < 1) throw new EngineError('observed', `${observed.length} values, none inside`, `at least one value in [${edges[0]}, ${edges[edges.length - 1]})`);
  let statistic = 0;
  let atEdge = edges[0];
  let modelCum = 0;
  let observedCum = 0;
  for (let i = 0; i < modelCounts.length; i++) {
    modelCum += modelCounts[i];
    observedCum += perBin[i];
    const d = Math.abs(observedCum / n - modelCum / m);
    if (d > statistic) {
      statistic = d;
      atEdge = edges[i + 1];
    }
  }
  const effectiveCount = (n * m) / (n + m);
  const pValue = pOf(statistic, effectiveCount);
  return {
    statistic,
    atEdge,
    observedCount: n,
    outside,
    modelCount: m,
    effectiveCount,
    pValue,
    sigma: sigmaFromLogTwoSidedP(Math.log(pValue)),
    sigmaModelExact: sigmaFromLogTwoSidedP(Math.log(pOf(statistic, n))),
    observedPerBin: perBin,
    method: BINNED_KS_METHOD,
  };
}
