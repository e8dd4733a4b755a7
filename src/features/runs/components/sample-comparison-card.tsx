import type { ReactNode } from 'react';
import type { Sample } from '../../../../shared/contracts/samples.ts';
import { formatPercent, formatPercentRange, formatPercentWithError, formatPValue, formatSigma } from '../../../../shared/engine/stats/format.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { useRunComparison, type CountsComparison, type FractionConstraint, type RunComparison } from '../api/get-run-comparison.ts';
import { capitalised, comparisonChartSpec } from './comparison-chart-spec.ts';
import { formatCount, tensionInWords } from './run-text.ts';
import { useSampleChoices } from '../../../lib/api/scenario-choices.ts';

/** The sample shown first: the department's own counts, then the library's, then anything. */
export function defaultSampleId(samples: readonly Sample[]): string | null {
  const counts = samples.filter((s) => s.kind === 'counts');
  return (counts.find((s) => !s.library) ?? counts[0] ?? samples[0])?.id ?? null;
}

function sampleOptionLabel(s: Sample): string {
  const what =
    s.kind === 'counts' && s.magnetic !== null && s.total !== null
      ? `${formatCount(s.magnetic)} of ${formatCount(s.total)} magnetic`
      : s.kind === 'fraction' && s.fraction !== null
        ? `${s.lowerBound ? 'at least ' : ''}${formatPercent(s.fraction)}`
        : 'mean masses';
  return `${s.name} (${what})${s.library ? ' · published' : ''}`;
}

/** "p = 0.43", "p = 5.7 × 10⁻¹⁰". */
function pText(p: number): string {
  return `p = ${formatPValue(p > 0 ? Math.log(p) : -Infinity)}`;
}

function sigmaText(sigma: number | null): string {
  return sigma === null ? 'infinitely many σ' : formatSigma(sigma);
}

function intervalText(fraction: number, interval: [number, number]): string {
  const [, lo, hi] = formatPercentRange(fraction, interval[0], interval[1]);
  return `${lo}–${hi}%`;
}

function CountsView({ test, splits }: { test: CountsComparison | null; splits: CountsComparison[] }) {
  const rows = [...(test ? [test] : []), ...splits];
  const splitColumns: TableColumn<CountsComparison>[] = [
    { id: 'label', header: 'White dwarfs', rowHeader: true, cell: (r) => capitalised(r.label) },
    { id: 'observed', header: 'Observed', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{`${r.observed.magnetic} of ${r.observed.total}`}</span> },
    { id: 'interval', header: '95% interval', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{intervalText(r.observed.fraction, r.observed.interval95)}</span> },
    { id: 'predicted', header: 'Predicted ± MC error', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{formatPercentWithError(r.predicted.value, r.predicted.se)}</span> },
    { id: 'p', header: 'p (two-sided)', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{formatPValue(r.pValue > 0 ? Math.log(r.pValue) : -Infinity)}</span> },
    { id: 'sigma', header: 'Significance', align: 'end', cell: (r) => <span className="whitespace-nowrap tabular-nums">{sigmaText(r.sigma)}</span> },
  ];
  return (
    <div className="flex flex-col gap-5">
      {test && <TestSummary test={test} />}
      {rows.length > 0 && (
        <VegaChart
          description={`Observed magnetic fractions with their 68% and 95% Clopper–Pearson intervals beside the predicted fractions with Monte Carlo errors. ${rows.map((r) => r.summary).join(' ')}`}
          spec={comparisonChartSpec(rows)}
        />
      )}
      {splits.length > 0 && (
        <div className="flex flex-col gap-2">
          <h3 className="text-lg font-bold">Split by setting and mass</h3>
          <p className="text-foam-300">Each part of the sample tested on its own against the matching model white dwarfs.</p>
          <Table caption="The sample's splits against the prediction" hideCaption columns={splitColumns} rows={splits} rowKey={(r) => r.label} stackOnNarrow />
        </div>
      )}
    </div>
  );
}

