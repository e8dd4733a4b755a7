import type { ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import type { ExportListing } from '../../../shared/contracts/exports.ts';
import type { SharedObject } from '../../../shared/contracts/shares.ts';
import { formatPercentWithError } from '../../../shared/engine/stats/format.ts';
import { Card } from '../../components/ui/card.tsx';
import { CopyButton } from '../../components/ui/copy-button.tsx';
import { EmptyState } from '../../components/ui/empty-state.tsx';
import { ErrorState } from '../../components/ui/error-state.tsx';
import { LoadingState } from '../../components/ui/loading-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { Table } from '../../components/ui/table.tsx';
import { isApiError } from '../../lib/api-client.ts';
import { formatDateTimeUtc } from '../../lib/format.ts';
import { FateMapChart } from '../../features/runs/components/fate-map-chart.tsx';
import { RunAssumptions } from '../../features/runs/components/run-assumptions.tsx';
import { LogFieldChart, WdMassChart } from '../../features/runs/components/run-distribution-charts.tsx';
import { RunHeadline } from '../../features/runs/components/run-headline.tsx';
import { RunSplitCharts } from '../../features/runs/components/run-split-charts.tsx';
import { formatCount } from '../../features/runs/components/run-text.ts';
import { useSharedObject } from '../../features/exports/api/get-shared-object.ts';

const EYEBROW = 'Tidefield · read-only link';

function Frame({ children }: { children: ReactNode }) {
  return <main className="mx-auto flex w-full max-w-7xl flex-col gap-6 px-4 py-8 sm:px-8">{children}</main>;
}

function Downloads({ token, exports, references }: { token: string; exports: ExportListing; references: boolean }) {
  const base = `/api/shared/${encodeURIComponent(token)}`;
  return (
    <Card title="Downloads" description="The tables with units and provenance (ECSV for astropy.table, VOTable 1.4 for Virtual Observatory tools).">
      <ul className="flex flex-col gap-3">
        {exports.tables.map((t) => (
          <li key={t.name} className="flex flex-col gap-1">
            <span className="text-foam-50">{t.title}</span>
            <span className="text-sm text-foam-400">{t.description}</span>
            <span className="flex gap-4">
              <a className="font-bold" href={`${base}/export?format=ecsv&table=${t.name}`} download>ECSV</a>
              <a className="font-bold" href={`${base}/export?format=votable&table=${t.name}`} download>VOTable</a>
            </span>
          </li>
        ))}
        {references && (
          <li className="flex flex-col gap-1">
            <span className="text-foam-50">References (BibTeX)</span>
            <a className="font-bold" href={`${base}/references.bib`} download>Download BibTeX</a>
          </li>
        )}
      </ul>
    </Card>
  );
}

function SharedRun({ token, data }: { token: string; data: Extract<SharedObject, { kind: 'run' }> }) {
  const { run, result } = data;
  return (
    <>
      <PageHeader
        eyebrow={EYEBROW}
        title={run.scenarioName}
        description={`${formatCount(run.systems)} systems · seed “${run.seed}” · engine ${run.engineVersion}${run.finishedAt ? ` · finished ${formatDateTimeUtc(run.finishedAt)}` : ''}`}
      />
      <Card>
        <RunHeadline result={result} />
      </Card>
      <div className="grid gap-6 xl:grid-cols-2">
        <RunSplitCharts result={result} />
        <WdMassChart bins={result.bins.wdMass} />
        <LogFieldChart bins={result.bins.logField} />
      </div>
      <FateMapChart result={result} />
      <div className="grid items-start gap-6 xl:grid-cols-2">
        <RunAssumptions result={result} />
        <Downloads token={token} exports={data.exports} references />
      </div>
      <Card title="Methods paragraph" description="Every published method the run used, and the engine version, scenario hash and seed that reproduce it." actions={<CopyButton text={data.methods} label="Copy the methods paragraph" size="md" />}>
        <div tabIndex={0} role="region" aria-label="Methods paragraph text" className="max-h-96 overflow-y-auto rounded-md border border-ink-700 bg-ink-900 p-4 whitespace-pre-wrap text-foam-300">
          {data.methods}
        </div>
      </Card>
    </>
  );
}

type SweepPoint = Extract<SharedObject, { kind: 'sweep' }>['sweep']['points'][number];

function SharedSweep({ token, data }: { token: string; data: Extract<SharedObject, { kind: 'sweep' }> }) {
  const { sweep } = data;
  return (
    <>
      <PageHeader eyebrow={EYEBROW} title={sweep.name} description={`${sweep.pointCount} grid points · ${formatCount(sweep.systems)} systems each · seed “${sweep.seed}”`} />
      <Card title="Magnetic fraction at each grid point" description={sweep.method}>
        <Table<SweepPoint>
          caption="Grid points of the sweep"
          hideCaption
          rows={sweep.points}
          rowKey={(p) => String(p.index)}
          columns={[
            ...sweep.axes.map((a, i) => ({ id: a.path, header: `${a.label}${a.unit ? ` (${a.unit})` : ''}`, cell: (p: SweepPoint) => String(p.values[i]), align: 'end' as const })),
            { id: 'status', header: 'Status', cell: (p: SweepPoint) => p.status },
            {
              id: 'fraction', header: 'Magnetic fraction', align: 'end' as const,
              cell: (p: SweepPoint) => (p.fraction !== null && p.fractionSe !== null ? formatPercentWithError(p.fraction, p.fractionSe) : '—'),
            },
          ]}
        />
      </Card>
      <Downloads token={token} exports={data.exports} references={false} />
    </>
  );
}

/**
 * A read-only share link, public and outside the signed-in app: one run's result page (or one
 * sweep's points), composed from the run feature's charts, without signing in.
 */
export function Component() {
  const { token = '' } = useParams();
  return <SharedPage key={token} token={token} />;
}

function SharedPage({ token }: { token: string }) {
  const shared = useSharedObject(token);
  if (shared.isPending) return <Frame><LoadingState label="Opening the shared result…" /></Frame>;
  if (shared.isError) {
    return (
      <Frame>
        {isApiError(shared.error) && shared.error.status === 404 ? (
          <EmptyState headingLevel={1} title="This link does not exist or was revoked">
            Ask whoever sent it for a new one. Links to Tidefield results can be revoked by the department that made them.
          </EmptyState>
        ) : (
          <ErrorState error={shared.error} title="The shared result could not be loaded" onRetry={() => void shared.refetch()} retrying={shared.isFetching} />
        )}
      </Frame>
    );
  }
  return <Frame>{shared.data.kind === 'run' ? <SharedRun token={token} data={shared.data} /> : <SharedSweep token={token} data={shared.data} />}</Frame>;
}
