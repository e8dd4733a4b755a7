import type { ConstraintEvaluation, CoolingAgeBin, Evaluation, ObservedConstraint } from '../../../shared/contracts/constraints.ts';
import { binnedKolmogorovSmirnov, type BinnedKsResult } from '../../../shared/engine/stats/binned-kolmogorov-smirnov.ts';
import { logBinomialPmf } from '../../../shared/engine/stats/binomial-pmf.ts';
import { binomialTestTwoSidedLog } from '../../../shared/engine/stats/binomial-test.ts';
import { verdict as verdictWords } from '../../../shared/engine/stats/compare-observed.ts';
import { fisherCombination } from '../../../shared/engine/stats/fisher-combination.ts';
import { formatPercent, formatPercentWithError, formatPValue, formatSigma } from '../../../shared/engine/stats/format.ts';
import { gaussianDifferenceTest } from '../../../shared/engine/stats/gaussian-difference.ts';
import { groupedMoments } from '../../../shared/engine/stats/grouped-moments.ts';
import { monteCarloStandardError } from '../../../shared/engine/stats/mc-error.ts';
import { sigmaFromLogTwoSidedP } from '../../../shared/engine/stats/significance.ts';
import { predictedFor } from '../runs/comparison.ts';

/**
 * The parts of a result document the evaluation reads, declared here on purpose (not the full
 * contract): today's results carry the required parts; the engine-2 parts are optional, and a
 * constraint that needs one a run lacks is reported as unavailable, never scored.
 */
type Histogram = { magnetic: number[]; nonMagnetic: number[] };
type Counted = { whiteDwarfs: number; magnetic: number };
export interface EvaluableResult {
  counts: Counted & { bySetting: { single: Counted; wide: Counted; postCE: Counted } };
  bins: {
    wdMass: { edgesMsun: number[] } & Histogram;
    logField: {
      edgesLog10MG: number[];
      counts: number[];
      thresholdMG: number;
      byChannel?: { disruption?: number[]; closeSurvivor?: number[]; fossil?: number[] };
    };
    wdMassBySetting?: { edgesMsun: number[]; single: Histogram; wide: Histogram; postCE: Histogram };
    coolingAge?: { edgesLog10Gyr: number[] } & Histogram;
    postCommonEnvelopePeriod?: { edgesLog10Days: number[] } & Histogram;
  };
}

/** A constraint ready to score: its id in the set, the observation, and its citation if any. */
export interface ResolvedConstraint {
  id: string;
  constraint: ObservedConstraint;
  citation: string | null;
  name?: string;
}

/** σ moves by more than this when the prediction moves by ±1 SE: the Monte Carlo error limits the verdict. */
export const MC_LIMITED_SIGMA_SHIFT = 0.1;

const NEEDS_ENGINE_2 = 'not available for this run (needs engine 2)';
const COMBINED_METHOD =
  "Fisher's method over the scored constraints (X² = −2 Σ ln p against χ² with 2m degrees of freedom; Fisher 1932); " +
  'the joint log-likelihood is the sum of the per-constraint log-likelihoods. Both treat the constraints as ' +
  'independent, which holds for different samples but not for constraints drawn from one survey.';

interface Scored {
  evaluation: ConstraintEvaluation;
  /** ln p, kept apart from p so that the combination keeps p-values below 1e-308. */
  logP: number | null;
}

const finite = (x: number | null): number | null => (x === null || !Number.isFinite(x) ? null : x);
const fmtMsun = (x: number) => `${x.toFixed(3)} Msun`;

function sentence(sigma: number | null, logP: number, what: string, mcLimited: boolean): string {
  const s = sigma ?? Infinity;
  const lead = s < 2 ? 'Consistent' : s < 3 ? 'Mild tension' : s < 5 ? 'Strong tension' : 'Rejected';
  const tail = mcLimited ? `; moving the prediction by its Monte Carlo error moves σ by more than ${MC_LIMITED_SIGMA_SHIFT}: run more systems for a sharper σ` : '';
  return `${lead}: the observation ${verdictWords(s)} ${what} (p = ${formatPValue(logP)}, ${formatSigma(s)})${tail}.`;
}

