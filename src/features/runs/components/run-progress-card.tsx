import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { Card } from '../../../components/ui/card.tsx';
import { ConfirmedAction } from '../../../components/ui/confirmed-action.tsx';
import { Spinner } from '../../../components/ui/spinner.tsx';
import { useCancelRun } from '../api/cancel-run.ts';
import type { ProgressSource } from '../hooks/use-live-run.ts';
import { formatCount, formatDuration } from './run-text.ts';
import { ProgressBar } from '../../../components/ui/progress-bar.tsx';
import { ProgressHeadline } from '../../../components/ui/progress-headline.tsx';

export interface RunProgressCardProps {
  departmentId: string;
  run: RunSummary;
  source: ProgressSource;
  /** The run's owner or a modeller. */
  canCancel: boolean;
}

function etaText(run: RunSummary): string {
  if (run.status === 'queued') return 'Waiting for a free worker; it starts by itself.';
  if (run.etaSeconds === null) return 'Working out the time left…';
  return `About ${formatDuration(run.etaSeconds)} left.`;
}

/** A queued or running run: a progress bar with chunks done and the time left, and a way to cancel. */
export function RunProgressCard({ departmentId, run, source, canCancel }: RunProgressCardProps) {
  const cancel = useCancelRun(departmentId);
  const percent = Math.floor(run.progress * 100);
  const label = run.status === 'queued' ? 'Queued' : `Running: ${percent}%`;

  return (
    <Card
      title={run.status === 'queued' ? 'Queued' : 'Running'}
      description="You can leave this page: the run carries on, and its results appear here when it ends."
      actions={
        canCancel && (
          <ConfirmedAction
            label="Cancel the run"
            title="Cancel this run?"
            confirmLabel="Cancel the run"
            cancelLabel="Keep it running"
            action={cancel}
            input={run.id}
          >
            A cancelled run keeps no result; the credits and free systems reserved for it are given back. It stays in the list as cancelled.
          </ConfirmedAction>
        )
      }
    >
      <div className="flex flex-col gap-3">
        <ProgressHeadline percent={`${percent}%`} status={etaText(run)} />
        <ProgressBar
          label="Run progress"
          value={percent}
          max={100}
          valueText={`${label}, ${run.chunksDone} of ${run.chunkCount} chunks`}
          minimumPercent={run.status === 'running' ? 1 : 0}
          className="h-4"
        />
        <p className="flex flex-wrap items-center gap-2 text-sm text-foam-400">
          <Spinner className="size-4 text-lantern-300" />
          {formatCount(run.chunksDone)} of {formatCount(run.chunkCount)} chunks of {formatCount(run.systems)} systems ·{' '}
          {source === 'stream' ? 'live updates' : 'updates every 2 s (the live stream is unavailable)'}
        </p>
      </div>
    </Card>
  );
}
