import { formatSigma } from '../../../../shared/engine/stats/format.ts';

export const COMPARE_MIN_RUNS = 2;
export const COMPARE_MAX_RUNS = 4;

/** The run ids of ?runs=a,b,c: trimmed, without repeats, in the given order. */
export function runIdsFrom(param: string | null): string[] {
  if (!param) return [];
  return [...new Set(param.split(',').map((s) => s.trim()).filter(Boolean))];
}

/**
 * How two runs' fractions differ, in units of their combined Monte Carlo error. Thresholds follow
 * the usual 2σ and 3σ conventions (common practice, no source); null means both errors are zero.
 */
export function differenceInWords(sigma: number | null, difference: number): string {
  if (sigma === null) return difference === 0 ? 'Identical, with no Monte Carlo error.' : 'Different, with no Monte Carlo error to weigh it by.';
  if (sigma < 2) return `Within Monte Carlo noise (${formatSigma(sigma)}).`;
  if (sigma < 3) return `A hint of a difference (${formatSigma(sigma)}); more systems would settle it.`;
  return `A real difference between the models (${formatSigma(sigma)}).`;
}

/** A difference of fractions in percentage points with its combined error: "+1.20 ± 0.15 pp". */
export function percentagePoints(difference: number, se: number): string {
  const places = se > 0 ? Math.max(0, Math.min(6, 1 - Math.floor(Math.log10(100 * se)))) : 2;
  const sign = difference > 0 ? '+' : difference < 0 ? '−' : '';
  return `${sign}${Math.abs(100 * difference).toFixed(places)} ± ${(100 * se).toFixed(places)} pp`;
}