function base(r: ResolvedConstraint, label: string, method: string): Omit<ConstraintEvaluation, 'status' | 'predicted' | 'observed' | 'p' | 'sigma' | 'logLikelihood' | 'mcLimited' | 'verdict'> {
  return { id: r.id, kind: r.constraint.kind, label: r.constraint.label ?? r.name ?? label, method, citation: r.citation ?? r.constraint.citation ?? null, caveats: [], overlay: null };
}

function unavailable(r: ResolvedConstraint, label: string, method: string, reason = NEEDS_ENGINE_2): Scored {
  return {
    evaluation: { ...base(r, label, method), status: 'unavailable', predicted: '—', observed: observedText(r.constraint), p: null, sigma: null, logLikelihood: null, mcLimited: false, verdict: reason },
    logP: null,
  };
}

function observedText(c: ObservedConstraint): string {
  switch (c.kind) {
    case 'fraction':
      if (c.magnetic !== undefined && c.total !== undefined) return `${c.magnetic} of ${c.total} (${formatPercent(c.magnetic / c.total)})`;
      return c.bound === 'lower' ? `≥ ${formatPercent(c.value ?? 0)}` : `${formatPercent(c.value ?? 0)} ± ${formatPercent(c.error ?? 0)}`;
    case 'meanMass':
      return c.meanMsun !== undefined ? `${c.meanMsun} ± ${c.errorMsun} Msun` : `${c.massesMsun?.length ?? 0} masses`;
    case 'fieldDistribution':
      return `${c.fieldsMG?.length ?? 0} fields above ${c.thresholdMG} MG`;
    case 'coolingAgeIncidence':
      return (c.bins ?? []).map((b) => `${b.magnetic}/${b.total} at ${b.ageMinGyr}–${b.ageMaxGyr} Gyr`).join(', ');
    case 'postCommonEnvelopePeriods':
      return `${c.periodsDays?.length ?? 0} periods`;
  }
}

// ---------------------------------------------------------------- fraction

function evaluateFraction(r: ResolvedConstraint & { constraint: Extract<ObservedConstraint, { kind: 'fraction' }> }, result: EvaluableResult): Scored {
  const c = r.constraint;
  const model = predictedFor(result, c.setting);
  const label = `Magnetic fraction of ${model.label}`;
  const countsMethod =
    'Exact two-sided binomial test of the observed count against the predicted fraction (as R binom.test); ' +
    'log-likelihood ln Binomial(k | n, predicted); the Monte Carlo error limits the verdict when moving the prediction by ±1 SE moves σ by more than 0.1';
  const gaussMethod = 'Gaussian test: (predicted − published) / √(error² + SE²), two-sided; log-likelihood of the published value under that Gaussian';
  const boundMethod = 'Published lower bound without an uncertainty: checked against the prediction allowing two Monte Carlo standard errors; not a test, so not in the joint score';
  const counts = c.magnetic !== undefined && c.total !== undefined;
  const method = counts ? countsMethod : c.bound === 'lower' ? boundMethod : gaussMethod;
  if (model.whiteDwarfs === 0) return unavailable(r, label, method, `the run has no ${model.label}, so this cannot be tested`);
  const value = model.magnetic / model.whiteDwarfs;
  const se = monteCarloStandardError(model.magnetic, model.whiteDwarfs);
  const predicted = formatPercentWithError(value, se);
  const caveats: string[] = [];
  if (c.fieldThresholdMG !== undefined && Math.abs(c.fieldThresholdMG - result.bins.logField.thresholdMG) > 1e-9) {
    caveats.push(`The observation counts fields above ${c.fieldThresholdMG} MG but the run's threshold is ${result.bins.logField.thresholdMG} MG; rerun with field.thresholdMG = ${c.fieldThresholdMG} for a like-for-like test.`);
  }
  const head = { ...base(r, label, method), caveats, predicted, observed: observedText(c) };

  if (counts) {
    const k = c.magnetic!;
    const n = c.total!;
    const sigmaAt = (f: number) => sigmaFromLogTwoSidedP(binomialTestTwoSidedLog(k, n, Math.min(1, Math.max(0, f))));
    const logP = binomialTestTwoSidedLog(k, n, value);
    const sigma = sigmaFromLogTwoSidedP(logP);
    const mcLimited = se > 0 && Math.max(Math.abs(sigmaAt(value + se) - sigma), Math.abs(sigmaAt(value - se) - sigma)) > MC_LIMITED_SIGMA_SHIFT;
    return {
      evaluation: {
        ...head, status: 'scored', p: Math.exp(logP), sigma: finite(sigma), logLikelihood: finite(logBinomialPmf(k, n, value)), mcLimited,
        verdict: sentence(sigma, logP, `the predicted ${predicted}`, mcLimited),
      },
      logP,
    };
  }
  if (c.bound === 'lower') {
    const meets = value + 2 * se >= c.value!;
    return {
      evaluation: {
        ...head, status: 'notTestable', p: null, sigma: null, logLikelihood: null, mcLimited: false,
        verdict: meets ? `Meets the published lower bound of ${formatPercent(c.value!)}.` : `Falls short of the published lower bound of ${formatPercent(c.value!)} by more than two Monte Carlo standard errors.`,
      },
      logP: null,
    };
  }
  const test = gaussianDifferenceTest(value, se, c.value!, c.error!);
  const shifted = (f: number) => gaussianDifferenceTest(f, se, c.value!, c.error!).sigma;
  const mcLimited = se > 0 && Math.max(Math.abs(shifted(value + se) - test.sigma), Math.abs(shifted(value - se) - test.sigma)) > MC_LIMITED_SIGMA_SHIFT;
  return {
    evaluation: {
      ...head, status: 'scored', p: test.pValue, sigma: finite(test.sigma), logLikelihood: finite(test.logLikelihood), mcLimited,
      verdict: sentence(test.sigma, test.logP, `the predicted ${predicted}`, mcLimited),
    },
    logP: test.logP,
  };
}

