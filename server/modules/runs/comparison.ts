import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { Sample } from '../../../shared/contracts/samples.ts';
import type {
  CountsComparison,
  FractionConstraint as FractionConstraintComparison,
  MeanMassComparison,
  RunComparison,
} from '../../../shared/contracts/comparison.ts';
import { compareWithObserved } from '../../../shared/engine/stats/compare-observed.ts';
import { formatPercent, formatPercentWithError, formatSigma } from '../../../shared/engine/stats/format.ts';
import { monteCarloStandardError } from '../../../shared/engine/stats/mc-error.ts';
import { sigmaFromTwoSidedP, twoSidedPFromSigma } from '../../../shared/engine/stats/significance.ts';

/** The predicted magnetic fraction of one sub-population, as magnetic k of n model white dwarfs. */
export interface PredictedCounts {
  label: string;
  magnetic: number;
  whiteDwarfs: number;
}

type Counted = { whiteDwarfs: number; magnetic: number };
/** The parts of a result predictedFor reads (so that other result readers can pass a narrower type). */
export interface SettingCountsSource {
  counts: Counted & { bySetting: { single: Counted; wide: Counted; postCE: Counted } };
}

/** Model counts of the white dwarfs a sample of this setting describes. */
export function predictedFor(result: SettingCountsSource, setting: string): PredictedCounts {
  const s = result.counts.bySetting;
  switch (setting) {
    case 'single':
      return { label: 'single white dwarfs (no surviving companion)', magnetic: s.single.magnetic, whiteDwarfs: s.single.whiteDwarfs };
    case 'wide':
      return { label: 'white dwarfs with a wide (never engulfed) companion', magnetic: s.wide.magnetic, whiteDwarfs: s.wide.whiteDwarfs };
    case 'postCE':
      return { label: 'white dwarfs with a post-common-envelope companion', magnetic: s.postCE.magnetic, whiteDwarfs: s.postCE.whiteDwarfs };
    case 'detachedCompanion':
      return {
        label: 'white dwarfs with a detached companion (wide or post-common-envelope)',
        magnetic: s.wide.magnetic + s.postCE.magnetic,
        whiteDwarfs: s.wide.whiteDwarfs + s.postCE.whiteDwarfs,
      };
    default:
      return { label: 'all white dwarfs', magnetic: result.counts.magnetic, whiteDwarfs: result.counts.whiteDwarfs };
  }
}

/** Model counts of white dwarfs with a mass in [lo, hi), from the mass histogram (whole bins whose centre lies inside). */
function predictedInMassRange(result: ScenarioResult, lo: number, hi: number): PredictedCounts & { exact: boolean } {
  const { edgesMsun, magnetic, nonMagnetic } = result.bins.wdMass;
  let k = 0;
  let n = 0;
  let exact = true;
  for (let i = 0; i < magnetic.length; i++) {
    const a = edgesMsun[i];
    const b = edgesMsun[i + 1];
    const centre = (a + b) / 2;
    if (centre < lo || centre >= hi) continue;
    if (a < lo - 1e-9 || b > hi + 1e-9) exact = false;
    k += magnetic[i];
    n += magnetic[i] + nonMagnetic[i];
  }
  return { label: `white dwarfs of ${lo}–${hi} Msun`, magnetic: k, whiteDwarfs: n, exact };
}

function countsTest(predicted: PredictedCounts, observed: { magnetic: number; total: number }): CountsComparison | null {
  if (predicted.whiteDwarfs === 0) return null;
  const value = predicted.magnetic / predicted.whiteDwarfs;
  const se = monteCarloStandardError(predicted.magnetic, predicted.whiteDwarfs);
  return {
    ...compareWithObserved({ value, se }, observed),
    label: predicted.label,
    predictedCounts: { magnetic: predicted.magnetic, whiteDwarfs: predicted.whiteDwarfs },
  };
}

/** Mean and standard deviation of a histogram from its bin centres. */
function histogramMean(edges: number[], counts: number[]): { mean: number; sd: number } | null {
  let n = 0;
  let sum = 0;
  let sumSq = 0;
  counts.forEach((c, i) => {
    const x = (edges[i] + edges[i + 1]) / 2;
    n += c;
    sum += c * x;
    sumSq += c * x * x;
  });
  if (n === 0) return null;
  const mean = sum / n;
  return { mean, sd: Math.sqrt(Math.max(0, sumSq / n - mean * mean)) };
}

