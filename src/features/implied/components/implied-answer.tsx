import { Link } from 'react-router-dom';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { clopperPearson } from '../../../../shared/engine/stats/clopper-pearson.ts';
import { formatAtResolution, formatPercent, formatPercentWithError } from '../../../../shared/engine/stats/format.ts';
import { ChartKey } from '../../../components/charts/chart-key.tsx';
import { responseCurveKey, responseCurveSpec } from '../../../components/charts/response-curve-spec.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { ApiError } from '../../../lib/api-client.ts';
import { useImpliedOccurrence, type ImpliedAnswerResponse } from '../api/get-implied-occurrence.ts';
import { useImpliedRun } from '../api/get-implied-run.ts';
import { curveEnds, etaText, impliedSentence, occurrenceRows, scaledOccurrence, type OccurrenceRow } from './implied-text.ts';
import { useScenarioChoice } from '../../../lib/api/scenario-choices.ts';
import { ProgressBar } from '../../../components/ui/progress-bar.tsx';

const X_TITLE = 'Companion-occurrence multiplier m (dimensionless)';
const Y_TITLE = 'Predicted magnetic fraction (% of white dwarfs)';
/** The server's "68%" is one Gaussian σ. */
const CONFIDENCE_68 = 0.6827;

export interface ImpliedAnswerProps {
  departmentId: string;
  runId: string;
  sampleId: string;
  /** The sample counts only part of the white dwarfs (its setting), while the curve is over all of them. */
  settingCaveat?: string | null;
}

/** Follows the run that answers the question, then states and draws the answer. */
export function ImpliedAnswer({ departmentId, runId, sampleId, settingCaveat }: ImpliedAnswerProps) {
  const run = useImpliedRun(departmentId, runId);
  const succeeded = run.data?.status === 'succeeded';
  const answer = useImpliedOccurrence(departmentId, runId, sampleId, succeeded);

  return (
    <Card title="The answer" description="From one seeded run: the magnetic fraction is tallied at every multiplier with the same random numbers, so the curve is exact for that run.">
      <QueryState query={run} loadingLabel="Loading the run…" errorTitle="The run could not be loaded">
        {(r) => {
          if (r.status === 'queued' || r.status === 'running') return <RunProgress run={r} />;
          if (r.status === 'failed') return <ErrorState title="The run failed" error={new ApiError({ status: 200, code: 'run_failed', message: r.error ?? 'The run stopped without saying why.' })} />;
          if (r.status === 'cancelled') return <Alert tone="info" message="The run was cancelled before it finished, so there is no answer. Ask again above." />;
          if (answer.isPending) return <LoadingState label="Reading the answer…" />;
          if (answer.isError) return <ErrorState title="The answer could not be computed" error={answer.error} onRetry={() => void answer.refetch()} retrying={answer.isFetching} />;
          return <AnswerBody departmentId={departmentId} run={r} answer={answer.data} settingCaveat={settingCaveat} />;
        }}
      </QueryState>
    </Card>
  );
}

function RunProgress({ run }: { run: RunSummary }) {
  const percent = Math.round(100 * run.progress);
  const eta = etaText(run.etaSeconds);
  const words = run.status === 'queued' ? 'Queued: the run starts when a worker is free.' : `Running: ${percent}% of ${run.chunkCount} chunks${eta ? `, ${eta}` : ''}.`;
  return (
    <div className="flex flex-col gap-3">
      <p className="font-bold text-foam-50" aria-live="polite">
        {words}
      </p>
      <ProgressBar label="Run progress" value={percent} max={100} valueText={words} />
      <p className="text-sm text-foam-400">
        {run.systems.toLocaleString('en-US')} systems of “{run.scenarioName}”, seed “{run.seed}”. This page follows the run; you may also leave and come back through its link.
      </p>
    </div>
  );
}