// ---------------------------------------------------------------- lists (grouped KS)

/** Binned log-likelihood of a list under the model's histogram: Σ n_j ln(m_j / (m h_j)), the density per unit of the edges. */
function binnedLogLikelihood(edges: number[], model: number[], perBin: number[]): number | null {
  const m = model.reduce((a, b) => a + b, 0);
  let sum = 0;
  for (let j = 0; j < model.length; j++) {
    if (perBin[j] === 0) continue;
    if (model[j] === 0) return null; // −∞: an observed value where the model has none
    sum += perBin[j] * Math.log(model[j] / (m * (edges[j + 1] - edges[j])));
  }
  return sum;
}

function listScored(
  r: ResolvedConstraint,
  label: string,
  chart: NonNullable<ConstraintEvaluation['overlay']>['chart'],
  edges: number[],
  model: number[],
  values: number[],
  predicted: string,
  caveats: string[],
  what: string,
): Scored {
  const modelTotal = model.reduce((a, b) => a + b, 0);
  let ks: BinnedKsResult;
  if (modelTotal === 0) return unavailable(r, label, '', `the run has no ${what}, so this cannot be tested`);
  try {
    ks = binnedKolmogorovSmirnov(edges, model, values);
  } catch {
    return unavailable(r, label, '', `none of the observed values lies inside the model's range ${edges[0]} … ${edges[edges.length - 1]}`);
  }
  if (ks.outside > 0) caveats.push(`${ks.outside} observed value${ks.outside === 1 ? ' outside the model’s range was' : 's outside the model’s range were'} left out.`);
  const logP = Math.log(ks.pValue);
  const mcLimited = Math.abs(ks.sigma - ks.sigmaModelExact) > MC_LIMITED_SIGMA_SHIFT;
  const scale = ks.observedCount / modelTotal;
  return {
    evaluation: {
      ...base(r, label, ks.method),
      caveats,
      status: 'scored',
      predicted,
      observed: `${ks.observedCount} values; largest CDF difference D = ${ks.statistic.toFixed(3)} at ${ks.atEdge.toFixed(3)}`,
      p: ks.pValue,
      sigma: finite(ks.sigma),
      logLikelihood: binnedLogLikelihood(edges, model, ks.observedPerBin),
      mcLimited,
      verdict: sentence(ks.sigma, logP, `the predicted distribution of ${what}`, mcLimited),
      overlay: { chart, edges, observed: ks.observedPerBin, predicted: model.map((x) => x * scale) },
    },
    logP,
  };
}

