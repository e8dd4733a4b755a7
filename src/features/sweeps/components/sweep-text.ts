import type { SweepDetail, SweepSummary } from '../../../../shared/contracts/sweeps.ts';
import type { BadgeTone } from '../../../components/ui/badge.tsx';

export const SWEEP_STATUS_TEXT: Record<SweepSummary['status'], { label: string; tone: BadgeTone }> = {
  queued: { label: 'Queued', tone: 'neutral' },
  running: { label: 'Running', tone: 'info' },
  finished: { label: 'Finished', tone: 'success' },
  cancelled: { label: 'Cancelled', tone: 'warning' },
};

const withUnit = (value: number, unit: string) => (unit ? `${value} ${unit}` : String(value));

/**
 * The parameter range a sample allows, in words, from the grid values the server found
 * consistent (exact two-sided binomial test at each point). `grid` is the axis's values.
 * Example: [0.5, 1] of [0.2, 0.5, 1, 2, 4] at 68% → "At 68% the sample allows α_CE from 0.5
 * to 1 among the grid values 0.2 to 4; the true limits lie between grid values."
 */
export function allowedRangeSentence(range: readonly [number, number] | null, level: '68%' | '95%', label: string, unit: string, grid: readonly number[]): string {
  const sorted = [...grid].sort((a, b) => a - b);
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  if (range === null) return `At ${level} no grid value of ${label} gives a prediction the sample allows.`;
  if (range[0] === first && range[1] === last) {
    return `At ${level} the sample allows every grid value of ${label}, from ${withUnit(first, unit)} to ${withUnit(last, unit)}: it does not constrain ${label} over this range.`;
  }
  const open = range[0] === first ? ' (the lower limit sits at the edge of the grid and may lie lower still)' : range[1] === last ? ' (the upper limit sits at the edge of the grid and may lie higher still)' : '';
  const span = range[0] === range[1] ? `only ${label} = ${withUnit(range[0], unit)}` : `${label} from ${withUnit(range[0], unit)} to ${withUnit(range[1], unit)}`;
  return `At ${level} the sample allows ${span} among the grid values ${withUnit(first, unit)} to ${withUnit(last, unit)}${open}; the true limits lie between grid values.`;
}

/** How many points have a result, and how many are still to come. */
export function pointsProgress(detail: Pick<SweepSummary, 'pointCount' | 'pointsDone'>): { fraction: number; text: string } {
  const fraction = detail.pointCount > 0 ? detail.pointsDone / detail.pointCount : 0;
  return { fraction, text: `${detail.pointsDone} of ${detail.pointCount} points done` };
}

/** Points that ended without a result (failed or cancelled), which the chart leaves out. */
export function missingPoints(detail: Pick<SweepDetail, 'points'>): number {
  return detail.points.filter((p) => p.status === 'failed' || p.status === 'cancelled').length;
}