function AnswerBody({ departmentId, run, answer, settingCaveat }: { departmentId: string; run: RunSummary; answer: ImpliedAnswerResponse; settingCaveat?: string | null }) {
  const { magnetic: k, total: n } = answer.sample;
  const ci68 = clopperPearson(k, n, CONFIDENCE_68);
  const ci95 = clopperPearson(k, n, 0.95);
  const band = { name: answer.sample.name, fraction: k / n, interval68: [ci68.lower, ci68.upper] as [number, number], interval95: [ci95.lower, ci95.upper] as [number, number] };
  const allowed = { level68: answer.interval68, level95: answer.interval95 };
  const widest = answer.interval95 ?? answer.interval68;
  const m = (x: number) => formatAtResolution(x, widest ? widest[1] - widest[0] : 0);
  const marker = { x: answer.bestFit, label: `best fit ${m(answer.bestFit)}×` };
  const points = answer.curve.map((p) => ({ x: p.multiplier, fraction: p.fraction }));
  const spec = responseCurveSpec({ points, xTitle: X_TITLE, yTitle: Y_TITLE, band, allowed, marker });
  const [, top] = curveEnds(answer.curve);
  const sentence = impliedSentence(answer);
  const fraction = run.fraction !== null && run.fractionSe !== null ? formatPercentWithError(run.fraction, run.fractionSe) : null;

  return (
    <div className="flex flex-col gap-5">
      <p className="rounded-md border-l-4 border-lantern-400 bg-ink-900 px-4 py-3 text-lg font-bold text-foam-50" aria-live="polite">
        {sentence}
      </p>
      {settingCaveat && <Alert tone="info" message={settingCaveat} />}
      <DescriptionList
        items={[
          { term: 'Observed', description: `${k.toLocaleString('en-US')} magnetic of ${n.toLocaleString('en-US')} white dwarfs (${formatPercent(k / n)}) in “${answer.sample.name}”` },
          {
            term: 'Run',
            description: (
              <>
                <Link to={paths.runs.detail.getHref(run.id)}>{run.scenarioName}</Link>, version {run.scenarioVersion}: {run.systems.toLocaleString('en-US')} systems, seed “{run.seed}”
                {run.whiteDwarfs !== null ? `, ${run.whiteDwarfs.toLocaleString('en-US')} white dwarfs` : ''}
                {fraction ? `; at the scenario’s own m = ${answer.runMultiplier} it predicts ${fraction}` : ''}.
              </>
            ),
          },
        ]}
      />
      <div>
        <VegaChart
          spec={spec}
          description={`The predicted magnetic fraction as the companion-occurrence multiplier goes from 0 to ${m(top)}, against the observed ${formatPercent(k / n)} of ${answer.sample.name} with its 68% and 95% intervals. ${sentence}`}
        />
        <ChartKey items={responseCurveKey({ points, band, allowed, marker, predictionLabel: 'Predicted fraction at multiplier m (one run, common random numbers)', parameterLabel: 'Multiplier' })} />
      </div>
      <MultiplierRows departmentId={departmentId} scenarioId={run.scenarioId} answer={answer} format={m} />
      <p className="text-sm text-foam-400">
        <span className="font-bold text-foam-300">Method. </span>
        {answer.method.charAt(0).toUpperCase() + answer.method.slice(1)}.
      </p>
    </div>
  );
}

/** What m multiplies: every row of the scenario's occurrence table, shown at the best fit and the 68% ends. */
function MultiplierRows({ departmentId, scenarioId, answer, format }: { departmentId: string; scenarioId: string; answer: ImpliedAnswerResponse; format: (x: number) => string }) {
  const scenario = useScenarioChoice(departmentId, scenarioId);
  const rows = occurrenceRows(scenario.data?.resolved);
  const lead = (
    <p className="text-foam-300">
      The multiplier m scales the occurrence of <strong className="text-foam-50">every row</strong> of the scenario’s companion table at once (planets, brown dwarfs and stellar companions alike): m = 1 is the table as it stands, m = 0 a population without companions. The curve stops where the most common row would reach 100%.
    </p>
  );
  if (scenario.isPending || scenario.isError || rows === null) {
    return (
      <section aria-label="What the multiplier multiplies" className="flex flex-col gap-2">
        <h3 className="font-bold text-foam-50">What the multiplier multiplies</h3>
        {lead}
        {rows === null && scenario.data && <p className="text-foam-300">This scenario uses a stored occurrence table; open the table to see its rows.</p>}
      </section>
    );
  }
  const i68 = answer.interval68;
  type Row = OccurrenceRow & { key: string };
  const value = (text: string) => <span className="whitespace-nowrap tabular-nums">{text}</span>;
  const columns: TableColumn<Row>[] = [
    { id: 'label', header: 'Row', rowHeader: true, cell: (r) => r.label },
    { id: 'table', header: 'In the table (m = 1)', stackedLabel: 'm = 1', align: 'end', cell: (r) => value(scaledOccurrence(r, 1)) },
    { id: 'best', header: `At the best fit (m = ${format(answer.bestFit)})`, stackedLabel: `Best fit, m = ${format(answer.bestFit)}`, align: 'end', cell: (r) => value(scaledOccurrence(r, answer.bestFit)) },
    ...(i68
      ? [
          {
            id: 'range',
            header: `Allowed at 68% (m = ${format(i68[0])} to ${format(i68[1])})`,
            stackedLabel: 'Allowed at 68%',
            align: 'end',
            cell: (r: Row) => value(`${scaledOccurrence(r, i68[0])} to ${scaledOccurrence(r, i68[1])}`),
          } as TableColumn<Row>,
        ]
      : []),
  ];
  return (
    <section aria-label="What the multiplier multiplies" className="flex flex-col gap-3">
      <h3 className="font-bold text-foam-50">What the multiplier multiplies</h3>
      {lead}
      <Table caption="Fraction of stars hosting each kind of companion, as the multiplier scales it" hideCaption columns={columns} rows={rows.map((r, i) => ({ ...r, key: String(i) }))} rowKey={(r) => r.key} stackOnNarrow />
      <p className="text-sm text-foam-400">Each value is the fraction of stars that host one companion of that kind, from the scenario’s current version.</p>
    </section>
  );
}
