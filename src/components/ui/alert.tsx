import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';
import { AlertIcon, CheckIcon, InfoIcon } from './icons.tsx';

export type AlertTone = 'danger' | 'success' | 'info';

const TONES: Record<AlertTone, { box: string; icon: ReactNode }> = {
  danger: { box: 'border-coral-300/60 bg-coral-300/10', icon: <AlertIcon className="mt-0.5 text-coral-300" /> },
  success: { box: 'border-kelp-300/60 bg-kelp-300/10', icon: <CheckIcon className="mt-0.5 text-kelp-300" /> },
  info: { box: 'border-tide-300/60 bg-tide-300/10', icon: <InfoIcon className="mt-0.5 text-tide-300" /> },
};

export interface AlertProps {
  /** Nothing is shown without a message; the live region stays so the next one is announced. */
  message?: ReactNode;
  tone?: AlertTone;
  className?: string;
}

/**
 * A message in a box: errors above a form that belong to no field (wrong credentials, too many
 * attempts, a 409), or the outcome of an action. Danger is announced at once, the rest politely.
 */
export function Alert({ message, tone = 'danger', className }: AlertProps) {
  return (
    <div aria-live={tone === 'danger' ? 'assertive' : 'polite'} aria-atomic="true" className={className}>
      {message && (
        <div className={cx('flex gap-2 rounded-md border px-4 py-3 text-foam-50', TONES[tone].box)}>
          {TONES[tone].icon}
          <div className="min-w-0">{message}</div>
        </div>
      )}
    </div>
  );
}
