import { useState } from 'react';
import type { FitSummary } from '../../../../shared/contracts/fits.ts';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useCancelFit } from '../api/cancel-fit.ts';
import { isFitLive } from '../api/get-fits.ts';
import { cancelFitWarning } from './fit-progress-text.ts';

/** For a queued or running fit (its owner or a modeller): cancel it, after saying what happens to the credit and the work done. */
export function CancelFitControl({ departmentId, fit, label = 'Cancel the fit' }: { departmentId: string; fit: Pick<FitSummary, 'id' | 'status'> & { costCredits: number | null }; label?: string }) {
  const cancel = useCancelFit(departmentId);
  const [confirming, setConfirming] = useState(false);
  if (!isFitLive(fit.status) && !confirming) return null;
  return (
    <>
      <Button
        variant="danger"
        size="sm"
        onClick={() => {
          cancel.reset();
          setConfirming(true);
        }}
      >
        {label}
      </Button>
      <ConfirmDialog
        open={confirming}
        title={`${label}?`}
        confirmLabel={label}
        cancelLabel="Keep it running"
        tone="danger"
        pending={cancel.isPending}
        error={cancel.isError ? errorMessage(cancel.error) : undefined}
        onConfirm={() => cancel.mutate(fit.id, { onSuccess: () => setConfirming(false) })}
        onCancel={() => setConfirming(false)}
      >
        {cancelFitWarning(fit)}
      </ConfirmDialog>
    </>
  );
}