function TestSummary({ test }: { test: CountsComparison }) {
  const { observed } = test;
  const items = [
    {
      term: 'Observed',
      description: `${formatCount(observed.magnetic)} of ${formatCount(observed.total)} magnetic (${formatPercent(observed.fraction)}); 68% interval ${intervalText(observed.fraction, observed.interval68)}, 95% interval ${intervalText(observed.fraction, observed.interval95)} (Clopper–Pearson)`,
    },
    {
      term: 'Predicted',
      description: `${formatPercentWithError(test.predicted.value, test.predicted.se)} for ${test.label} (${formatCount(test.predictedCounts.magnetic)} of ${formatCount(test.predictedCounts.whiteDwarfs)} model white dwarfs)`,
    },
    { term: 'Exact binomial test', description: `${pText(test.pValue)}, two-sided` },
    { term: 'Significance', description: `${sigmaText(test.sigma)} (Gaussian-equivalent, two-sided)` },
  ];
  return (
    <div className="flex flex-col gap-3">
      <Verdict sigma={test.sigma}>{test.summary}</Verdict>
      <DescriptionList items={items} />
      {test.mcErrorMatters && (
        <Alert tone="info" message="The run’s Monte Carlo error is not negligible against the sample’s interval: a run with more systems would sharpen this test." />
      )}
      <p className="text-sm text-foam-400">Method: {test.method}.</p>
    </div>
  );
}

function Verdict({ sigma, children }: { sigma: number | null; children: ReactNode }) {
  const tone = sigma === null || sigma >= 3 ? 'danger' : sigma >= 2 ? 'warning' : 'success';
  return (
    <div className="flex flex-col gap-2 rounded-md border border-ink-600 bg-ink-900 p-4">
      <p className="text-lg font-bold text-foam-50">{children}</p>
      <p className="flex flex-wrap items-center gap-2 text-foam-300">
        <Badge tone={tone}>{sigma === null ? 'excluded' : sigma < 2 ? 'consistent' : sigma < 3 ? 'mild tension' : sigma < 5 ? 'tension' : 'excluded'}</Badge>
        {tensionInWords(sigma)}
      </p>
    </div>
  );
}

function FractionView({ constraint }: { constraint: FractionConstraint }) {
  const { published, predicted } = constraint;
  const items = [
    {
      term: 'Published',
      description: published.lowerBound
        ? `at least ${formatPercent(published.fraction)}`
        : published.sigma === null
          ? `about ${formatPercent(published.fraction)}, without an uncertainty`
          : `${formatPercent(published.fraction)} ± ${formatPercent(published.sigma)}`,
    },
    { term: 'Predicted', description: formatPercentWithError(predicted.value, predicted.se) },
    ...(constraint.pValue !== null && constraint.sigma !== null
      ? [
          { term: 'Gaussian test', description: `${pText(constraint.pValue)}, two-sided; z = ${constraint.z?.toFixed(2)}` },
          { term: 'Significance', description: sigmaText(constraint.sigma) },
        ]
      : []),
  ];
  return (
    <div className="flex flex-col gap-3">
      {constraint.sigma !== null ? (
        <Verdict sigma={constraint.sigma}>{constraint.summary}</Verdict>
      ) : (
        <Alert tone={constraint.consistent === false ? 'danger' : 'info'} message={<span className="font-bold">{constraint.summary}</span>} />
      )}
      <DescriptionList items={items} />
      <p className="text-sm text-foam-400">Method: {constraint.method}</p>
    </div>
  );
}

function MeanMassView({ meanMass }: { meanMass: NonNullable<RunComparison['meanMass']> }) {
  const side = (s: typeof meanMass.magnetic) =>
    `published ${s.publishedMsun} ± ${s.publishedSigma} Msun; predicted ${s.predictedMsun === null ? 'n/a' : `${s.predictedMsun.toFixed(3)} Msun (spread ${s.predictedSdMsun?.toFixed(3)} Msun)`}${s.z === null ? '' : `; z = ${s.z.toFixed(1)}`}`;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-lg font-bold">{meanMass.summary}</p>
      <DescriptionList
        items={[
          { term: 'Magnetic', description: side(meanMass.magnetic) },
          { term: 'Not magnetic', description: side(meanMass.nonMagnetic) },
        ]}
      />
      <p className="text-sm text-foam-400">Method: {meanMass.method}</p>
    </div>
  );
}