function massHistogram(result: EvaluableResult, setting: 'all' | 'single' | 'wide' | 'postCE'): { edges: number[]; hist: Histogram } | null {
  if (setting === 'all') return { edges: result.bins.wdMass.edgesMsun, hist: result.bins.wdMass };
  const bySetting = result.bins.wdMassBySetting;
  return bySetting ? { edges: bySetting.edgesMsun, hist: bySetting[setting] } : null;
}

function evaluateMeanMass(r: ResolvedConstraint & { constraint: Extract<ObservedConstraint, { kind: 'meanMass' }> }, result: EvaluableResult): Scored {
  const c = r.constraint;
  const who = c.population === 'magnetic' ? 'magnetic' : 'non-magnetic';
  const where = c.setting === 'all' ? '' : ` (${c.setting === 'postCE' ? 'post-common-envelope' : c.setting} setting)`;
  const label = `Masses of ${who} white dwarfs${where}`;
  const gaussMethod =
    'Gaussian test of the published mean ± error against the model mean from the grouped mass histogram, its standard ' +
    "error from the Sheppard-corrected spread (Sheppard 1898) over √N; errors in quadrature";
  const source = massHistogram(result, c.setting);
  if (!source) return unavailable(r, label, gaussMethod);
  const counts = source.hist[c.population];
  const moments = groupedMoments(source.edges, counts);
  if (!moments) return unavailable(r, label, gaussMethod, `the run has no ${who} white dwarfs${where}, so this cannot be tested`);
  const predicted = `${fmtMsun(moments.mean)} ± ${moments.se.toFixed(3)} (spread ${moments.sd.toFixed(3)})`;
  if (c.meanMsun !== undefined) {
    const test = gaussianDifferenceTest(moments.mean, moments.se, c.meanMsun, c.errorMsun!);
    const shifted = (x: number) => gaussianDifferenceTest(x, moments.se, c.meanMsun!, c.errorMsun!).sigma;
    const mcLimited = Math.max(Math.abs(shifted(moments.mean + moments.se) - test.sigma), Math.abs(shifted(moments.mean - moments.se) - test.sigma)) > MC_LIMITED_SIGMA_SHIFT;
    return {
      evaluation: {
        ...base(r, label, gaussMethod), status: 'scored', predicted, observed: observedText(c), p: test.pValue, sigma: finite(test.sigma),
        logLikelihood: finite(test.logLikelihood), mcLimited, verdict: sentence(test.sigma, test.logP, `the predicted mean ${fmtMsun(moments.mean)}`, mcLimited),
      },
      logP: test.logP,
    };
  }
  return listScored(r, label, 'wdMass', source.edges, counts, c.massesMsun ?? [], `mean ${predicted}`, [], `${who} white-dwarf masses`);
}

