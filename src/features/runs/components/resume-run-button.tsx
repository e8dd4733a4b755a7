import { useNavigate } from 'react-router-dom';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { Button } from '../../../components/ui/button.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { paths } from '../../../config/paths.ts';
import { useResumeRun } from '../api/resume-run.ts';
import { formatCount } from './run-text.ts';

/** For a failed run that kept computed chunks: start a new run that continues from them. */
export function ResumeRunButton({ departmentId, run }: { departmentId: string; run: RunSummary }) {
  const resume = useResumeRun(departmentId);
  const navigate = useNavigate();
  if (run.chunksDone === 0) return null;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-foam-300">
        {formatCount(run.chunksDone)} of {formatCount(run.chunkCount)} chunks were computed and kept. Resuming starts a new run of the same
        scenario and seed that continues from them; it ends with exactly the counts of an uninterrupted run and reserves its own credit.
      </p>
      <div>
        <Button pending={resume.isPending} onClick={() => resume.mutate(run.id, { onSuccess: ({ id }) => void navigate(paths.runs.detail.getHref(id)) })}>
          Resume from the kept chunks
        </Button>
      </div>
      {resume.isError ? <p role="alert" className="text-sm text-coral-300">{errorMessage(resume.error)}</p> : null}
    </div>
  );
}
