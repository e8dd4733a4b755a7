import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';

export interface ChartKeyItem {
  /** What the swatch stands for, in words (the words carry the meaning; colour only helps). */
  label: ReactNode;
  colour: string;
  /** How the chart draws it: a shaded area, a solid line, a dashed line or a dot. */
  look: 'area' | 'line' | 'dashed' | 'dotted' | 'dot';
  /** Opacity of an area swatch, as drawn in the chart. */
  opacity?: number;
}

function Swatch({ colour, look, opacity }: Omit<ChartKeyItem, 'label'>) {
  if (look === 'area') {
    return <span aria-hidden="true" className="inline-block h-4 w-7 rounded-sm border border-ink-500" style={{ background: colour, opacity: opacity ?? 0.3 }} />;
  }
  if (look === 'dot') return <span aria-hidden="true" className="inline-block size-3 rounded-full" style={{ background: colour }} />;
  const dash = look === 'dashed' ? '6 4' : look === 'dotted' ? '2 4' : undefined;
  return (
    <svg aria-hidden="true" viewBox="0 0 28 8" className="h-2 w-7">
      <line x1="0" y1="4" x2="28" y2="4" stroke={colour} strokeWidth="3" strokeDasharray={dash} />
    </svg>
  );
}

/**
 * The key of a chart written out under it as a list, for what a Vega legend cannot show well
 * (shaded bands at two confidence levels, reference lines), and readable by screen readers.
 */
export function ChartKey({ items, className }: { items: readonly ChartKeyItem[]; className?: string }) {
  return (
    <ul aria-label="Chart key" className={cx('mt-3 flex flex-wrap gap-x-6 gap-y-2 text-sm text-foam-300', className)}>
      {items.map((item, index) => (
        <li key={index} className="flex items-center gap-2">
          <Swatch colour={item.colour} look={item.look} opacity={item.opacity} />
          <span>{item.label}</span>
        </li>
      ))}
    </ul>
  );
}
