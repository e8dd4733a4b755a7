import { requireInRange } from '../errors.ts';
import { binomialTestTwoSidedLog } from './binomial-test.ts';
import { clopperPearson } from './clopper-pearson.ts';
import { formatPValue, formatPercent, formatPercentRange, formatPercentWithError, formatSigma } from './format.ts';
import { sigmaFromLogTwoSidedP } from './significance.ts';
import { requireProbability, requireSuccesses } from './validate.ts';

/** An observed sample: `magnetic` strongly magnetic white dwarfs among `total`. */
export interface ObservedCounts {
  magnetic: number;
  total: number;
}

/** The verdict of compareWithObserved: plain data, safe to send between workers or over HTTP. */
export interface ObservedComparison {
  observed: {
    magnetic: number;
    total: number;
    fraction: number;
    interval68: [number, number];
    interval95: [number, number];
  };
  predicted: { value: number; se: number };
  pValue: number;
  sigma: number;
  predictedInside68: boolean;
  predictedInside95: boolean;
  mcErrorMatters: boolean;
  summary: string;
  method: string;
}

/**
 * The prediction's Monte Carlo error "matters" when it exceeds this fraction of the half-width
 * of the observed 68% interval. Shifting the prediction by one standard error moves the
 * Gaussian-equivalent significance by about se / (that half-width), so at 0.1 it moves by
 * ~0.1σ — the precision to which the significance is quoted. Below that it cannot change the
 * stated result.
 */
export const MC_ERROR_NEGLIGIBLE_RATIO = 0.1;

/** Wording by Gaussian-equivalent significance: < 2σ, 2–3σ, 3–5σ, ≥ 5σ (common practice, no source). */
export function verdict(sigma: number): string {
  if (sigma < 2) return 'is consistent with';
  if (sigma < 3) return 'is in mild tension with';
  if (sigma < 5) return 'is in strong tension with';
  return 'rules out';
}

function interval(k: number, n: number, confidence: number): [number, number] {
  const { lower, upper } = clopperPearson(k, n, confidence);
  return [lower, upper];
}

/**
 * Sets a model's predicted magnetic fraction (value ± Monte Carlo standard error) against an
 * observed k magnetic of n: the exact two-sided binomial test of k against the prediction
 * (binomialTestTwoSided, the method of R's binom.test), its Gaussian-equivalent significance,
 * Clopper & Pearson (1934, Biometrika 26, 404) 68% and 95% intervals of the observed fraction,
 * and whether the Monte Carlo error could change the verdict (MC_ERROR_NEGLIGIBLE_RATIO).
 * The test treats the prediction as exact; `mcErrorMatters` says when that is not safe.
 * A prediction of exactly 0 (or 1) that the data contradict gives pValue 0 and sigma = +∞, the
 * only non-finite output (JSON has no infinity, so a caller sending it over HTTP must map it).
 * Fractions are dimensionless. Valid for 0 ≤ value ≤ 1, 0 ≤ se ≤ 1, integers
 * 0 ≤ magnetic ≤ total, total ≥ 1. Inputs are not modified.
 * Example: predicted { value: 0.021, se: 0.001 } against 0 of 37 → p = 1 (0 is the most likely
 * count when 0.78 are expected), 0.0σ, observed 95% interval [0, 0.0949].
 */
export function compareWithObserved(predicted: { value: number; se: number }, observed: ObservedCounts): ObservedComparison {
  const value = requireProbability('predicted.value', predicted.value);
  const se = requireInRange('predicted.se', predicted.se, 0, 1);
  const { magnetic: k, total: n } = observed;
  requireSuccesses('observed.magnetic', k, 'observed.total', n);

  const fraction = k / n;
  const interval68 = interval(k, n, 0.68);
  const interval95 = interval(k, n, 0.95);
  const logP = binomialTestTwoSidedLog(k, n, value);
  const sigma = sigmaFromLogTwoSidedP(logP);
  const halfWidth68 = 0.5 * (interval68[1] - interval68[0]);
  const mcErrorMatters = se > MC_ERROR_NEGLIGIBLE_RATIO * halfWidth68;

  const [observedText, lowerText, upperText] = formatPercentRange(fraction, interval95[0], interval95[1]);
  const mcClause = mcErrorMatters
    ? `, although the prediction's Monte Carlo error is not negligible against the observed 68% ` +
      `interval (half-width ${formatPercent(halfWidth68)})`
    : '';
  const summary =
    `The observed ${k} of ${n} (${observedText}%; 95% interval ${lowerText}–${upperText}%) ` +
    `${verdict(sigma)} the predicted ${formatPercentWithError(value, se)} ` +
    `(p = ${formatPValue(logP)}, ${formatSigma(sigma)})${mcClause}.`;

  return {
    observed: { magnetic: k, total: n, fraction, interval68, interval95 },
    predicted: { value, se },
    pValue: Math.exp(logP),
    sigma,
    predictedInside68: interval68[0] <= value && value <= interval68[1],
    predictedInside95: interval95[0] <= value && value <= interval95[1],
    mcErrorMatters,
    summary,
    method:
      'exact two-sided binomial test of the observed count against the predicted fraction ' +
      '(outcomes no more likely than the observed one, relative tie tolerance 1e-7, as R binom.test); ' +
      'Gaussian-equivalent two-sided significance; Clopper–Pearson (1934) 68% and 95% intervals; ' +
      `the Monte Carlo error counts as not negligible above ${MC_ERROR_NEGLIGIBLE_RATIO} of the ` +
      'half-width of the observed 68% interval',
  };
}
