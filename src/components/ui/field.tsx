import { useId, type ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';
import { AlertIcon } from './icons.tsx';

/** What a Field hands its control so that label, hint and error are tied to it. */
export interface FieldControlProps {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
}

export interface FieldProps {
  label: ReactNode;
  /** Keeps the label for assistive technology only (e.g. a select inside a table row). */
  hideLabel?: boolean;
  hint?: ReactNode;
  error?: string;
  /** Ids of further describing elements (a unit suffix). */
  describedBy?: string;
  id?: string;
  className?: string;
  children: (control: FieldControlProps) => ReactNode;
}

/** Label, hint, control and inline error, wired together with ids. */
export function Field({ label, hideLabel, hint, error, describedBy, id, className, children }: FieldProps) {
  const autoId = useId();
  const controlId = id ?? autoId;
  const hintId = `${controlId}-hint`;
  const errorId = `${controlId}-error`;
  const described = [hint ? hintId : null, describedBy, error ? errorId : null].filter(Boolean).join(' ');

  return (
    <div className={cx('flex flex-col gap-1.5', className)}>
      <label htmlFor={controlId} className={hideLabel ? 'sr-only' : 'font-bold text-foam-50'}>
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-foam-400">
          {hint}
        </p>
      )}
      {children({
        id: controlId,
        'aria-describedby': described || undefined,
        'aria-invalid': error ? true : undefined,
      })}
      {/* Always present, so that a message appearing in it is announced. */}
      <p id={errorId} aria-live="polite" className={cx('text-sm font-bold text-coral-300', !error && 'sr-only')}>
        {error && (
          <span className="inline-flex items-start gap-1.5">
            <AlertIcon className="mt-0.5 size-4 shrink-0" />
            {error}
          </span>
        )}
      </p>
    </div>
  );
}

/** The look of every text-like control, with its invalid state. */
export const controlClasses = cx(
  'min-h-11 w-full min-w-0 rounded-md border border-ink-500 bg-ink-900 px-3 py-2 text-base text-foam-50',
  'placeholder:text-foam-400 hover:border-foam-400',
  'aria-[invalid=true]:border-2 aria-[invalid=true]:border-coral-300',
  'disabled:cursor-not-allowed disabled:opacity-60',
);
