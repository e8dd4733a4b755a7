import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';

export interface DescriptionItem {
  term: ReactNode;
  description: ReactNode;
}

/** Term/value pairs (a run's seed, a server's version): two columns when there is room. */
export function DescriptionList({ items, className }: { items: readonly DescriptionItem[]; className?: string }) {
  return (
    <dl className={cx('grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-[minmax(8rem,auto)_1fr]', className)}>
      {items.map((item, index) => (
        <div key={index} className="contents">
          <dt className="pt-2 text-foam-400 sm:pb-2">{item.term}</dt>
          <dd className="min-w-0 pb-2 break-words text-foam-50 sm:pt-2">{item.description}</dd>
        </div>
      ))}
    </dl>
  );
}
