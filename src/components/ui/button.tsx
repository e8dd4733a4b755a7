import type { ButtonHTMLAttributes } from 'react';
import { cx } from '../../lib/class-names.ts';
import { Spinner } from './spinner.tsx';

export type ButtonVariant = 'primary' | 'secondary' | 'ghost' | 'danger';
export type ButtonSize = 'md' | 'sm';

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-lantern-400 text-ink-950 hover:bg-lantern-300 active:bg-lantern-500',
  secondary: 'border border-ink-500 bg-ink-800 text-foam-50 hover:border-foam-400 hover:bg-ink-700',
  ghost: 'text-foam-50 hover:bg-ink-800',
  danger: 'bg-coral-500 text-ink-950 hover:bg-coral-300 active:bg-coral-600',
};

const SIZES: Record<ButtonSize, string> = {
  md: 'min-h-11 px-4 py-2 text-base',
  sm: 'min-h-9 px-3 py-1 text-sm',
};

/** The classes of a button, for links that should look like one. */
export function buttonClasses({ variant = 'primary', size = 'md' }: { variant?: ButtonVariant; size?: ButtonSize } = {}) {
  return cx(
    'inline-flex items-center justify-center gap-2 rounded-md font-bold no-underline transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-55',
    VARIANTS[variant],
    SIZES[size],
  );
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner, sets aria-busy and blocks further clicks while an action runs. */
  pending?: boolean;
}

export function Button({ variant, size, pending = false, type = 'button', className, disabled, children, ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={cx(buttonClasses({ variant, size }), className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...rest}
    >
      {pending && <Spinner className={size === 'sm' ? 'size-4' : undefined} />}
      {children}
    </button>
  );
}
