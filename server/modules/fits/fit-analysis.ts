import type { Evaluation } from '../../../shared/contracts/constraints.ts';
import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { FitParameter, FitPosterior } from '../../../shared/contracts/fits.ts';
import { formatGridValue, intervalCaveat } from '../../../shared/contracts/fit-interval-words.ts';
import { SWEEPABLE_PARAMETERS, ScenarioValidationError, withParameter, type Scenario } from '../../../shared/contracts/scenario.ts';
import { multiplierMaxFor } from '../../../shared/engine/kernel/scenario-physics.ts';
import type { PointValues } from '../../../shared/engine/kernel/run-points.ts';
import type { ChunkTally } from '../../../shared/engine/kernel/tally.ts';
import { buildResult } from '../../../shared/engine/result/build-result.ts';
import { formatPValue, formatSigma } from '../../../shared/engine/stats/format.ts';
import { gridNodes, gridPosterior } from '../../../shared/engine/stats/grid-posterior.ts';
import { methodsParagraph, paragraphCitations, type ParagraphResult } from '../../../shared/engine/result/methods-paragraph.ts';
import { MC_LIMITED_SIGMA_SHIFT, evaluateConstraints, type EvaluableResult, type ResolvedConstraint } from '../constraints/evaluate.ts';

/** What a fit is: the scenario, the grid and the constraints it is scored against. */
export interface FitDefinition {
  /** The scenario as run (systems and seed set, stored table rows inlined); the grid values replace its own. */
  scenario: Scenario;
  parameters: FitParameter[];
  constraints: ResolvedConstraint[];
  constraintSet: Evaluation['constraintSet'];
}

export function parameterWords(path: string): { label: string; unit: string } {
  const known = SWEEPABLE_PARAMETERS.find((p) => p.path === path);
  return { label: known?.label ?? path, unit: known?.unit ?? '' };
}

/** Every grid node as scenario paths and values, row-major (the last parameter varies fastest). */
export function fitPoints(parameters: readonly FitParameter[]): PointValues[] {
  return gridNodes(parameters).map((node) => Object.fromEntries(parameters.map((p, i) => [p.path, node[i]])));
}

/** The best point's values; a parameter the likelihood is flat along has no preferred value, and says so. */
const bestWords = (posterior: FitPosterior) =>
  Object.entries(posterior.bestPoint.values)
    .map(([path, v]) => `${parameterWords(path).label} = ${num(v)}${posterior.intervals.find((iv) => iv.path === path)?.flat ? ' (any grid value: the likelihood is flat along it)' : ''}`)
    .join(', ');

const num = formatGridValue;

export const FIT_METHOD =
  'Posterior on a grid: p(θ) ∝ L(θ) π(θ), with L the constraint set\'s joint likelihood (the product of the per-constraint likelihoods, treated as independent) ' +
  'of the prediction at each grid node. Every node is computed from the same random draws (common random numbers), so the surface is smooth in θ. ' +
  'Predicted fractions with a published value ± error enter a Gaussian whose variance adds the Monte Carlo variance; counts enter as binomial probabilities of the predicted fraction; ' +
  'where the Monte Carlo error of a prediction is not negligible the fit names the constraint. Marginals integrate the other parameters with the trapezoidal rule; ' +
  'intervals are central credible intervals (15.87–84.13% and 2.5–97.5% of the marginal, density linear between nodes); the best point is the node of highest likelihood, ' +
  'and its goodness of fit is Fisher\'s combination of the per-constraint p-values there, not corrected for the parameters fitted (so it overstates the agreement).';

/**
 * Whether each end of a parameter's range is the parameter's own limit: the scenario's schema allows
 * nothing beyond it (α_CE below its floor, a negative multiplier), or for the multiplier the largest
 * value its rows allow (1 / the largest row occurrence). A step of 1e-9 relative probes just beyond.
 */
export function rangeLimits(scenario: Scenario, p: Pick<FitParameter, 'path' | 'min' | 'max'>): { lower: boolean; upper: boolean } {
  const outside = (x: number) => {
    try {
      withParameter(scenario, p.path, x);
      return false;
    } catch (error) {
      if (error instanceof ScenarioValidationError) return true;
      throw error;
    }
  };
  const step = (x: number) => Math.max(Math.abs(x), 1e-12) * 1e-9;
  const multiplierTop = p.path === 'companions.multiplier' && p.max >= multiplierMaxFor(scenario.companions.rows ?? []) * (1 - 1e-12);
  return { lower: outside(p.min - step(p.min)), upper: multiplierTop || outside(p.max + step(p.max)) };
}

