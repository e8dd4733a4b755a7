import { useState, type ReactNode } from 'react';
import { Button, type ButtonSize } from './button.tsx';
import { ConfirmDialog } from './confirm-dialog.tsx';
import { errorMessage } from './error-state.tsx';

export interface ConfirmedActionProps {
  /** The button's words, e.g. "Cancel the fit". */
  label: string;
  title: string;
  confirmLabel: string;
  cancelLabel: string;
  size?: ButtonSize;
  /** The mutation behind it: pending spins the confirm button, an error (e.g. the server's 409) shows in the dialog. */
  action: { isPending: boolean; isError: boolean; error: unknown; reset(): void };
  /** Starts the action; call `close` when it has succeeded. */
  onConfirm: (close: () => void) => void;
  /** What will happen, in plain words. */
  children: ReactNode;
}

/** A danger button that asks first: the dialog says what happens, and keeps the server's refusal in view. */
export function ConfirmedAction({
  label,
  title,
  confirmLabel,
  cancelLabel,
  size,
  action,
  onConfirm,
  children,
}: ConfirmedActionProps) {
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
        onConfirm={() => onConfirm(() => setOpen(false))}
        onCancel={() => setOpen(false)}
      >
        {children}
      </ConfirmDialog>
    </>
  );
}
