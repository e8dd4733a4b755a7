import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button.tsx';
import { Alert } from './alert.tsx';

export interface ConfirmDialogProps {
  open: boolean;
  title: string;
  /** What will happen, in plain words. */
  children: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  /** `danger` for actions that destroy or remove. */
  tone?: 'primary' | 'danger';
  /** The action is running: the confirm button spins, the dialog stays open. */
  pending?: boolean;
  /** Why the action failed, shown inside the dialog (e.g. the server's 409 message). */
  error?: string;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * A modal question on a native <dialog>: the browser traps focus, makes the page behind it
 * inert and closes it on Escape. Focus starts on the cancel button, the safe choice.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  cancelLabel = 'Cancel',
  tone = 'primary',
  pending = false,
  error,
  onConfirm,
  onCancel,
}: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(event) => {
        // Escape: let React state decide whether the dialog is open.
        event.preventDefault();
        if (!pending) onCancel();
      }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-ink-600 bg-ink-850 p-0 text-foam-50 shadow-2xl shadow-ink-950"
    >
      {open && (
        <div className="flex flex-col gap-4 p-6">
          <h2 id={titleId} className="text-xl font-bold">
            {title}
          </h2>
          <div id={bodyId} className="text-foam-300">
            {children}
          </div>
          <Alert message={error} />
          <div className="flex flex-wrap justify-end gap-3">
            <Button variant="secondary" onClick={onCancel} disabled={pending} autoFocus>
              {cancelLabel}
            </Button>
            <Button variant={tone} onClick={onConfirm} pending={pending}>
              {confirmLabel}
            </Button>
          </div>
        </div>
      )}
    </dialog>
  );
}
