import type { SweepDetail } from '../../../../shared/contracts/sweeps.ts';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { ConfirmedAction } from '../../../components/ui/confirmed-action.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useCancelSweep } from '../api/cancel-sweep.ts';
import { useResumeSweep } from '../api/resume-sweep.ts';
import { isSweepLive } from '../api/get-sweeps.ts';
import { parameterTitle } from './sweep-axes.ts';
import { SWEEP_STATUS_TEXT, missingPoints, pointsProgress } from './sweep-text.ts';
import { ProgressBar } from '../../../components/ui/progress-bar.tsx';

/** Where the sweep stands: points done out of all, its settings, and a way to cancel the rest (or resume a failed sweep). */
export function SweepProgress({ departmentId, detail, canCancel, scenarioName }: { departmentId: string; detail: SweepDetail; canCancel: boolean; scenarioName: string }) {
  const cancel = useCancelSweep(departmentId);
  const resume = useResumeSweep(departmentId);
  const progress = pointsProgress(detail);
  const live = isSweepLive(detail.status);
  const missing = missingPoints(detail);
  // The points are one job: when it failed, every point failed with it and it can continue from its checkpoint.
  const failed = !live && detail.points.some((p) => p.status === 'failed');
  // The server calls a sweep finished once no point is left to run, also when some were cancelled.
  const status = detail.status === 'finished' && detail.points.some((p) => p.status === 'cancelled') ? { label: 'Stopped early', tone: 'warning' as const } : SWEEP_STATUS_TEXT[detail.status];

  return (
    <Card
      title="Progress"
      actions={
        live && canCancel ? (
          <ConfirmedAction
            label="Cancel the sweep"
            title="Cancel the sweep?"
            confirmLabel="Cancel the remaining points"
            cancelLabel="Keep it running"
            size="sm"
            action={cancel}
            input={detail.id}
          >
            The points are computed together in one pass, so every point that has not finished stops. Each one’s reserved credit is given back in full (a
            refund entry per point in the credit ledger), also for the part already computed, and that part is discarded: a cancelled sweep cannot be resumed.
          </ConfirmedAction>
        ) : failed && canCancel ? (
          <Button size="sm" pending={resume.isPending} onClick={() => resume.mutate(detail.id)}>
            Resume the sweep
          </Button>
        ) : undefined
      }
    >
      <div className="flex flex-wrap items-center gap-3">
        <Badge tone={status.tone}>{status.label}</Badge>
        <span className="font-bold text-foam-50 tabular-nums" aria-live="polite">
          {progress.text}
          {missing > 0 ? ` (${missing} without a result)` : ''}
        </span>
      </div>
      {resume.isError ? <p role="alert" className="mt-2 text-sm text-coral-300">{errorMessage(resume.error)}</p> : null}
      {failed ? (
        <p className="mt-2 text-foam-300">
          The sweep's computation failed. Resuming continues from the chunks it had computed, with the same seed, so every point ends with the counts of an
          uninterrupted sweep; each point reserves its credit again (the failed attempt's was given back).
        </p>
      ) : null}
      <ProgressBar label="Points done" value={detail.pointsDone} max={detail.pointCount} valueText={progress.text} className="mt-3" />
      <DescriptionList
        className="mt-4"
        items={[
          { term: 'Scenario', description: `${scenarioName} (version ${detail.scenarioVersion})` },
          { term: 'Varies', description: detail.axes.map((a) => `${parameterTitle(a)}: ${a.values.join(', ')}`).join(' × ') },
          { term: 'Systems per point', description: detail.systems.toLocaleString('en-US') },
          { term: 'Seed', description: <code className="font-mono">{detail.seed}</code> },
          { term: 'Created', description: formatDateTimeUtc(detail.createdAt) },
        ]}
      />
    </Card>
  );
}