/**
 * A grid node's result as the fit scores it and as the best point's methods paragraph reads it (no
 * comparison with the scenario's own observed counts: neither reads it).
 */
export function nodeResult(scenario: Scenario, tally: ChunkTally): ScenarioResult {
  return buildResult(scenario, tally, { compareObserved: false });
}

/**
 * The posterior of a fit from the prediction at every grid node: each node's result is scored
 * against the constraint set (the joint log-likelihood of evaluateConstraints), then the grid
 * posterior gives marginals, intervals and warnings. `resultAt(i)` is asked once per node, so
 * callers may build results lazily.
 */
export function analyseFit(definition: FitDefinition, pointCount: number, resultAt: (index: number) => EvaluableResult): FitPosterior {
  const { parameters, constraints, constraintSet } = definition;
  const logLikelihood: (number | null)[] = [];
  let best: { index: number; evaluation: Evaluation } | null = null;
  for (let i = 0; i < pointCount; i++) {
    const evaluation = evaluateConstraints(resultAt(i), constraints, constraintSet);
    const ll = evaluation.combined.logLikelihood;
    logLikelihood.push(ll);
    if (ll !== null && Number.isFinite(ll) && (best === null || ll > (best.evaluation.combined.logLikelihood ?? -Infinity))) best = { index: i, evaluation };
  }
  if (best === null) {
    const evaluation = evaluateConstraints(resultAt(0), constraints, constraintSet);
    const reasons = evaluation.constraints.map((c) => `"${c.label}": ${c.verdict}`).join('; ');
    throw new Error(`No grid point could be scored against the constraint set "${constraintSet.name}" (${reasons}).`);
  }
  const grid = gridPosterior(
    parameters.map((p) => ({ ...p, label: parameterWords(p.path).label, limits: rangeLimits(definition.scenario, p) })),
    logLikelihood,
  );
  const node = gridNodes(parameters)[best.index];
  const values = Object.fromEntries(parameters.map((p, i) => [p.path, node[i]]));
  const mcLimited = best.evaluation.constraints.filter((c) => c.status === 'scored' && c.mcLimited).map((c) => c.label);
  const warnings = [...grid.warnings];
  for (const label of mcLimited) {
    warnings.push(
      `At the best point the Monte Carlo error of the prediction for "${label}" is not negligible against the observed error (moving the prediction by ±1 SE moves σ by more than ${MC_LIMITED_SIGMA_SHIFT}): the likelihood surface carries Monte Carlo noise; run more systems per point.`,
    );
  }
  const unscored = best.evaluation.constraints.filter((c) => c.status !== 'scored').map((c) => `"${c.label}"`);
  if (unscored.length > 0) warnings.push(`Not in the likelihood: ${unscored.join(', ')} (not testable against this scenario's results; see the scorecard).`);
  const combined = best.evaluation.combined;
  return {
    parameters: grid.parameters.map((p) => ({ ...p, ...parameterWords(p.path) })),
    logLikelihood: grid.logLikelihood,
    marginals: grid.marginals,
    intervals: grid.intervals,
    bestPoint: { values, logLikelihood: combined.logLikelihood, goodnessOfFit: { p: combined.p, sigma: combined.sigma }, evaluation: best.evaluation },
    mcLimited,
    warnings,
    sentence: fitSentence(definition, grid.intervals, combined, warnings.length > 0),
    method: FIT_METHOD,
  };
}

function fitSentence(definition: FitDefinition, intervals: FitPosterior['intervals'], combined: Evaluation['combined'], caveats: boolean): string {
  const ranges = intervals.map((iv, i) => {
    const { label, unit } = parameterWords(iv.path);
    const u = unit ? ` ${unit}` : '';
    const caveat = intervalCaveat(iv, definition.parameters[i], unit);
    if (iv.flat) return `${label} ${caveat}`;
    return `${label} between ${num(iv.lo68)} and ${num(iv.hi68)}${u} (68%; ${num(iv.lo95)}–${num(iv.hi95)}${u} at 95%${caveat ? `; ${caveat}` : ''})`;
  });
  const list = ranges.length === 1 ? ranges[0] : `${ranges.slice(0, -1).join(', ')} and ${ranges[ranges.length - 1]}`;
  const n = definition.constraints.length;
  const gof = combined.p !== null && combined.sigma !== null ? `; at the best grid point the model ${combined.sigma < 2 ? 'is consistent with' : 'is in tension with'} the data (p = ${formatPValue(Math.log(Math.max(combined.p, 1e-300)))}, ${formatSigma(combined.sigma)})` : '';
  return `We find ${list}, given the ${n} constraint${n === 1 ? '' : 's'} of "${definition.constraintSet.name}" with ${definition.scenario.systems.toLocaleString('en-US')} model systems per grid point${gof}${caveats ? ' (see the warnings)' : ''}.`;
}

