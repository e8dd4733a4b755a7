import { cx } from '../../lib/class-names.ts';
import { Spinner } from './spinner.tsx';

export interface LoadingStateProps {
  label?: string;
  /** `page` centres it in the viewport (first load, route guard). */
  variant?: 'block' | 'page';
  className?: string;
}

/** A spinner with words, announced politely. */
export function LoadingState({ label = 'Loading…', variant = 'block', className }: LoadingStateProps) {
  return (
    <div
      role="status"
      className={cx(
        'flex items-center justify-center gap-3 text-foam-300',
        variant === 'page' ? 'min-h-dvh' : 'py-10',
        className,
      )}
    >
      <Spinner className="size-6 text-lantern-300" />
      <span>{label}</span>
    </div>
  );
}