export function ComparisonBody({ comparison }: { comparison: RunComparison }) {
  const { sample } = comparison;
  return (
    <div className="flex flex-col gap-5">
      {sample.citation && <p className="text-sm text-foam-400">Source: {sample.citation}</p>}
      {sample.kind === 'counts' && <CountsView test={comparison.counts} splits={comparison.splits} />}
      {comparison.fraction && <FractionView constraint={comparison.fraction} />}
      {comparison.meanMass && <MeanMassView meanMass={comparison.meanMass} />}
      {comparison.caveats.length > 0 && (
        <div>
          <h3 className="font-bold">Caveats</h3>
          <ul className="mt-1 list-disc pl-6 text-foam-300">
            {comparison.caveats.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

export interface SampleComparisonCardProps {
  departmentId: string;
  runId: string;
  /** From the address bar (?sample=…); null picks the default. */
  sampleId: string | null;
  onSampleChange: (sampleId: string) => void;
  /** The test against the observed counts written into the scenario itself (result.comparison), when there are any. */
  scenarioTest?: CountsComparison | null;
}

/** The choice that stands for the scenario's own observed counts; "~" is never part of an id. */
export const SCENARIO_SAMPLE = '~scenario';

/** The run set against an observed sample or published constraint of the user's choice. */
export function SampleComparisonCard({ departmentId, runId, sampleId, onSampleChange, scenarioTest }: SampleComparisonCardProps) {
  const samples = useSampleChoices(departmentId);
  const list = samples.data?.samples ?? [];
  const chosen =
    sampleId === SCENARIO_SAMPLE && scenarioTest
      ? SCENARIO_SAMPLE
      : sampleId && list.some((s) => s.id === sampleId)
        ? sampleId
        : scenarioTest
          ? SCENARIO_SAMPLE
          : defaultSampleId(list);
  const comparison = useRunComparison(departmentId, runId, chosen === SCENARIO_SAMPLE ? null : chosen);
  const options = [
    ...(scenarioTest
      ? [{ value: SCENARIO_SAMPLE, label: `The scenario’s own observed sample (${formatCount(scenarioTest.observed.magnetic)} of ${formatCount(scenarioTest.observed.total)} magnetic)` }]
      : []),
    ...list.map((s) => ({ value: s.id, label: sampleOptionLabel(s) })),
  ];

  return (
    <Card title="Against an observed sample" description="The prediction tested against observed counts (exact binomial test) or a published value (Gaussian), with the run’s Monte Carlo error included.">
      {samples.isPending ? (
        <LoadingState label="Loading samples…" />
      ) : samples.isError ? (
        <ErrorState error={samples.error} title="The samples could not be loaded" onRetry={() => void samples.refetch()} retrying={samples.isFetching} />
      ) : options.length === 0 ? (
        <EmptyState title="No samples to compare with" headingLevel={3}>
          Record an observed sample (magnetic of total white dwarfs) on the Samples page, then come back.
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-5">
          <Select
            label="Sample"
            value={chosen ?? ''}
            options={options}
            onChange={(event) => onSampleChange(event.target.value)}
            hint="Your department’s samples and the library of published constraints."
            className="max-w-2xl"
          />
          {chosen === SCENARIO_SAMPLE && scenarioTest ? (
            <div className="flex flex-col gap-3">
              <p className="text-sm text-foam-400">From the scenario document’s “observed” counts, tested against all the run’s white dwarfs.</p>
              <CountsView test={scenarioTest} splits={[]} />
            </div>
          ) : (
            <QueryState query={comparison} loadingLabel="Testing the run against the sample…" errorTitle="The comparison could not be made">
              {(data) => <ComparisonBody comparison={data} />}
            </QueryState>
          )}
        </div>
      )}
    </Card>
  );
}