/** The row-major index of the posterior's best point among fitPoints(parameters). */
export function bestNodeIndex(parameters: readonly FitParameter[], posterior: Pick<FitPosterior, 'bestPoint'>): number {
  return fitPoints(parameters).findIndex((point) => Object.entries(posterior.bestPoint.values).every(([path, v]) => point[path] === v));
}

/**
 * The methods paragraph of a fit: the grid, the priors, the constraint set with its citations, the
 * Monte Carlo size and the engine version; with `best`, the model at the best grid point in the run
 * paragraph's words (every physics choice with its citation, the scenario hash), so that the fit can
 * be reproduced from the text and not only from the scenario's name.
 */
export function fitMethodsParagraph(
  definition: FitDefinition,
  posterior: FitPosterior,
  meta: { engineVersion: string; fitId: string | null; scenarioName: string; best?: { scenario: Scenario; result: ParagraphResult } },
): string {
  const { scenario, parameters, constraints, constraintSet } = definition;
  const points = parameters.reduce((n, p) => n * p.points, 1);
  const grid = parameters
    .map((p) => {
      const { label, unit } = parameterWords(p.path);
      const u = unit ? ` ${unit}` : '';
      return `${label} (${p.path}) on ${p.points} ${p.scale === 'log' ? 'logarithmically' : 'linearly'} spaced values from ${num(p.min)} to ${num(p.max)}${u} with a ${p.prior === 'logUniform' ? 'log-uniform (∝ 1/value)' : 'uniform'} prior`;
    })
    .join('; ');
  const cited = constraints.map((c) => {
    const label = c.constraint.label ?? c.name ?? c.id;
    const citation = c.citation ?? c.constraint.citation ?? null;
    return `${label}${citation ? ` (${citation})` : ''}`;
  });
  const citations = [...new Set(constraints.map((c) => c.citation ?? c.constraint.citation ?? null).filter((c): c is string => c !== null))];
  const results = posterior.intervals.map((iv, i) => {
    const { label, unit } = parameterWords(iv.path);
    const u = unit ? ` ${unit}` : '';
    const caveat = intervalCaveat(iv, parameters[i], unit);
    return `${label}: ${num(iv.lo68)}–${num(iv.hi68)}${u} (68%), ${num(iv.lo95)}–${num(iv.hi95)}${u} (95%), marginal peak ${num(iv.best)}${u}${caveat ? ` (${caveat})` : ''}`;
  });
  return [
    `We fitted the scenario "${meta.scenarioName}" with Tidefield (engine ${meta.engineVersion}) on a grid of ${points.toLocaleString('en-US')} points: ${grid}. ` +
      `Every grid point is a Monte Carlo population of ${scenario.systems.toLocaleString('en-US')} primaries from seed "${scenario.seed}", the same draws at every point (common random numbers). ` +
      `The likelihood is that of the constraint set "${constraintSet.name}"${constraintSet.version !== null ? ` (version ${constraintSet.version})` : ''}: ${cited.join('; ')}. ${FIT_METHOD}`,
    `Result: ${results.join('; ')}.${meta.fitId ? ` (Tidefield fit ${meta.fitId}.)` : ''}`,
    ...(meta.best ? ['', `The model at the best grid point (${bestWords(posterior)}): ${methodsParagraph(meta.best.scenario, meta.best.result)}`] : []),
    ...(posterior.warnings.length > 0 ? ['', 'Warnings:', ...posterior.warnings.map((w) => `- ${w}`)] : []),
    '',
    'References:',
    ...(citations.length > 0 ? citations.map((c) => `- ${c}`) : ['- (the constraints carry no citation)']),
    ...(meta.best ? paragraphCitations(meta.best.scenario).map((c) => `- ${c.full}`) : []),
    "- Fisher, R. A. 1932, Statistical Methods for Research Workers, 4th ed. (Oliver & Boyd) — combination of p-values",
    '',
  ].join('\n');
}
