import type { ResultFraction, ScenarioResult } from '../../../../shared/contracts/result.ts';
import { fractionChartSpec } from '../../../components/charts/fraction-chart-spec.ts';
import { CHANNEL_SERIES, presentSeries, SETTING_SERIES, type ResultSeries } from '../../../components/charts/result-series.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { fractionWithError } from './run-headline.tsx';
import { formatCount } from './run-text.ts';

interface SplitRow {
  key: string;
  label: string;
  fraction: ResultFraction;
}

/** The counts behind each point, which the chart does not show. */
function SplitCounts({ rows, caption }: { rows: SplitRow[]; caption: string }) {
  return (
    <dl aria-label={caption} className="mt-4 flex flex-col gap-1 border-t border-ink-700 pt-3 text-sm">
      {rows.map((r) => (
        <div key={r.key} className="flex flex-wrap justify-between gap-x-4">
          <dt className="text-foam-300">{r.label}</dt>
          <dd className="tabular-nums">
            {fractionWithError(r.fraction)} · {formatCount(r.fraction.k)} of {formatCount(r.fraction.n)}
          </dd>
        </div>
      ))}
    </dl>
  );
}

function rowsOf<K extends string>(series: readonly ResultSeries<K>[], fractions: Partial<Record<K, ResultFraction>>): SplitRow[] {
  // Engine-1 results have a core-merger channel and no close-survivor one: show what the result has.
  return presentSeries(series, fractions).map((s) => ({ key: s.key, label: s.short, fraction: fractions[s.key]! }));
}

function SplitChart({ rows, series, valueTitle, description }: { rows: SplitRow[]; series: readonly ResultSeries<string>[]; valueTitle: string; description: string }) {
  const shown = rows.filter((r) => r.fraction.value !== null && r.fraction.se !== null);
  if (shown.length === 0) return <p className="text-foam-300">No white dwarfs in any group.</p>;
  const short = (key: string) => series.find((s) => s.key === key)!.short;
  return (
    <VegaChart
      description={`${description} ${shown.map((r) => `${r.label}: ${fractionWithError(r.fraction)}.`).join(' ')}`}
      spec={fractionChartSpec({
        points: shown.map((r) => ({ category: short(r.key), value: r.fraction.value!, se: r.fraction.se! })),
        categoryColours: series.map((s) => ({ name: s.short, colour: s.colour })),
        valueTitle,
      })}
    />
  );
}

/** The magnetic fraction split by setting (within each setting) and by channel (of all white dwarfs), each with its Monte Carlo error. */
export function RunSplitCharts({ result }: { result: ScenarioResult }) {
  const bySetting = rowsOf(SETTING_SERIES, result.fractionBySetting);
  const byChannel = rowsOf(CHANNEL_SERIES, result.fractionByChannel);
  return (
    <>
      <Card title="By setting" description="Magnetic white dwarfs among those of each setting today. Thick bars: ±1 Monte Carlo error; thin: ±2.">
        <SplitChart
          rows={bySetting}
          series={SETTING_SERIES}
          valueTitle="Magnetic fraction (%)"
          description="Magnetic fraction within each setting, with Monte Carlo errors."
        />
        <SplitCounts rows={bySetting} caption="Magnetic of the setting’s white dwarfs" />
      </Card>
      <Card title="By channel" description="Magnetic white dwarfs by the channel that gave them their strongest field, as a share of all white dwarfs: the channels add up to the headline fraction.">
        <SplitChart
          rows={byChannel}
          series={CHANNEL_SERIES}
          valueTitle="Share of all white dwarfs (%)"
          description="Share of all white dwarfs made magnetic by each channel, with Monte Carlo errors."
        />
        <SplitCounts rows={byChannel} caption="Magnetic of all white dwarfs, by channel" />
      </Card>
    </>
  );
}
