import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { sweepPointText } from '../../../../shared/contracts/sweep-point.ts';
import { roleAtLeast, type Role } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { buttonClasses } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { PageHeader } from '../../../components/ui/page-header.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { paths } from '../../../config/paths.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { ENGINE_VERSION, engineMajorVersion } from '../../../../shared/engine/version.ts';
import { useRunResult } from '../api/get-run-result.ts';
import { useLiveRun } from '../hooks/use-live-run.ts';
import { FateMapChart } from './fate-map-chart.tsx';
import { MethodsParagraph } from './methods-paragraph.tsx';
import { RunAssumptions } from './run-assumptions.tsx';
import { RunDetails } from './run-details.tsx';
import {
  CoolingAgeChart,
  LogFieldByChannelChart,
  LogFieldChart,
  PostCommonEnvelopePeriodChart,
  WdMassBySettingChart,
  WdMassChart,
} from './run-distribution-charts.tsx';
import { RunHeadline } from './run-headline.tsx';
import { ResumeRunButton } from './resume-run-button.tsx';
import { RunProgressCard } from './run-progress-card.tsx';
import { RunSplitCharts } from './run-split-charts.tsx';
import { RunStatusBadge } from './run-status-badge.tsx';
import { formatCount } from './run-text.ts';
import { SampleComparisonCard } from './sample-comparison-card.tsx';

export interface RunPageProps {
  departmentId: string;
  runId: string;
  userId: string;
  role: Role;
  sampleId: string | null;
  onSampleChange: (sampleId: string) => void;
  /** Sections of other features shown under a finished run's result (the scorecard), passed in by the route. */
  resultSections?: ReactNode;
  /** The exports section of a finished run (another feature), passed in by the route. */
  exportsSection?: ReactNode;
}

const runsLink = <Link to={paths.runs.getHref()}>Runs</Link>;

/** One run from queue to result: live progress while it works, then its result with charts, tests and exports. */
export function RunPage({ departmentId, runId, userId, role, sampleId, onSampleChange, resultSections, exportsSection }: RunPageProps) {
  const { run, source } = useLiveRun(departmentId, runId);

  if (run.isPending) return <LoadingState label="Loading the run…" />;
  if (run.isError) {
    if (isApiError(run.error) && run.error.status === 404) {
      return (
        <>
          <PageHeader eyebrow={runsLink} title="Run not found" />
          <EmptyState title="There is no such run in this department" action={<Link to={paths.runs.getHref()}>Back to the runs</Link>}>
            It may have been deleted, or the link belongs to another department.
          </EmptyState>
        </>
      );
    }
    return (
      <>
        <PageHeader eyebrow={runsLink} title="Run" />
        <ErrorState error={run.error} title="The run could not be loaded" onRetry={() => void run.refetch()} retrying={run.isFetching} />
      </>
    );
  }

  const r = run.data;
  const canCancel = r.ownerUserId === userId || roleAtLeast(role, 'modeller');
  const point = r.sweepPoint ?? null;
  return (
    <>
      <PageHeader
        eyebrow={
          point ? (
            <>
              {runsLink} / <Link to={paths.sweeps.detail.getHref(point.sweepId)}>Sweep “{point.sweepName}”</Link>
            </>
          ) : (
            runsLink
          )
        }
        title={point ? `${r.scenarioName} · ${sweepPointText(point.values)}` : r.scenarioName}
        description={
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <RunStatusBadge status={r.status} progress={r.progress} />
            <span>
              {formatCount(r.systems)} systems · seed “{r.seed}” · {r.ownerName} · {formatDateTimeUtc(r.createdAt)}
            </span>
          </span>
        }
        actions={
          point ? (
            <Link to={paths.runs.new.again(r.id)} className={buttonClasses({ variant: 'secondary' })}>
              Run this point again
            </Link>
          ) : (
            <Link to={paths.runs.new.getHref(r.scenarioId)} className={buttonClasses({ variant: 'secondary' })}>
              Run this scenario again
            </Link>
          )
        }
      />
      <RunBody departmentId={departmentId} run={r} source={source} canCancel={canCancel} sampleId={sampleId} onSampleChange={onSampleChange} resultSections={resultSections} exportsSection={exportsSection} />
    </>
  );
}

