import type { FitDetail } from '../../../../shared/contracts/fits.ts';
import { Button } from '../../../components/ui/button.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useResumeFit } from '../api/resume-fit.ts';

/** For a fit whose grid computation failed: continue it from the chunks that were computed. */
export function ResumeFitButton({ departmentId, fit }: { departmentId: string; fit: FitDetail }) {
  const resume = useResumeFit(departmentId);
  if (fit.status !== 'failed' || fit.posterior || fit.progress === 0) return null;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-foam-300">
        {Math.round(fit.progress * 100)}% of the grid's chunks were computed and kept. Resuming continues from them with the same seed; the
        posterior is exactly that of an uninterrupted fit, and credit for the whole grid is reserved again (the failed attempt's was given back).
      </p>
      <div>
        <Button pending={resume.isPending} onClick={() => resume.mutate(fit.id)}>
          Resume from the kept chunks
        </Button>
      </div>
      {resume.isError ? <p role="alert" className="text-sm text-coral-300">{errorMessage(resume.error)}</p> : null}
    </div>
  );
}
