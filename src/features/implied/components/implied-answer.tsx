import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { IMPLIED_CONFIDENCE_LABEL, IMPLIED_CREDIBLE_LABEL, IMPLIED_DIFFERENCE, type ImpliedCredible, type ImpliedOccurrenceAnswer } from '../../../../shared/contracts/implied-occurrence.ts';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { clopperPearson } from '../../../../shared/engine/stats/clopper-pearson.ts';
import { formatAtResolution, formatPercent, formatPercentWithError } from '../../../../shared/engine/stats/format.ts';
import { ChartKey } from '../../../components/charts/chart-key.tsx';
import { marginalSpec } from '../../../components/charts/marginal-spec.ts';
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
import { useImpliedAnswer } from '../api/get-implied-answer.ts';
import { useImpliedRun } from '../api/get-implied-run.ts';
import { cancelledQuestionText, curveEnds, etaText, impliedSentence, occurrenceRows, scaledOccurrence, type ImpliedAnswer as ImpliedRange, type OccurrenceRow } from './implied-text.ts';
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

/** What the answer body shows, from the fit (both answers) or from an earlier run (the confidence range only). */
interface AnswerView {
  sample: { name: string; magnetic: number; total: number };
  confidence: ImpliedRange & { method: string };
  credible: ImpliedCredible | null;
  /** Where the answer comes from: the fit (or run), its scenario and size. */
  source: ReactNode;
  scenarioId: string | null;
  methods: string | null;
}

/** Follows the fit that answers the question (with `progressActions` while it computes, e.g. a way to cancel), then states both answers side by side. */
export function ImpliedFitAnswer({ departmentId, fitId, progressActions }: { departmentId: string; fitId: string; progressActions?: (answer: ImpliedOccurrenceAnswer) => ReactNode }) {
  const query = useImpliedAnswer(departmentId, fitId);
  return (
    <Card title="The answer" description="The one-parameter fit over the multiplier: every grid value of m from the same draws, in one pass. It answers twice, with two different quantities.">
      <QueryState query={query} loadingLabel="Loading the question…" errorTitle="The question could not be loaded">
        {(a) => {
          if (a.status === 'queued' || a.status === 'running') return <FitProgress answer={a} actions={progressActions?.(a)} />;
          if (a.status === 'cancelled') return <Alert tone="info" message={<span data-testid="implied-cancelled">{cancelledQuestionText(a)}</span>} />;
          if (!a.confidence) return <ErrorState title="The fit failed" error={new ApiError({ status: 200, code: 'fit_failed', message: a.error ?? 'The fit stopped without saying why.' })} />;
          return <AnswerBody departmentId={departmentId} view={fitView(a, a.confidence)} />;
        }}
      </QueryState>
    </Card>
  );
}

function fitView(a: ImpliedOccurrenceAnswer, confidence: NonNullable<ImpliedOccurrenceAnswer['confidence']>): AnswerView {
  const own = fractionOnCurve(confidence.curve, a.scenarioMultiplier);
  return {
    sample: a.sample,
    confidence,
    credible: a.credible,
    scenarioId: a.scenarioId,
    methods: a.methods,
    source: (
      <>
        <Link to={paths.fits.detail.getHref(a.fitId)}>Fit of “{a.scenarioName}”</Link>
        {a.scenarioVersion !== null ? `, version ${a.scenarioVersion}` : ''}: {a.pointCount} values of m × {a.systems.toLocaleString('en-US')} systems, seed “{a.seed}”
        {a.whiteDwarfs !== null ? `, ${a.whiteDwarfs.toLocaleString('en-US')} white dwarfs` : ''}; at the scenario’s own m = {a.scenarioMultiplier} it predicts {formatPercent(own)}.
      </>
    ),
  };
}

/** The predicted fraction at m, linear between the curve's points. */
function fractionOnCurve(curve: ImpliedRange['curve'], m: number): number {
  const j = curve.findIndex((p) => p.multiplier >= m);
  if (j <= 0) return curve[Math.max(0, j)]?.fraction ?? 0;
  const [a, b] = [curve[j - 1], curve[j]];
  return a.fraction + ((b.fraction - a.fraction) * (m - a.multiplier)) / (b.multiplier - a.multiplier);
}

