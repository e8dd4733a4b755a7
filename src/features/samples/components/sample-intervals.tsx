import { formatSignificant } from '../../../../shared/engine/stats/format.ts';
import { cx } from '../../../lib/class-names.ts';
import { countsText, percentInterval, type CountsInterval } from './sample-text.ts';

/** The observed fraction with its Clopper–Pearson intervals, as a small figure: numbers and a bar. */
export function SampleIntervals({ interval, className }: { interval: CountsInterval; className?: string }) {
  const { fraction, interval68, interval95 } = interval;
  // The bar spans 0–100% only when the interval is wide; otherwise it zooms in around it.
  const span = Math.max(interval95[1] - interval95[0], 0.02);
  const lo = Math.max(0, Math.min(interval95[0] - span * 0.25, 1 - span * 1.5));
  const hi = Math.min(1, lo + span * 1.5);
  const at = (x: number) => `${(100 * (x - lo)) / (hi - lo)}%`;
  const width = (a: number, b: number) => `${(100 * (b - a)) / (hi - lo)}%`;
  return (
    <div className={cx('flex flex-col gap-2', className)}>
      <p className="font-bold text-foam-50 tabular-nums">{countsText(interval)}</p>
      <div aria-hidden="true" className="relative h-6 rounded-sm bg-ink-900">
        <span className="absolute top-1 h-4 rounded-sm bg-tide-300/35" style={{ left: at(interval95[0]), width: width(interval95[0], interval95[1]) }} />
        <span className="absolute top-1 h-4 rounded-sm bg-tide-300/70" style={{ left: at(interval68[0]), width: width(interval68[0], interval68[1]) }} />
        <span className="absolute top-0 h-6 w-1 -translate-x-1/2 rounded-sm bg-foam-50" style={{ left: at(fraction) }} />
      </div>
      <p className="flex justify-between text-sm text-foam-400 tabular-nums" aria-hidden="true">
        <span>{formatSignificant(100 * lo, 2)}%</span>
        <span>{formatSignificant(100 * hi, 2)}%</span>
      </p>
      <p className="text-sm text-foam-400">
        Clopper–Pearson (exact binomial) intervals: darker 68% ({percentInterval(interval68[0], interval68[1], fraction)}), lighter 95% (
        {percentInterval(interval95[0], interval95[1], fraction)}); the white mark is the observed fraction.
      </p>
    </div>
  );
}