function evaluateFields(r: ResolvedConstraint & { constraint: Extract<ObservedConstraint, { kind: 'fieldDistribution' }> }, result: EvaluableResult): Scored {
  const c = r.constraint;
  const label = `Field distribution above ${c.thresholdMG} MG`;
  const { edgesLog10MG, counts, byChannel } = result.bins.logField;
  // The model's field histogram; engine 2 splits it by channel, whose sum is the same total.
  const model = byChannel && byChannel.disruption ? counts.map((_, i) => (byChannel.disruption?.[i] ?? 0) + (byChannel.closeSurvivor?.[i] ?? 0) + (byChannel.fossil?.[i] ?? 0)) : counts;
  const cut = Math.log10(c.thresholdMG);
  const first = edgesLog10MG.findIndex((e) => e >= cut - 1e-12);
  if (first < 0 || first >= edgesLog10MG.length - 1) return unavailable(r, label, '', `the survey threshold ${c.thresholdMG} MG lies above the model's field range`);
  const caveats: string[] = [];
  const edgeMG = Math.pow(10, edgesLog10MG[first]);
  if (Math.abs(edgesLog10MG[first] - cut) > 1e-9) caveats.push(`The threshold ${c.thresholdMG} MG falls inside a model bin; both sides are compared from ${edgeMG.toPrecision(3)} MG, the next bin edge.`);
  const below = (c.fieldsMG ?? []).filter((b) => Math.log10(b) < edgesLog10MG[first]).length;
  if (below > 0) caveats.push(`${below} observed field${below === 1 ? ' below ' + edgeMG.toPrecision(3) + ' MG was' : 's below ' + edgeMG.toPrecision(3) + ' MG were'} left out.`);
  const values = (c.fieldsMG ?? []).map(Math.log10).filter((x) => x >= edgesLog10MG[first]);
  if (values.length === 0) return unavailable(r, label, '', `no observed field lies above ${edgeMG.toPrecision(3)} MG`);
  const edges = edgesLog10MG.slice(first);
  const sub = model.slice(first);
  const total = sub.reduce((a, b) => a + b, 0);
  return listScored(r, label, 'logField', edges, sub, values, `${total} model white dwarfs with fields above ${edgeMG.toPrecision(3)} MG (log10 B/MG binned)`, caveats, 'fields (log10 B)');
}

function evaluatePeriods(r: ResolvedConstraint & { constraint: Extract<ObservedConstraint, { kind: 'postCommonEnvelopePeriods' }> }, result: EvaluableResult): Scored {
  const c = r.constraint;
  const label = 'Periods of post-common-envelope binaries';
  const bins = result.bins.postCommonEnvelopePeriod;
  if (!bins) return unavailable(r, label, '');
  const model = bins.magnetic.map((m, i) => (c.population === 'magnetic' ? m : c.population === 'nonMagnetic' ? bins.nonMagnetic[i] : m + bins.nonMagnetic[i]));
  const total = model.reduce((a, b) => a + b, 0);
  return listScored(r, label, 'postCommonEnvelopePeriod', bins.edgesLog10Days, model, (c.periodsDays ?? []).map(Math.log10), `${total} model post-CE binaries (log10 P/d binned)`, [], 'post-CE periods (log10 P)');
}

// ---------------------------------------------------------------- cooling-age incidence

function evaluateCoolingAge(r: ResolvedConstraint & { constraint: Extract<ObservedConstraint, { kind: 'coolingAgeIncidence' }> }, result: EvaluableResult): Scored {
  const c = r.constraint;
  const label = 'Magnetic incidence by cooling age';
  const method =
    'Exact two-sided binomial test of each cooling-age bin against the model fraction in the model bins whose (log) centre lies ' +
    "inside it, combined over the bins by Fisher's method (Fisher 1932); log-likelihood Σ ln Binomial(k_i | n_i, predicted_i)";
  const bins = result.bins.coolingAge;
  if (!bins) return unavailable(r, label, method);
  const caveats: string[] = [];
  const rows: { bin: CoolingAgeBin; value: number; se: number }[] = [];
  for (const bin of c.bins ?? []) {
    const lo = bin.ageMinGyr > 0 ? Math.log10(bin.ageMinGyr) : -Infinity;
    const hi = Math.log10(bin.ageMaxGyr);
    let k = 0;
    let n = 0;
    for (let i = 0; i < bins.magnetic.length; i++) {
      const centre = 0.5 * (bins.edgesLog10Gyr[i] + bins.edgesLog10Gyr[i + 1]);
      if (centre < lo || centre >= hi) continue;
      k += bins.magnetic[i];
      n += bins.magnetic[i] + bins.nonMagnetic[i];
    }
    if (n === 0) {
      caveats.push(`The run has no white dwarfs of cooling age ${bin.ageMinGyr}–${bin.ageMaxGyr} Gyr; that bin is left out.`);
      continue;
    }
    rows.push({ bin, value: k / n, se: monteCarloStandardError(k, n) });
  }
  if (rows.length === 0) return unavailable(r, label, method, 'the run has no white dwarfs in any of the observed cooling-age bins');
  const combinedAt = (shift: number) =>
    fisherCombination(rows.map(({ bin, value, se }) => binomialTestTwoSidedLog(bin.magnetic, bin.total, Math.min(1, Math.max(0, value + shift * se)))));
  const combined = combinedAt(0);
  const mcLimited = Math.max(Math.abs(combinedAt(1).sigma - combined.sigma), Math.abs(combinedAt(-1).sigma - combined.sigma)) > MC_LIMITED_SIGMA_SHIFT;
  const logLikelihood = rows.reduce((sum, { bin, value }) => sum + logBinomialPmf(bin.magnetic, bin.total, value), 0);
  return {
    evaluation: {
      ...base(r, label, method),
      caveats,
      status: 'scored',
      predicted: rows.map(({ bin, value, se }) => `${formatPercentWithError(value, se)} at ${bin.ageMinGyr}–${bin.ageMaxGyr} Gyr`).join(', '),
      observed: observedText(c),
      p: combined.pValue,
      sigma: finite(combined.sigma),
      logLikelihood: finite(logLikelihood),
      mcLimited,
      verdict: sentence(combined.sigma, combined.logP, 'the predicted incidence by cooling age', mcLimited),
      overlay: null,
    },
    logP: combined.logP,
  };
}

