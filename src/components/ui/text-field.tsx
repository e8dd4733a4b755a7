import { useId, useState, type InputHTMLAttributes, type ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';
import { Field, controlClasses } from './field.tsx';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'children'> {
  label: ReactNode;
  hideLabel?: boolean;
  hint?: ReactNode;
  error?: string;
  /** Unit shown after the input ("MG", "Msun", "days"); also read out with the field. */
  unit?: ReactNode;
  /** Classes of the wrapper (label, hint, control, error). */
  className?: string;
}

const addonClasses =
  'flex shrink-0 items-center rounded-r-md border border-l-0 border-ink-500 bg-ink-800 px-3 text-foam-300';

/** A labelled input. `type="password"` gets a Show/Hide button. */
export function TextField({ label, hideLabel, hint, error, unit, id, className, type = 'text', ...input }: TextFieldProps) {
  const unitId = useId();
  const [revealed, setRevealed] = useState(false);
  const isPassword = type === 'password';
  const hasAddon = Boolean(unit) || isPassword;

  return (
    <Field label={label} hideLabel={hideLabel} hint={hint} error={error} id={id} describedBy={unit ? unitId : undefined} className={className}>
      {(control) => (
        <div className="flex">
          <input
            {...input}
            {...control}
            type={isPassword && revealed ? 'text' : type}
            className={cx(controlClasses, hasAddon && 'rounded-r-none', input.readOnly && 'bg-ink-850')}
          />
          {unit && (
            <span id={unitId} className={addonClasses}>
              {unit}
            </span>
          )}
          {isPassword && (
            <button
              type="button"
              className={cx(addonClasses, 'font-bold text-foam-50 hover:bg-ink-700')}
              aria-controls={control.id}
              aria-pressed={revealed}
              onClick={() => setRevealed((r) => !r)}
            >
              {revealed ? 'Hide' : 'Show'}
              <span className="sr-only"> password</span>
            </button>
          )}
        </div>
      )}
    </Field>
  );
}

export type NumberFieldProps = Omit<TextFieldProps, 'type' | 'inputMode'>;

/**
 * A number input with an optional unit. A text input with a decimal keypad rather than
 * type="number": no wheel or arrow-key nudging, and "1e6" or "0.47" stay as typed.
 */
export function NumberField({ className, ...props }: NumberFieldProps) {
  return (
    <TextField
      autoComplete="off"
      spellCheck={false}
      {...props}
      type="text"
      inputMode="decimal"
      className={cx('tabular-nums', className)}
    />
  );
}
