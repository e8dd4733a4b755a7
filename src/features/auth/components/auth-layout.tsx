import type { ReactNode } from 'react';
import { DocumentTitle } from '../../../components/ui/document-title.tsx';
import { TidefieldMark } from '../../../components/ui/icons.tsx';

export interface AuthLayoutProps {
  title: string;
  intro: ReactNode;
  children: ReactNode;
  /** The link to the other auth page, under the form. */
  footer: ReactNode;
}

/** The frame of the sign-in and sign-up pages: what Tidefield is, and the form. */
export function AuthLayout({ title, intro, children, footer }: AuthLayoutProps) {
  return (
    <div className="flex min-h-dvh flex-col items-center justify-center gap-10 px-4 py-10 lg:flex-row lg:gap-20">
      <DocumentTitle title={title} />
      <div className="max-w-md lg:max-w-sm">
        <p className="flex items-center gap-3 text-2xl font-bold text-foam-50">
          <TidefieldMark className="size-11" />
          Tidefield
        </p>
        <p className="mt-4 text-lg text-foam-300">
          Monte Carlo population synthesis of magnetic white dwarfs: from companions engulfed on the giant branches to
          the magnetic fraction you can test against an observed sample.
        </p>
      </div>
      <main className="w-full max-w-md rounded-xl border border-ink-700 bg-ink-850 p-6 sm:p-8">
        <h1 className="text-2xl font-bold">{title}</h1>
        <div className="mt-2 text-foam-300">{intro}</div>
        <div className="mt-6">{children}</div>
        <p className="mt-6 border-t border-ink-700 pt-5 text-foam-300">{footer}</p>
      </main>
    </div>
  );
}
