import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatPercentWithError } from '../../../../shared/engine/stats/format.ts';
import { binnedChartSpec } from '../../../components/charts/binned-chart-spec.ts';
import { binWidthText } from '../../../components/charts/bin-width.ts';
import { fractionChartSpec, type FractionPoint } from '../../../components/charts/fraction-chart-spec.ts';
import { CHANNEL_SERIES, runColour, runLetter, SETTING_SERIES } from '../../../components/charts/result-series.ts';
import { ShareToggle } from '../../../components/charts/share-toggle.tsx';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDate } from '../../../lib/format.ts';
import { useComparison, type ComparedRun, type RunsComparison } from '../api/get-comparison.ts';
import { COMPARE_MIN_RUNS, differenceInWords, percentagePoints } from './compare-text.ts';

interface Labelled {
  entry: ComparedRun;
  letter: string;
  /** Legend name: "A: Baseline, fixed engulfment reach". */
  name: string;
  colour: string;
}

const count = (n: number) => n.toLocaleString('en-US');
const sameEdges = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, i) => Math.abs(x - b[i]) < 1e-9);

function RunsTable({ runs, onRemove }: { runs: Labelled[]; onRemove: (id: string) => void }) {
  const canRemove = runs.length > COMPARE_MIN_RUNS;
  const columns: TableColumn<Labelled>[] = [
    {
      id: 'run',
      header: 'Run',
      rowHeader: true,
      cell: (r) => (
        <span className="flex items-center gap-2">
          <span aria-hidden="true" className="size-3.5 shrink-0 rounded-full" style={{ background: r.colour }} />
          <span>
            <span className="font-bold">{r.letter}</span>{' '}
            <Link to={paths.runs.detail.getHref(r.entry.run.id)}>{r.entry.run.scenarioName}</Link>
          </span>
        </span>
      ),
    },
    { id: 'fraction', header: 'Fraction ± MC error', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{fractionText(r.entry.fraction)}</span> },
    { id: 'n', header: 'White dwarfs', align: 'end', cell: (r) => <span className="tabular-nums">{count(r.entry.fraction.n)}</span> },
    { id: 'systems', header: 'Systems', align: 'end', cell: (r) => <span className="tabular-nums">{count(r.entry.run.systems)}</span> },
    { id: 'seed', header: 'Seed', cell: (r) => <code className="font-mono text-sm">{r.entry.run.seed}</code> },
    {
      id: 'when',
      header: 'Started',
      cell: (r) => (
        <span className="inline-flex flex-col whitespace-nowrap">
          <span>{formatDate(r.entry.run.createdAt)}</span>
          <span className="text-sm text-foam-400">{r.entry.run.createdAt.slice(11, 16)} UTC</span>
        </span>
      ),
    },
    {
      id: 'remove',
      header: <span className="sr-only">Actions</span>,
      stackedLabel: false,
      align: 'end',
      cell: (r) =>
        canRemove ? (
          <Button variant="ghost" size="sm" onClick={() => onRemove(r.entry.run.id)}>
            Remove<span className="sr-only"> run {r.letter}</span>
          </Button>
        ) : null,
    },
  ];
  return <Table caption="The runs compared" hideCaption columns={columns} rows={runs} rowKey={(r) => r.entry.run.id} stackOnNarrow />;
}

function fractionText(f: ComparedRun['fraction']): string {
  return f.value === null || f.se === null ? '—' : formatPercentWithError(f.value, f.se);
}

function pointsOf(runs: Labelled[], groups: { category: string; pick: (e: ComparedRun) => ComparedRun['fraction'] }[]): FractionPoint[] {
  return groups.flatMap((g) =>
    runs.flatMap((r) => {
      const f = g.pick(r.entry);
      return f.value === null || f.se === null ? [] : [{ category: g.category, series: r.name, value: f.value, se: f.se }];
    }),
  );
}

