import { useState, type ReactNode } from 'react';
import { Button, type ButtonSize } from './button.tsx';
import { ConfirmDialog } from './confirm-dialog.tsx';
import { errorMessage } from './error-state.tsx';

export interface ConfirmedActionProps<T> {
  /** The button's words, e.g. "Cancel the fit". */
  label: string;
  title: string;
  confirmLabel: string;
  cancelLabel: string;
  size?: ButtonSize;
  /**
   * The mutation behind it, run on `input` when confirmed; the dialog closes once it has succeeded.
   * Pending spins the confirm button, an error (e.g. the server's 409) shows in the dialog.
   */
  action: {
    mutate(input: T, options: { onSuccess: () => void }): void;
    isPending: boolean;
    isError: boolean;
    error: unknown;
    reset(): void;
  };
  input: T;
  /** What will happen, in plain words. */
  children: ReactNode;
}

/** A danger button that asks first: the dialog says what happens, and keeps the server's refusal in view. */
export function ConfirmedAction<T>({
  label,
  title,
  confirmLabel,
  cancelLabel,
  size,
  action,
  input,
  children,
}: ConfirmedActionProps<T>) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <Button
        variant="danger"
        size={size}
        onClick={() => {
          action.reset();
          setOpen(true);
        }}
      >
        {label}
      </Button>
      <ConfirmDialog
        open={open}
        title={title}
        confirmLabel={confirmLabel}
        cancelLabel={cancelLabel}
        tone="danger"
        pending={action.isPending}
        error={action.isError ? errorMessage(action.error) : undefined}
        onConfirm={() => action.mutate(input, { onSuccess: () => setOpen(false) })}
        onCancel={() => setOpen(false)}
      >
        {children}
      </ConfirmDialog>
    </>
  );
}
