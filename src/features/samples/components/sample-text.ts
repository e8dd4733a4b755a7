import type { BIN_SETTINGS, Sample, SAMPLE_SETTINGS, SampleBin } from '../../../../shared/contracts/samples.ts';
import { clopperPearson } from '../../../../shared/engine/stats/clopper-pearson.ts';
import { formatPercent, formatPercentRange, formatSignificant } from '../../../../shared/engine/stats/format.ts';

/** The confidence the server uses for its "68%" intervals (one Gaussian σ). */
export const CONFIDENCE_68 = 0.6827;

export const SAMPLE_SETTING_TEXT: Record<(typeof SAMPLE_SETTINGS)[number], string> = {
  all: 'All white dwarfs',
  single: 'Single white dwarfs (no known companion)',
  detachedCompanion: 'White dwarfs with a detached companion',
};

export const BIN_SETTING_TEXT: Record<(typeof BIN_SETTINGS)[number], string> = {
  single: 'Single',
  wide: 'Wide companion',
  postCE: 'Post-common-envelope companion',
  detachedCompanion: 'Detached companion',
};

export interface CountsInterval {
  k: number;
  n: number;
  fraction: number;
  interval68: [number, number];
  interval95: [number, number];
}

/** Clopper–Pearson 68% and 95% intervals of k of n; null unless 0 ≤ k ≤ n, 1 ≤ n ≤ 10^8 are whole numbers. */
export function countsInterval(k: number | null | undefined, n: number | null | undefined): CountsInterval | null {
  if (k == null || n == null || !Number.isInteger(k) || !Number.isInteger(n)) return null;
  if (k < 0 || n < 1 || k > n || n > 1e8) return null;
  const ci68 = clopperPearson(k, n, CONFIDENCE_68);
  const ci95 = clopperPearson(k, n, 0.95);
  return { k, n, fraction: k / n, interval68: [ci68.lower, ci68.upper], interval95: [ci95.lower, ci95.upper] };
}

const count = (x: number) => x.toLocaleString('en-US');

/** "7.9–16%": an interval in percent at the resolution of its width. */
export function percentInterval(lower: number, upper: number, fraction = (lower + upper) / 2): string {
  const [, lo, hi] = formatPercentRange(fraction, lower, upper);
  return `${lo}–${hi}%`;
}

/** "9 of 78 (12%; 68%: 7.9–16%, 95%: 5.4–21%)". */
export function countsText(c: Pick<CountsInterval, 'k' | 'n' | 'fraction' | 'interval68' | 'interval95'>): string {
  const [value] = formatPercentRange(c.fraction, c.interval95[0], c.interval95[1]);
  return `${count(c.k)} of ${count(c.n)} (${value}%; 68%: ${percentInterval(c.interval68[0], c.interval68[1], c.fraction)}, 95%: ${percentInterval(c.interval95[0], c.interval95[1], c.fraction)})`;
}

/**
 * What a sample states, with its uncertainty: counts with their intervals, a fraction with its
 * quoted σ, a lower bound, or mean masses. A fraction quoted without an uncertainty says so.
 */
export function sampleValueText(sample: Sample): string {
  if (sample.kind === 'counts' && sample.magnetic !== null && sample.total !== null) {
    const c = sample.interval68 && sample.interval95 ? { k: sample.magnetic, n: sample.total, fraction: sample.fraction ?? sample.magnetic / sample.total, interval68: sample.interval68, interval95: sample.interval95 } : countsInterval(sample.magnetic, sample.total);
    return c ? countsText(c) : `${count(sample.magnetic)} of ${count(sample.total)}`;
  }
  if (sample.kind === 'fraction' && sample.fraction !== null) {
    if (sample.lowerBound) return `at least ${formatPercent(sample.fraction)} (a lower bound)`;
    if (sample.fractionSigma !== null) return `${formatPercent(sample.fraction)} ± ${formatPercent(sample.fractionSigma)} (1σ as quoted)`;
    return `about ${formatPercent(sample.fraction)} (quoted without an uncertainty)`;
  }
  if (sample.kind === 'meanMass' && sample.meanMass) {
    const m = sample.meanMass;
    const msun = (x: number) => formatSignificant(x, 3);
    return `mean mass ${msun(m.magneticMsun)} ± ${msun(m.magneticSigma)} Msun (magnetic) against ${msun(m.nonMagneticMsun)} ± ${msun(m.nonMagneticSigma)} Msun (not magnetic)`;
  }
  return 'no numbers stated';
}

/** "0.5–0.7 Msun" or "Detached companion": what a split counts. */
export function binLabel(bin: SampleBin): string {
  return bin.kind === 'setting' ? BIN_SETTING_TEXT[bin.setting] : `${formatSignificant(bin.massMinMsun, 3)}–${formatSignificant(bin.massMaxMsun, 3)} Msun`;
}

/** Invented demo numbers carry the word in their name or provenance; the page keeps saying so. */
export function isIllustrative(sample: Pick<Sample, 'name' | 'provenance'>): boolean {
  return /illustrative|invented/i.test(`${sample.name} ${sample.provenance ?? ''}`);
}

const KIND_TEXT: Record<Sample['kind'], string> = {
  counts: 'Counts (magnetic of total)',
  fraction: 'A quoted fraction',
  meanMass: 'Mean masses',
};

export function sampleKindText(kind: Sample['kind']): string {
  return KIND_TEXT[kind];
}