function FitProgress({ answer, actions }: { answer: ImpliedOccurrenceAnswer; actions?: ReactNode }) {
  const percent = Math.round(100 * answer.progress);
  const words = answer.status === 'queued' ? 'Queued: the fit starts when a worker is free.' : `Running: ${percent}% of the draws done for all ${answer.pointCount} values of m.`;
  const about = `${answer.systems.toLocaleString('en-US')} systems of “${answer.scenarioName}” per value of m, seed “${answer.seed}”. This page follows the fit; you may also leave and come back through its link.`;
  return <ProgressBlock label="Fit progress" percent={percent} words={words} about={about} actions={actions} />;
}

/** An answer from before implied occurrence was a fit: one run, the confidence range only. */
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
          return <AnswerBody departmentId={departmentId} view={runView(r, answer.data)} settingCaveat={settingCaveat} />;
        }}
      </QueryState>
    </Card>
  );
}

function RunProgress({ run }: { run: RunSummary }) {
  const percent = Math.round(100 * run.progress);
  const eta = etaText(run.etaSeconds);
  const words = run.status === 'queued' ? 'Queued: the run starts when a worker is free.' : `Running: ${percent}% of ${run.chunkCount} chunks${eta ? `, ${eta}` : ''}.`;
  const about = `${run.systems.toLocaleString('en-US')} systems of “${run.scenarioName}”, seed “${run.seed}”. This page follows the run; you may also leave and come back through its link.`;
  return <ProgressBlock label="Run progress" percent={percent} words={words} about={about} />;
}

/** A queued or running job: what is happening (announced politely), the bar, and what is being computed. */
function ProgressBlock({ label, percent, words, about, actions }: { label: string; percent: number; words: string; about: string; actions?: ReactNode }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="font-bold text-foam-50" aria-live="polite">
        {words}
      </p>
      <ProgressBar label={label} value={percent} max={100} valueText={words} />
      <p className="text-sm text-foam-400">{about}</p>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </div>
  );
}

function runView(run: RunSummary, answer: ImpliedAnswerResponse): AnswerView {
  const fraction = run.fraction !== null && run.fractionSe !== null ? formatPercentWithError(run.fraction, run.fractionSe) : null;
  return {
    sample: answer.sample,
    confidence: answer,
    credible: null,
    scenarioId: run.scenarioId,
    methods: null,
    source: (
      <>
        <Link to={paths.runs.detail.getHref(run.id)}>{run.scenarioName}</Link>, version {run.scenarioVersion}: {run.systems.toLocaleString('en-US')} systems, seed “{run.seed}”
        {run.whiteDwarfs !== null ? `, ${run.whiteDwarfs.toLocaleString('en-US')} white dwarfs` : ''}
        {fraction ? `; at the scenario’s own m = ${answer.runMultiplier} it predicts ${fraction}` : ''}.
      </>
    ),
  };
}

function AnswerBody({ departmentId, view, settingCaveat }: { departmentId: string; view: AnswerView; settingCaveat?: string | null }) {
  const { confidence, credible } = view;
  const { magnetic: k, total: n } = view.sample;
  const ci68 = clopperPearson(k, n, CONFIDENCE_68);
  const ci95 = clopperPearson(k, n, 0.95);
  const band = { name: view.sample.name, fraction: k / n, interval68: [ci68.lower, ci68.upper] as [number, number], interval95: [ci95.lower, ci95.upper] as [number, number] };
  const allowed = { level68: confidence.interval68, level95: confidence.interval95 };
  const widest = confidence.interval95 ?? confidence.interval68;
  const m = (x: number) => formatAtResolution(x, widest ? widest[1] - widest[0] : 0);
  const marker = { x: confidence.bestFit, label: `best fit ${m(confidence.bestFit)}×` };
  const points = confidence.curve.map((p) => ({ x: p.multiplier, fraction: p.fraction }));
  const spec = responseCurveSpec({ points, xTitle: X_TITLE, yTitle: Y_TITLE, band, allowed, marker });
  const [, top] = curveEnds(confidence.curve);
  const sentence = impliedSentence(confidence);

  return (
    <div className="flex flex-col gap-5">
      {settingCaveat && <Alert tone="info" message={settingCaveat} />}
      <DescriptionList
        items={[
          { term: 'Observed', description: `${k.toLocaleString('en-US')} magnetic of ${n.toLocaleString('en-US')} white dwarfs (${formatPercent(k / n)}) in “${view.sample.name}”` },
          { term: 'Computed by', description: view.source },
        ]}
      />
      <section aria-label={IMPLIED_CONFIDENCE_LABEL} className="flex flex-col gap-3">
        <h3 className="font-bold text-foam-50">{IMPLIED_CONFIDENCE_LABEL}</h3>
        <p className="rounded-md border-l-4 border-lantern-400 bg-ink-900 px-4 py-3 text-lg font-bold text-foam-50" aria-live="polite">
          {sentence}
        </p>
        <div>
          <VegaChart
            spec={spec}
            description={`The predicted magnetic fraction as the companion-occurrence multiplier goes from 0 to ${m(top)}, against the observed ${formatPercent(k / n)} of ${view.sample.name} with its 68% and 95% intervals. ${sentence}`}
          />
          <ChartKey items={responseCurveKey({ points, band, allowed, marker, predictionLabel: 'Predicted fraction at multiplier m (one pass, common random numbers)', parameterLabel: 'Multiplier' })} />
        </div>
        <p className="text-sm text-foam-400">
          <span className="font-bold text-foam-300">Method. </span>
          {confidence.method.charAt(0).toUpperCase() + confidence.method.slice(1)}.
        </p>
      </section>
      {credible && <CredibleSection credible={credible} confidence={confidence} format={m} />}
      <MultiplierRows departmentId={departmentId} scenarioId={view.scenarioId} answer={confidence} format={m} />
      {view.methods && (
        <section aria-label="Methods text" className="flex flex-col gap-2">
          <h3 className="font-bold text-foam-50">Methods text</h3>
          <pre className="whitespace-pre-wrap text-sm text-foam-300">{view.methods}</pre>
        </section>
      )}
    </div>
  );
}