function FractionCharts({ runs }: { runs: Labelled[] }) {
  const series = runs.map((r) => ({ name: r.name, colour: r.colour }));
  const settings = [
    { category: 'All white dwarfs', pick: (e: ComparedRun) => e.fraction },
    ...SETTING_SERIES.map((s) => ({ category: s.short, pick: (e: ComparedRun) => e.fractionBySetting[s.key] })),
  ];
  // Engine-1 and engine-2 results name different channels; a channel absent from a run has no point.
  const channels = CHANNEL_SERIES.filter((c) => runs.some((r) => r.entry.fractionByChannel[c.key] !== undefined)).map((c) => ({
    category: c.short,
    pick: (e: ComparedRun) => e.fractionByChannel[c.key] ?? { value: null, se: null, k: 0, n: 0 },
  }));
  const describe = (points: FractionPoint[]) => points.map((p) => `${p.series}, ${p.category}: ${formatPercentWithError(p.value, p.se)}`).join('; ');
  const settingPoints = pointsOf(runs, settings);
  const channelPoints = pointsOf(runs, channels);
  return (
    <div className="grid gap-6 xl:grid-cols-2">
      <Card title="Magnetic fraction" description="Overall and within each setting. Thick bars: ±1 Monte Carlo error; thin: ±2.">
        <VegaChart
          description={`Magnetic fraction of each run, overall and by setting, with Monte Carlo errors. ${describe(settingPoints)}.`}
          spec={fractionChartSpec({ points: settingPoints, series, categories: settings.map((s) => s.category), valueTitle: 'Magnetic fraction (%)' })}
        />
      </Card>
      <Card title="By channel" description="Magnetic white dwarfs of each channel as a share of all white dwarfs.">
        <VegaChart
          description={`Share of all white dwarfs made magnetic by each channel, for each run. ${describe(channelPoints)}.`}
          spec={fractionChartSpec({ points: channelPoints, series, categories: channels.map((c) => c.category), valueTitle: 'Share of all white dwarfs (%)' })}
        />
      </Card>
    </div>
  );
}

type MassPopulation = 'magnetic' | 'nonMagnetic' | 'all';
const populationOptions = [
  { value: 'magnetic', label: 'Magnetic white dwarfs' },
  { value: 'nonMagnetic', label: 'Non-magnetic white dwarfs' },
  { value: 'all', label: 'All white dwarfs' },
];

function MassChart({ runs }: { runs: Labelled[] }) {
  const [population, setPopulation] = useState<MassPopulation>('magnetic');
  const [share, setShare] = useState(true);
  const edges = runs[0].entry.bins.wdMass.edgesMsun;
  if (!runs.every((r) => sameEdges(r.entry.bins.wdMass.edgesMsun, edges))) {
    return (
      <Card title="White-dwarf mass">
        <Alert tone="info" message="These runs were binned differently (different engine versions), so their mass histograms cannot share one axis. Open each run for its own." />
      </Card>
    );
  }
  const countsOf = (r: Labelled) => {
    const { magnetic, nonMagnetic } = r.entry.bins.wdMass;
    return population === 'magnetic' ? magnetic : population === 'nonMagnetic' ? nonMagnetic : magnetic.map((m, i) => m + nonMagnetic[i]);
  };
  const width = binWidthText(edges);
  const label = populationOptions.find((o) => o.value === population)!.label;
  return (
    <Card title="White-dwarf mass" description="One outline per run on the same axes.">
      <div className="flex flex-col gap-3">
        <div className="flex flex-wrap items-end gap-x-6 gap-y-3">
          <Select label="White dwarfs shown" value={population} options={populationOptions} onChange={(e) => setPopulation(e.target.value as MassPopulation)} className="w-64" />
          <ShareToggle checked={share} onChange={setShare} label="Show each run as a share of its own total" />
        </div>
        <VegaChart
          description={`${label}: mass histograms of ${runs.length} runs in ${width} Msun bins${share ? ', each as a share of its own total' : ''}.`}
          spec={binnedChartSpec({
            edges,
            series: runs.map((r) => ({ name: r.name, colour: r.colour, counts: countsOf(r) })),
            xTitle: 'White-dwarf mass (Msun)',
            xUnit: 'Msun',
            binLabel: `${width} Msun bin`,
            countNoun: label,
            normalise: share,
          })}
        />
      </div>
    </Card>
  );
}

