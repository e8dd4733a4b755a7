import { Link } from 'react-router-dom';
import type { Sample } from '../../../../shared/contracts/samples.ts';
import type { SweepDetail } from '../../../../shared/contracts/sweeps.ts';
import { formatPercentWithError, formatSignificant } from '../../../../shared/engine/stats/format.ts';
import { fractionOrLimitText } from '../../../../shared/engine/stats/fraction-text.ts';
import { ChartKey } from '../../../components/charts/chart-key.tsx';
import { prefersLogAxis, responseCurveKey, responseCurveSpec, type ResponsePoint } from '../../../components/charts/response-curve-spec.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { Spinner } from '../../../components/ui/spinner.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { parameterShortTitle, parameterTitle } from './sweep-axes.ts';
import { sweepHeatmapSpec } from './sweep-heatmap-spec.ts';
import { allowedRangeSentence } from './sweep-text.ts';

type Point = SweepDetail['points'][number];

export interface SweepResultsProps {
  detail: SweepDetail;
  samples: readonly Sample[];
  sampleId: string | null;
  onSampleChange: (id: string | null) => void;
  /** A new answer (another sample, fresh points) is on its way. */
  updating: boolean;
}

const Y_TITLE = 'Predicted magnetic fraction (% of white dwarfs)';
const SETTING_WORDS: Record<Sample['setting'], string> = { all: 'all white dwarfs', single: 'single white dwarfs', detachedCompanion: 'white dwarfs with a detached companion' };

const verdictText = (ok: boolean | null) => (ok === null ? '—' : ok ? 'allowed' : 'rejected');

/** The sweep's predicted fraction across the grid, set against the chosen sample. */
export function SweepResults({ detail, samples, sampleId, onSampleChange, updating }: SweepResultsProps) {
  const usable = samples.filter((s) => s.kind !== 'meanMass');
  const sample = usable.find((s) => s.id === sampleId) ?? null;
  const done = detail.points.filter((p) => p.status === 'succeeded' && p.fraction !== null);
  const oneD = detail.axes.length === 1;
  const sampleOptions = [
    { value: '', label: 'No sample' },
    ...usable.map((s) => ({ value: s.id, label: `${s.name}${s.library ? ' (library)' : ''}${s.kind === 'counts' ? '' : ' — a quoted fraction, no test'}` })),
  ];

  return (
    <Card
      title="Predicted fraction"
      description={oneD ? 'The curve across the grid, each point with its Monte Carlo error, against the sample’s observed band.' : 'The grid as a heat map: one cell per point, coloured by the predicted fraction.'}
    >
      <div className="flex flex-wrap items-end gap-4">
        <Select
          label="Set against a sample"
          value={sampleId ?? ''}
          onChange={(e) => onSampleChange(e.target.value || null)}
          options={sampleOptions}
          className="min-w-0 grow sm:max-w-xl"
          hint="Counts samples give each point a p-value and the range of the parameter the sample allows."
        />
        {updating && (
          <p role="status" className="flex items-center gap-2 pb-3 text-foam-300">
            <Spinner className="size-4" /> Updating…
          </p>
        )}
      </div>

      {sample && sample.setting !== 'all' && (
        <Alert
          tone="info"
          className="mt-4"
          message={`This sample counts ${SETTING_WORDS[sample.setting]} only, while each point predicts the fraction among all white dwarfs; read the comparison with that in mind.`}
        />
      )}
      {sample && sample.kind !== 'counts' && (
        <Alert tone="info" className="mt-4" message="This sample quotes a fraction rather than counts: its value is drawn, but no point is tested against it and no allowed range is given." />
      )}

      <div className="mt-5">
        {done.length === 0 ? (
          <EmptyState title="No point has finished yet">The chart appears as soon as the first point has its result; this page follows the sweep by itself.</EmptyState>
        ) : oneD ? (
          <CurveView detail={detail} done={done} />
        ) : (
          <HeatmapView detail={detail} tested={Boolean(sample && sample.kind === 'counts')} />
        )}
      </div>

      <PointsTable detail={detail} tested={Boolean(detail.band && detail.points.some((p) => p.pValue !== null))} />
      <p className="mt-4 text-sm text-foam-400">{detail.method}</p>
    </Card>
  );
}

