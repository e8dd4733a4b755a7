import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';

export interface EmptyStateProps {
  title: ReactNode;
  /** Heading level of the title; 2 inside a page, 1 when it is the page. */
  headingLevel?: 1 | 2 | 3;
  children?: ReactNode;
  /** A button or link that gets the user going. */
  action?: ReactNode;
  /** Decorative picture; Tidefield's orbit drawing by default. */
  illustration?: ReactNode;
  className?: string;
}

function Orbits() {
  return (
    <svg viewBox="0 0 120 64" aria-hidden="true" focusable="false" className="h-16 w-30">
      <ellipse cx="60" cy="32" rx="54" ry="22" fill="none" strokeWidth="1.5" strokeDasharray="3 5" className="stroke-ink-500" />
      <ellipse cx="60" cy="32" rx="32" ry="12" fill="none" strokeWidth="1.5" className="stroke-foam-400" />
      <circle cx="60" cy="32" r="6" className="fill-foam-50" />
      <circle cx="92" cy="32" r="3.5" className="fill-lantern-400" />
    </svg>
  );
}

/** What a page or panel shows when there is nothing (yet) to show. */
export function EmptyState({ title, headingLevel = 2, children, action, illustration, className }: EmptyStateProps) {
  const Heading = (['h1', 'h2', 'h3'] as const)[headingLevel - 1];
  return (
    <div
      className={cx(
        'flex flex-col items-center gap-3 rounded-lg border border-dashed border-ink-600 px-6 py-10 text-center',
        className,
      )}
    >
      {illustration ?? <Orbits />}
      <Heading className="text-xl font-bold text-foam-50">{title}</Heading>
      {children && <div className="max-w-prose text-foam-300">{children}</div>}
      {action && <div className="mt-2">{action}</div>}
    </div>
  );
}
