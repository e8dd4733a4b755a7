import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';

export type BadgeTone = 'neutral' | 'accent' | 'info' | 'success' | 'warning' | 'danger';

const TONES: Record<BadgeTone, string> = {
  neutral: 'border-foam-400/50 bg-foam-400/10 text-foam-300',
  accent: 'border-dusk-300/50 bg-dusk-300/12 text-dusk-300',
  info: 'border-tide-300/50 bg-tide-300/12 text-tide-300',
  success: 'border-kelp-300/50 bg-kelp-300/12 text-kelp-300',
  warning: 'border-lantern-300/50 bg-lantern-300/12 text-lantern-300',
  danger: 'border-coral-300/50 bg-coral-300/12 text-coral-300',
};

export interface BadgeProps {
  tone?: BadgeTone;
  children: ReactNode;
  className?: string;
}

/** A short status word ("running", "admin"). The word carries the meaning; colour only helps. */
export function Badge({ tone = 'neutral', children, className }: BadgeProps) {
  return (
    <span
      className={cx(
        'inline-flex items-center gap-1.5 rounded-full border px-2.5 py-0.5 text-sm font-bold whitespace-nowrap',
        TONES[tone],
        className,
      )}
    >
      <span aria-hidden="true" className="size-2 rounded-full bg-current" />
      {children}
    </span>
  );
}
