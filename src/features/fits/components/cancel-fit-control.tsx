import type { FitSummary } from '../../../../shared/contracts/fits.ts';
import { ConfirmedAction } from '../../../components/ui/confirmed-action.tsx';
import { useCancelFit } from '../api/cancel-fit.ts';
import { isFitLive } from '../api/get-fits.ts';
import { cancelFitWarning } from './fit-progress-text.ts';

/** For a queued or running fit (its owner or a modeller): cancel it, after saying what happens to the credit and the work done. */
export function CancelFitControl({
  departmentId,
  fit,
  label = 'Cancel the fit',
}: {
  departmentId: string;
  fit: Pick<FitSummary, 'id' | 'status' | 'progress'> & { costCredits: number | null };
  label?: string;
}) {
  const cancel = useCancelFit(departmentId);
  // Once the fit has ended, or its grid is computed and only the posterior is being worked out (the server
  // answers 409 then), the control goes; a cancel that crossed the end keeps the server's 409 in the dialog.
  if ((!isFitLive(fit.status) || fit.progress >= 1) && !cancel.isError) return null;
  return (
    <ConfirmedAction
      label={label}
      title={`${label}?`}
      confirmLabel={label}
      cancelLabel="Keep it running"
      size="sm"
      action={cancel}
      input={fit.id}
    >
      {cancelFitWarning(fit)}
    </ConfirmedAction>
  );
}