function RunBody({
  departmentId,
  run,
  source,
  canCancel,
  sampleId,
  onSampleChange,
  resultSections,
  exportsSection,
}: Pick<RunPageProps, 'departmentId' | 'sampleId' | 'onSampleChange' | 'resultSections' | 'exportsSection'> & { run: RunSummary; source: ReturnType<typeof useLiveRun>['source']; canCancel: boolean }) {
  const result = useRunResult(departmentId, run.id, run.status === 'succeeded');

  if (run.status === 'queued' || run.status === 'running') {
    return (
      <div className="flex flex-col gap-6">
        <RunProgressCard departmentId={departmentId} run={run} source={source} canCancel={canCancel} />
        <RunDetails run={run} />
      </div>
    );
  }
  if (run.status === 'failed' || run.status === 'cancelled') {
    return (
      <div className="flex flex-col gap-6">
        {run.status === 'failed' ? (
          <Alert
            message={
              <>
                <p className="font-bold">The run failed{run.finishedAt ? ` on ${formatDateTimeUtc(run.finishedAt)}` : ''}.</p>
                <p className="text-foam-300">{run.error ?? 'The server gave no reason.'}</p>
                <p className="text-foam-300">Its reserved credits were given back. Fix the scenario if the message points at it, then run it again.</p>
              </>
            }
          />
        ) : null}
        {run.status === 'failed' && canCancel ? <ResumeRunButton departmentId={departmentId} run={run} /> : null}
        {run.status === 'failed' ? null : (
          <Alert
            tone="info"
            message={
              <>
                <p className="font-bold">
                  The run was cancelled{run.finishedAt ? ` on ${formatDateTimeUtc(run.finishedAt)}` : ''}, with {formatCount(run.chunksDone)} of {formatCount(run.chunkCount)} chunks done.
                </p>
                <p className="text-foam-300">A cancelled run keeps no result; its reserved credits were given back.</p>
              </>
            }
          />
        )}
        <RunDetails run={run} />
      </div>
    );
  }

  return (
    <QueryState query={result} loadingLabel="Loading the result…" errorTitle="The result could not be loaded">
      {(data) => (
        <div className="flex flex-col gap-6">
          {engineMajorVersion(data.engineVersion) < 2 && (
            <Alert
              tone="info"
              message={`Made by engine ${data.engineVersion}. This result predates engine 2 (common envelope at its onset, helium white dwarfs, cooling ages and post-common-envelope periods): it is shown as stored, with a core-merger channel and without the newer histograms. Running the scenario again uses engine ${ENGINE_VERSION}.`}
            />
          )}
          <Card>
            <RunHeadline result={data} />
          </Card>
          <SampleComparisonCard
            departmentId={departmentId}
            runId={run.id}
            sampleId={sampleId}
            onSampleChange={onSampleChange}
            scenarioTest={data.comparison && { ...data.comparison, label: 'all white dwarfs', predictedCounts: { magnetic: data.fraction.k, whiteDwarfs: data.fraction.n } }}
          />
          {resultSections}
          <div className="grid gap-6 xl:grid-cols-2">
            <RunSplitCharts result={data} />
            <WdMassChart bins={data.bins.wdMass} />
            <LogFieldChart bins={data.bins.logField} />
            <LogFieldByChannelChart bins={data.bins.logField} />
            {data.bins.wdMassBySetting && <WdMassBySettingChart bins={data.bins.wdMassBySetting} heliumWhiteDwarfs={data.counts.heliumWhiteDwarfs} />}
            {data.bins.coolingAge && <CoolingAgeChart bins={data.bins.coolingAge} />}
            {data.bins.postCommonEnvelopePeriod && <PostCommonEnvelopePeriodChart bins={data.bins.postCommonEnvelopePeriod} />}
          </div>
          <FateMapChart result={data} />
          <div className="grid items-start gap-6 xl:grid-cols-2">
            <RunAssumptions result={data} />
            <div className="flex flex-col gap-6">
              {exportsSection}
              <RunDetails run={run} />
            </div>
          </div>
          <MethodsParagraph departmentId={departmentId} runId={run.id} />
        </div>
      )}
    </QueryState>
  );
}
