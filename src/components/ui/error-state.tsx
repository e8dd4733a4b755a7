import { isApiError } from '../../lib/api-client.ts';
import { cx } from '../../lib/class-names.ts';
import { Button } from './button.tsx';
import { AlertIcon } from './icons.tsx';

export interface ErrorStateProps {
  /** Usually an ApiError: its message is shown as the server wrote it. */
  error: unknown;
  title?: string;
  /** Shows a "Try again" button. */
  onRetry?: () => void;
  retrying?: boolean;
  className?: string;
}

export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'Something went wrong in the page. Reload it, and if it happens again, tell your department admin.';
}

/** Why something could not be shown, and a way to try again. */
export function ErrorState({ error, title = 'This could not be loaded', onRetry, retrying, className }: ErrorStateProps) {
  return (
    <div role="alert" className={cx('flex gap-3 rounded-lg border border-coral-300/60 bg-coral-300/8 p-5', className)}>
      <AlertIcon className="mt-1 text-coral-300" />
      <div className="flex min-w-0 flex-col items-start gap-2">
        <p className="font-bold text-foam-50">{title}</p>
        <p className="text-foam-300">{errorMessage(error)}</p>
        {onRetry && (
          <Button variant="secondary" size="sm" onClick={onRetry} pending={retrying}>
            Try again
          </Button>
        )}
      </div>
    </div>
  );
}
