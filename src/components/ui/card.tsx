import { useId, type ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';

export interface CardProps {
  title?: ReactNode;
  /** Heading level of the title; 2 under a page's h1. */
  headingLevel?: 2 | 3;
  description?: ReactNode;
  /** Buttons or links at the card's top right. */
  actions?: ReactNode;
  className?: string;
  children?: ReactNode;
}

/** A surface for one topic. With a title it is a labelled section. */
export function Card({ title, headingLevel = 2, description, actions, className, children }: CardProps) {
  const headingId = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section
      aria-labelledby={title ? headingId : undefined}
      className={cx('rounded-lg border border-ink-700 bg-ink-850 p-5 sm:p-6', className)}
    >
      {(title || actions) && (
        <div className="mb-4 flex flex-wrap items-start justify-between gap-3">
          <div className="min-w-0">
            {title && (
              <Heading id={headingId} className="text-xl font-bold text-foam-50">
                {title}
              </Heading>
            )}
            {description && <p className="mt-1 text-foam-300">{description}</p>}
          </div>
          {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
        </div>
      )}
      {children}
    </section>
  );
}
