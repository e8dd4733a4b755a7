import { cx } from '../../lib/class-names.ts';

export interface ProgressBarProps {
  /** The bar's accessible name, e.g. "Run progress". */
  label: string;
  value: number;
  max: number;
  /** What a screen reader says for the current value, e.g. "40%, 6 of 15 chunks". */
  valueText: string;
  /** Smallest width drawn (%), so a bar that has started shows that it has. */
  minimumPercent?: number;
  className?: string;
}

/** A determinate progress bar in the theme's lantern colour. */
export function ProgressBar({ label, value, max, valueText, minimumPercent = 0, className }: ProgressBarProps) {
  const percent = max > 0 ? Math.min(100, Math.max(0, (value / max) * 100)) : 0;
  return (
    <div
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={max}
      aria-valuenow={value}
      aria-valuetext={valueText}
      className={cx('h-3 overflow-hidden rounded-full border border-ink-500 bg-ink-900', className)}
    >
      <div className="h-full rounded-full bg-lantern-400 transition-[width] duration-500" style={{ width: `${Math.max(percent, minimumPercent)}%` }} />
    </div>
  );
}
