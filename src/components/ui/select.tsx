import type { ReactNode, SelectHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names.ts';
import { Field, controlClasses } from './field.tsx';

export interface SelectOption {
  value: string;
  label: string;
  disabled?: boolean;
}

export interface SelectProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'children'> {
  label: ReactNode;
  hideLabel?: boolean;
  hint?: ReactNode;
  error?: string;
  options: readonly SelectOption[];
  className?: string;
}

/** A labelled native select (keyboard and screen-reader behaviour for free). */
export function Select({ label, hideLabel, hint, error, options, id, className, ...select }: SelectProps) {
  return (
    <Field label={label} hideLabel={hideLabel} hint={hint} error={error} id={id} className={className}>
      {(control) => (
        <div className="relative">
          <select {...select} {...control} className={cx(controlClasses, 'cursor-pointer appearance-none pr-10')}>
            {options.map((option) => (
              <option key={option.value} value={option.value} disabled={option.disabled}>
                {option.label}
              </option>
            ))}
          </select>
          <svg
            viewBox="0 0 24 24"
            aria-hidden="true"
            className="pointer-events-none absolute top-1/2 right-3 size-5 -translate-y-1/2 text-foam-300"
            fill="none"
            stroke="currentColor"
            strokeWidth="2.2"
            strokeLinecap="round"
          >
            <path d="m7 10 5 5 5-5" />
          </svg>
        </div>
      )}
    </Field>
  );
}