/** The fit's posterior over m with its prior, and both answers side by side. */
function CredibleSection({ credible, confidence, format }: { credible: ImpliedCredible; confidence: ImpliedRange; format: (x: number) => string }) {
  const range = (r: readonly [number, number] | null) => (r ? `${format(r[0])} to ${format(r[1])}` : 'none');
  const rows = [
    { key: '68', what: '68%', confidence: range(confidence.interval68), credible: range(credible.interval68) },
    { key: '95', what: '95%', confidence: range(confidence.interval95), credible: range(credible.interval95) },
    { key: 'best', what: 'Single value', confidence: `best fit ${format(confidence.bestFit)}`, credible: `posterior peak ${format(credible.peak)}` },
  ];
  type Row = (typeof rows)[number];
  const columns: TableColumn<Row>[] = [
    { id: 'what', header: 'Level', rowHeader: true, cell: (r) => r.what },
    { id: 'confidence', header: IMPLIED_CONFIDENCE_LABEL, stackedLabel: 'Confidence range', align: 'end', cell: (r) => <span className="tabular-nums">{r.confidence}</span> },
    { id: 'credible', header: IMPLIED_CREDIBLE_LABEL, stackedLabel: 'Credible interval', align: 'end', cell: (r) => <span className="tabular-nums">{r.credible}</span> },
  ];
  const interval = { best: credible.peak, lo68: credible.interval68[0], hi68: credible.interval68[1], lo95: credible.interval95[0], hi95: credible.interval95[1] };
  return (
    <section aria-label={IMPLIED_CREDIBLE_LABEL} className="flex flex-col gap-3">
      <h3 className="font-bold text-foam-50">{IMPLIED_CREDIBLE_LABEL}</h3>
      <p className="text-foam-50" data-testid="implied-credible">{credible.summary}</p>
      <p className="text-sm text-foam-300">Prior: {credible.priorText}.</p>
      <VegaChart
        spec={marginalSpec(credible.marginal, interval, 'Companion-occurrence multiplier m (dimensionless)', false)}
        description={`Posterior density of the multiplier m under a prior ${credible.priorText}, with the 68% and 95% credible intervals shaded. ${credible.summary}`}
      />
      {credible.warnings.map((w) => (
        <Alert key={w} tone="info" message={w} />
      ))}
      <Table caption="Both answers side by side" columns={columns} rows={rows} rowKey={(r) => r.key} stackOnNarrow />
      <p className="text-sm text-foam-400">{IMPLIED_DIFFERENCE}</p>
      <p className="text-sm text-foam-400">
        <span className="font-bold text-foam-300">Method. </span>
        {credible.method.charAt(0).toUpperCase() + credible.method.slice(1)}.
      </p>
    </section>
  );
}

/** What m multiplies: every row of the scenario's occurrence table, shown at the best fit and the 68% ends. */
function MultiplierRows({ departmentId, scenarioId, answer, format }: { departmentId: string; scenarioId: string | null; answer: ImpliedRange; format: (x: number) => string }) {
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
