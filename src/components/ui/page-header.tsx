import type { ReactNode } from 'react';
import { DocumentTitle } from './document-title.tsx';

export interface PageHeaderProps {
  /** The page's h1 and the tab's title. */
  title: string;
  /** A line above the title (the active department). */
  eyebrow?: ReactNode;
  description?: ReactNode;
  /** The page's main actions, at the right on wide screens. */
  actions?: ReactNode;
}

export function PageHeader({ title, eyebrow, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-8 flex flex-wrap items-end justify-between gap-4 border-b border-ink-700 pb-6">
      <DocumentTitle title={title} />
      <div className="min-w-0 max-w-3xl">
        {eyebrow && <p className="mb-1 text-sm font-bold tracking-wide text-lantern-300 uppercase">{eyebrow}</p>}
        <h1 className="text-3xl font-bold text-foam-50">{title}</h1>
        {description && <div className="mt-2 text-lg text-foam-300">{description}</div>}
      </div>
      {actions && <div className="flex flex-wrap gap-3">{actions}</div>}
    </header>
  );
}