function CurveView({ detail, done }: { detail: SweepDetail; done: Point[] }) {
  const axis = detail.axes[0];
  const title = parameterTitle(axis);
  const points: ResponsePoint[] = done.map((p) => ({
    x: p.values[0],
    fraction: p.fraction!,
    se: p.fractionSe ?? 0,
    note: p.pValue === null ? undefined : `p = ${formatSignificant(p.pValue, 2)}`,
  }));
  const band = detail.band ? { name: detail.band.name, fraction: detail.band.fraction, interval68: detail.band.interval68, interval95: detail.band.interval95 } : null;
  const allowed = detail.allowedRange ? { level68: detail.allowedRange.level68, level95: detail.allowedRange.level95 } : null;
  const spec = responseCurveSpec({ points, xTitle: title, yTitle: Y_TITLE, band, allowed, logX: prefersLogAxis(axis.values), showPoints: true });
  const sorted = [...points].sort((a, b) => a.x - b.x);
  const ends = `from ${formatPercentWithError(sorted[0].fraction, sorted[0].se ?? 0)} at ${sorted[0].x} to ${formatPercentWithError(sorted[sorted.length - 1].fraction, sorted[sorted.length - 1].se ?? 0)} at ${sorted[sorted.length - 1].x}`;
  const description = `Predicted magnetic fraction against ${title} at ${points.length} grid values, ${ends}${band ? `, with the observed band of ${band.name}` : ''}.`;
  return (
    <>
      <VegaChart spec={spec} description={description} />
      <ChartKey items={responseCurveKey({ points, band, allowed, predictionLabel: 'Predicted fraction', parameterLabel: axis.label })} />
      {detail.allowedRange && (
        <div className="mt-4 flex flex-col gap-1 rounded-md border border-ink-700 bg-ink-900 p-4">
          <p className="font-bold text-foam-50">{allowedRangeSentence(detail.allowedRange.level68, '68%', axis.label, axis.unit, axis.values)}</p>
          <p className="font-bold text-foam-50">{allowedRangeSentence(detail.allowedRange.level95, '95%', axis.label, axis.unit, axis.values)}</p>
          <p className="text-sm text-foam-300">{detail.allowedRange.note}</p>
        </div>
      )}
    </>
  );
}

function HeatmapView({ detail, tested }: { detail: SweepDetail; tested: boolean }) {
  const [xAxis, yAxis] = detail.axes;
  const spec = sweepHeatmapSpec({ detail, xTitle: parameterTitle(xAxis), yTitle: parameterTitle(yAxis) });
  return (
    <>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Heat map (scrolls sideways on narrow screens)">
        <VegaChart
          spec={spec}
          description={`Heat map of the predicted magnetic fraction over ${parameterTitle(xAxis)} (columns) and ${parameterTitle(yAxis)} (rows); each cell gives the fraction with its Monte Carlo error.`}
          className="min-w-fit"
        />
      </div>
      <p className="mt-3 text-sm text-foam-300">
        Each cell: the predicted fraction ± its Monte Carlo standard error.
        {tested ? ' A thick outline marks a point the sample allows at 95%; a dot above its numbers, one it allows at 68% as well.' : ' Choose a counts sample to mark the points it allows.'}
        {' '}Grey cells have no result yet.
      </p>
    </>
  );
}

function PointsTable({ detail, tested }: { detail: SweepDetail; tested: boolean }) {
  const columns: TableColumn<Point>[] = [
    { id: 'index', header: 'Point', align: 'end', sortValue: (p) => p.index, cell: (p) => p.index + 1 },
    ...detail.axes.map(
      (axis, i): TableColumn<Point> => ({
        id: `axis-${i}`,
        // The symbol keeps the column narrow; the full name is in the chart, the progress card and the tooltip.
        header: (
          <abbr title={parameterTitle(axis)} className="no-underline">
            {parameterShortTitle(axis)}
          </abbr>
        ),
        stackedLabel: parameterShortTitle(axis),
        align: 'end',
        sortValue: (p) => p.values[i],
        cell: (p) => <span className="tabular-nums">{p.values[i]}</span>,
      }),
    ),
    {
      id: 'status',
      header: 'Status',
      sortValue: (p) => p.status,
      cell: (p) => <Badge tone={p.status === 'succeeded' ? 'success' : p.status === 'running' ? 'info' : p.status === 'queued' ? 'neutral' : 'warning'}>{p.status === 'succeeded' ? 'done' : p.status}</Badge>,
    },
    {
      id: 'fraction',
      header: 'Fraction ± MC error',
      align: 'end',
      sortValue: (p) => p.fraction ?? -1,
      cell: (p) => <span className="whitespace-nowrap tabular-nums">{p.fraction !== null && p.fractionSe !== null ? (fractionOrLimitText(p.magnetic ?? 0, p.whiteDwarfs ?? 0, p.fractionSe) ?? '—') : '—'}</span>,
    },
    ...(tested
      ? [
          { id: 'p', header: 'p (exact binomial)', align: 'end', sortValue: (p: Point) => p.pValue ?? -1, cell: (p: Point) => (p.pValue === null ? '—' : formatSignificant(p.pValue, 2)) } as TableColumn<Point>,
          { id: 'v68', header: 'At 68%', cell: (p: Point) => verdictText(p.consistent68) } as TableColumn<Point>,
          { id: 'v95', header: 'At 95%', cell: (p: Point) => verdictText(p.consistent95) } as TableColumn<Point>,
        ]
      : []),
    {
      id: 'run',
      header: <span className="sr-only">Run</span>,
      stackedLabel: false,
      align: 'end',
      cell: (p) => (
        <Link to={paths.runs.detail.getHref(p.runId)} className="whitespace-nowrap">
          Run<span className="sr-only"> of point {p.index + 1}</span>
        </Link>
      ),
    },
  ];
  return (
    <div className="mt-6">
      <h3 className="mb-3 font-bold text-foam-50">Grid points</h3>
      <Table caption="Grid points" hideCaption columns={columns} rows={detail.points} rowKey={(p) => p.runId} initialSort={{ columnId: 'index', direction: 'ascending' }} stackOnNarrow />
    </div>
  );
}
