import type { FitDetail, FitPosterior } from '../../../shared/contracts/fits.ts';
import {
  IMPLIED_CREDIBLE_LABEL,
  IMPLIED_DIFFERENCE,
  IMPLIED_PRIOR,
  type ImpliedCredible,
  type ImpliedOccurrenceAnswer,
} from '../../../shared/contracts/implied-occurrence.ts';
import { formatAtResolution, formatPercent, formatSignificant } from '../../../shared/engine/stats/format.ts';

/**
 * The fit's posterior over m as the implied-occurrence answer's credible interval: the central
 * 68% and 95% intervals of the marginal (grid-posterior.ts), its peak, and the prior in words.
 */
export function credibleAnswer(posterior: FitPosterior, grid: FitDetail['grid'][number], counts: { magnetic: number; total: number }): ImpliedCredible {
  const [iv] = posterior.intervals;
  const [marginal] = posterior.marginals;
  const m = (x: number) => formatAtResolution(x, iv.hi95 - iv.lo95);
  const priorText = `uniform in m from ${formatSignificant(grid.min, 3)} to ${formatSignificant(grid.max, 3)}`;
  const spacing = (grid.max - grid.min) / (grid.points - 1);
  return {
    kind: 'posterior',
    label: IMPLIED_CREDIBLE_LABEL,
    prior: IMPLIED_PRIOR,
    priorText,
    grid: { min: grid.min, max: grid.max, points: grid.points },
    peak: iv.best,
    interval68: [iv.lo68, iv.hi68],
    interval95: [iv.lo95, iv.hi95],
    marginal: { values: marginal.values, density: marginal.density },
    warnings: posterior.warnings,
    summary:
      `Given the observed ${counts.magnetic} of ${counts.total} (${formatPercent(counts.magnetic / counts.total)}) and a prior ${priorText}, ` +
      `the posterior puts 68% of its probability on a multiplier between ${m(iv.lo68)} and ${m(iv.hi68)} and 95% between ${m(iv.lo95)} and ${m(iv.hi95)}; ` +
      `it peaks at ${m(iv.best)}.`,
    method:
      `posterior p(m) ∝ Binomial(k | n, f(m)) × prior, with f(m) the predicted magnetic fraction of the fit's run at each of ${grid.points} grid nodes ` +
      `(spacing Δm = ${formatSignificant(spacing, 2)}, every node from the same draws), the density taken linear between nodes; ` +
      'central credible intervals (15.87–84.13% and 2.5–97.5% of the posterior)',
  };
}

/** The methods text of an implied-occurrence answer: both answers, each labelled for what it is, then the fit's methods paragraph. */
export function impliedMethodsText(a: {
  sample: ImpliedOccurrenceAnswer['sample'];
  scenarioName: string;
  confidence: NonNullable<ImpliedOccurrenceAnswer['confidence']>;
  credible: ImpliedCredible;
  fitMethods: string;
}): string {
  const { sample, confidence, credible } = a;
  return [
    `Implied companion occurrence for the sample "${sample.name}" (${sample.magnetic} magnetic of ${sample.total} white dwarfs) in the scenario "${a.scenarioName}": ` +
      'the one-parameter fit over the multiplier m of every row of the companion occurrence table.',
    '',
    `${confidence.label}: ${confidence.summary} Method: ${confidence.method}.`,
    '',
    `${credible.label}: ${credible.summary} Method: ${credible.method}.`,
    '',
    IMPLIED_DIFFERENCE,
    '',
    a.fitMethods,
  ].join('\n');
}