function FieldChart({ runs }: { runs: Labelled[] }) {
  const [share, setShare] = useState(true);
  const edges = runs[0].entry.bins.logField.edgesLog10MG;
  if (!runs.every((r) => sameEdges(r.entry.bins.logField.edgesLog10MG, edges))) {
    return (
      <Card title="Field strength">
        <Alert tone="info" message="These runs were binned differently (different engine versions), so their field histograms cannot share one axis. Open each run for its own." />
      </Card>
    );
  }
  const thresholds = [...new Set(runs.map((r) => r.entry.bins.logField.thresholdMG))];
  const width = binWidthText(edges);
  return (
    <Card title="Field strength" description="White dwarfs with any field, one outline per run; dashed: the detection threshold.">
      <div className="flex flex-col gap-3">
        <ShareToggle checked={share} onChange={setShare} label="Show each run as a share of its own total" />
        <VegaChart
          description={`Histograms of the magnetic field of ${runs.length} runs in ${width} dex bins of log B, with the detection threshold at ${thresholds.join(' and ')} MG.`}
          spec={binnedChartSpec({
            edges,
            series: runs.map((r) => ({ name: r.name, colour: r.colour, counts: r.entry.bins.logField.counts })),
            xTitle: 'Magnetic field B (MG, log scale)',
            xUnit: 'MG',
            logX: true,
            binLabel: `${width} dex bin`,
            countNoun: 'White dwarfs',
            normalise: share,
            markers: thresholds.map((t) => ({ at: Math.log10(t), label: `threshold ${t} MG` })),
          })}
        />
      </div>
    </Card>
  );
}

interface DifferenceRow {
  key: string;
  pair: string;
  difference: number;
  se: number;
  sigma: number | null;
  sharedSeed: boolean;
}

function Differences({ comparison, runs }: { comparison: RunsComparison; runs: Labelled[] }) {
  const byId = new Map(runs.map((r) => [r.entry.run.id, r]));
  const rows: DifferenceRow[] = comparison.differences.flatMap((d) => {
    const a = byId.get(d.a);
    const b = byId.get(d.b);
    if (!a || !b) return [];
    const se = Math.hypot(a.entry.fraction.se ?? 0, b.entry.fraction.se ?? 0);
    return [{ key: `${d.a}-${d.b}`, pair: `${a.letter} − ${b.letter}`, difference: d.difference, se, sigma: d.sigma, sharedSeed: a.entry.run.seed === b.entry.run.seed }];
  });
  const columns: TableColumn<DifferenceRow>[] = [
    { id: 'pair', header: 'Runs', rowHeader: true, cell: (r) => r.pair },
    { id: 'difference', header: 'Difference ± combined MC error', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{percentagePoints(r.difference, r.se)}</span> },
    { id: 'words', header: 'Reading', cell: (r) => <>{differenceInWords(r.sigma, r.difference)}{r.sharedSeed && ' Same seed: see the note below.'}</> },
  ];
  const anyShared = rows.some((r) => r.sharedSeed);
  return (
    <Card title="Differences" description="Each pair of runs: the difference of their magnetic fractions in percentage points (pp), in units of the combined Monte Carlo error.">
      {rows.length === 0 ? (
        <p className="text-foam-300">No pair of runs has fractions with errors to compare.</p>
      ) : (
        <Table caption="Pairwise differences of the magnetic fraction" hideCaption columns={columns} rows={rows} rowKey={(r) => r.key} stackOnNarrow />
      )}
      <p className="mt-4 text-sm text-foam-400">Method: {comparison.method}</p>
      {anyShared && (
        <p className="mt-2 text-sm text-foam-400">
          Runs with the same seed share their random draws (common random numbers), so their difference is far less noisy than the combined error says:
          their σ here understates how clearly they differ.
        </p>
      )}
    </Card>
  );
}

export interface CompareViewProps {
  departmentId: string;
  runIds: readonly string[];
  onRemove: (runId: string) => void;
}

/** Two to four finished runs on the same axes: fractions with errors, mass and field histograms, pairwise differences. */
export function CompareView({ departmentId, runIds, onRemove }: CompareViewProps) {
  const comparison = useComparison(departmentId, runIds);
  return (
    <QueryState query={comparison} loadingLabel="Loading the runs…" errorTitle="The runs could not be compared">
      {(data) => {
        const runs: Labelled[] = data.runs.map((entry, i) => ({
          entry,
          letter: runLetter(i),
          name: `${runLetter(i)}: ${entry.run.scenarioName}`,
          colour: runColour(i),
        }));
        return (
          <div className="flex flex-col gap-6">
            <Card title="Runs">
              <RunsTable runs={runs} onRemove={onRemove} />
            </Card>
            <FractionCharts runs={runs} />
            <div className="grid gap-6 xl:grid-cols-2">
              <MassChart runs={runs} />
              <FieldChart runs={runs} />
            </div>
            <Differences comparison={data} runs={runs} />
          </div>
        );
      }}
    </QueryState>
  );
}