function fractionConstraint(sample: Sample, predicted: PredictedCounts): FractionConstraintComparison | null {
  if (sample.fraction === null || predicted.whiteDwarfs === 0) return null;
  const value = predicted.magnetic / predicted.whiteDwarfs;
  const se = monteCarloStandardError(predicted.magnetic, predicted.whiteDwarfs);
  const pred = formatPercentWithError(value, se);
  const pub = formatPercent(sample.fraction);
  if (sample.lowerBound) {
    const consistent = value + 2 * se >= sample.fraction;
    return {
      published: { fraction: sample.fraction, sigma: null, lowerBound: true },
      predicted: { value, se },
      z: null, pValue: null, sigma: null, consistent,
      summary: consistent
        ? `The predicted ${pred} meets the published lower bound of ${pub}.`
        : `The predicted ${pred} falls short of the published lower bound of ${pub} (by more than two Monte Carlo standard errors).`,
      method: 'Published lower bound without an uncertainty: the prediction is compared with it directly, allowing two Monte Carlo standard errors.',
    };
  }
  if (sample.fractionSigma === null) {
    return {
      published: { fraction: sample.fraction, sigma: null, lowerBound: false },
      predicted: { value, se },
      z: null, pValue: null, sigma: null, consistent: null,
      summary: `The paper quotes about ${pub} without an uncertainty, so no significance can be given; the model predicts ${pred} (${(value / sample.fraction).toFixed(2)} times the quoted value).`,
      method: 'Published value without an uncertainty: ratio only, no test.',
    };
  }
  const combined = Math.hypot(sample.fractionSigma, se);
  const z = (value - sample.fraction) / combined;
  const p = twoSidedPFromSigma(Math.abs(z));
  const sigma = sigmaFromTwoSidedP(p);
  return {
    published: { fraction: sample.fraction, sigma: sample.fractionSigma, lowerBound: false },
    predicted: { value, se },
    z, pValue: p, sigma, consistent: Math.abs(z) < 2,
    summary: `The predicted ${pred} lies ${formatSigma(Math.abs(z))} from the published ${pub} ± ${formatPercent(sample.fractionSigma)} (Gaussian, p = ${p.toPrecision(2)}).`,
    method: 'Gaussian comparison with the published fraction; its 1σ uncertainty and the Monte Carlo standard error are added in quadrature.',
  };
}

function meanMassComparison(sample: Sample, result: ScenarioResult): MeanMassComparison | null {
  if (!sample.meanMass) return null;
  const { edgesMsun, magnetic, nonMagnetic } = result.bins.wdMass;
  const mag = histogramMean(edgesMsun, magnetic);
  const non = histogramMean(edgesMsun, nonMagnetic);
  const side = (published: number, sigma: number, predicted: { mean: number; sd: number } | null) => ({
    publishedMsun: published,
    publishedSigma: sigma,
    predictedMsun: predicted?.mean ?? null,
    predictedSdMsun: predicted?.sd ?? null,
    z: predicted && sigma > 0 ? (predicted.mean - published) / sigma : null,
  });
  const m = side(sample.meanMass.magneticMsun, sample.meanMass.magneticSigma, mag);
  const n = side(sample.meanMass.nonMagneticMsun, sample.meanMass.nonMagneticSigma, non);
  const fmt = (x: number | null) => (x === null ? 'n/a' : `${x.toFixed(3)} Msun`);
  return {
    magnetic: m,
    nonMagnetic: n,
    summary: `Predicted mean mass ${fmt(m.predictedMsun)} for magnetic and ${fmt(n.predictedMsun)} for non-magnetic white dwarfs, against the published ${m.publishedMsun} ± ${m.publishedSigma} and ${n.publishedMsun} ± ${n.publishedSigma} Msun.`,
    method: 'Means from the white-dwarf mass histogram (0.02 Msun bins, bin centres); z = (predicted − published) / published ±, with the ± as published.',
  };
}

/** Sets a finished run against an observed sample or published constraint of any kind. */
export function compareRunWithSample(result: ScenarioResult, sample: Sample, scenarioThresholdMG: number): RunComparison {
  const caveats: string[] = [
    'The prediction is a Monte Carlo estimate; its standard error is included in every comparison.',
  ];
  if (sample.fieldThresholdMG !== null && Math.abs(sample.fieldThresholdMG - scenarioThresholdMG) > 1e-9) {
    caveats.push(`The sample counts fields above ${sample.fieldThresholdMG} MG but the scenario's detection threshold is ${scenarioThresholdMG} MG; rerun with field.thresholdMG = ${sample.fieldThresholdMG} for a like-for-like test.`);
  }
  const predicted = predictedFor(result, sample.setting);
  const counts = sample.kind === 'counts' && sample.magnetic !== null && sample.total !== null ? countsTest(predicted, { magnetic: sample.magnetic, total: sample.total }) : null;
  if (sample.kind === 'counts' && !counts) caveats.push(`The model has no ${predicted.label}, so the sample cannot be tested against it.`);

  const splits: CountsComparison[] = [];
  for (const bin of sample.bins) {
    if (bin.kind === 'setting') {
      const test = countsTest(predictedFor(result, bin.setting), bin);
      if (test) splits.push(test);
    } else {
      const range = predictedInMassRange(result, bin.massMinMsun, bin.massMaxMsun);
      const test = countsTest(range, bin);
      if (test) splits.push(test);
      if (!range.exact) caveats.push(`The mass bin ${bin.massMinMsun}–${bin.massMaxMsun} Msun does not fall on the model's 0.02 Msun bin edges; whole model bins whose centre lies inside were used.`);
    }
  }
  return {
    sample: { id: sample.id, name: sample.name, kind: sample.kind, library: sample.library, citation: sample.citation, setting: sample.setting },
    counts,
    splits,
    fraction: sample.kind === 'fraction' ? fractionConstraint(sample, predicted) : null,
    meanMass: sample.kind === 'meanMass' ? meanMassComparison(sample, result) : null,
    caveats,
  };
}