// ---------------------------------------------------------------- the set

function evaluateOne(r: ResolvedConstraint, result: EvaluableResult): Scored {
  const c = r.constraint;
  switch (c.kind) {
    case 'fraction':
      return evaluateFraction({ ...r, constraint: c }, result);
    case 'meanMass':
      return evaluateMeanMass({ ...r, constraint: c }, result);
    case 'fieldDistribution':
      return evaluateFields({ ...r, constraint: c }, result);
    case 'coolingAgeIncidence':
      return evaluateCoolingAge({ ...r, constraint: c }, result);
    case 'postCommonEnvelopePeriods':
      return evaluatePeriods({ ...r, constraint: c }, result);
  }
}

/**
 * Scores a run against every constraint of a set: per constraint p, σ, log-likelihood and whether
 * the Monte Carlo error limits the verdict; jointly by Fisher's method, treating the constraints as
 * independent (and saying so). Constraints the run cannot answer are listed, not scored.
 */
export function evaluateConstraints(result: EvaluableResult, constraints: ResolvedConstraint[], set: Evaluation['constraintSet']): Evaluation {
  const scored = constraints.map((r) => evaluateOne(r, result));
  const tested = scored.filter((s) => s.evaluation.status === 'scored' && s.logP !== null);
  let combined: Evaluation['combined'];
  if (tested.length === 0) {
    combined = { logLikelihood: null, p: null, sigma: null, scored: 0, method: COMBINED_METHOD, verdict: 'No constraint of this set can be tested against this run.' };
  } else {
    const fisher = fisherCombination(tested.map((s) => s.logP!));
    const lls = tested.map((s) => s.evaluation.logLikelihood);
    const logLikelihood = lls.some((x) => x === null) ? null : lls.reduce<number>((a, b) => a + b!, 0);
    const worst = tested.reduce((a, b) => ((b.evaluation.sigma ?? Infinity) > (a.evaluation.sigma ?? Infinity) ? b : a));
    const s = fisher.sigma;
    combined = {
      logLikelihood,
      p: fisher.pValue,
      sigma: finite(s),
      scored: tested.length,
      method: COMBINED_METHOD,
      verdict:
        `Jointly over ${tested.length} constraint${tested.length === 1 ? '' : 's'}: ${s < 2 ? 'consistent' : s < 3 ? 'mild tension' : s < 5 ? 'strong tension' : 'rejected'} ` +
        `(p = ${formatPValue(fisher.logP)}, ${formatSigma(s)}); the strongest single tension is "${worst.evaluation.label}" at ${formatSigma(worst.evaluation.sigma ?? Infinity)}.`,
    };
  }
  return { constraintSet: set, constraints: scored.map((s) => s.evaluation), combined };
}
