import type { ScenarioResult } from '../../../../shared/contracts/result.ts';
import { FATE_SERIES, presentSeries } from '../../../components/charts/result-series.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { fateMapSpec } from './fate-map-spec.ts';
import { formatCount } from './run-text.ts';

/** Where companions end up, on the plane of their mass and initial period. */
export function FateMapChart({ result }: { result: ScenarioResult }) {
  const fates = result.counts.companionFates;
  // Engine-1 results carry `merged`, engine-2 results `dissolved`: list what this result has.
  const series = presentSeries(FATE_SERIES, fates);
  const countOf = (key: (typeof series)[number]['key']) => fates[key] ?? 0;
  const total = series.reduce((sum, f) => sum + countOf(f.key), 0);
  const summary = series.map((f) => `${f.label}: ${formatCount(countOf(f.key))}`).join('; ');
  return (
    <Card
      title="Companion fates"
      description="Each cell is coloured by the most common fate of the companions that started there, and drawn fainter where few did (log scale of counts). Hover a cell for its counts."
    >
      {total === 0 ? (
        <p className="text-foam-300">No companions around the sampled white dwarfs, so there are no fates to map.</p>
      ) : (
        <>
          <VegaChart description={`Fate map of ${formatCount(total)} companions by companion mass and initial period. ${summary}.`} spec={fateMapSpec(result.bins.fateMap)} />
          <h3 className="mt-3 font-bold">Fates: colour key and companions of each</h3>
          <ul className="mt-1 flex flex-wrap gap-x-6 gap-y-1 text-sm text-foam-300">
            {series.map((f) => (
              <li key={f.key} className="flex items-center gap-2">
                <span aria-hidden="true" className="size-3 rounded-sm" style={{ background: f.colour }} />
                {f.label}: <span className="tabular-nums text-foam-50">{formatCount(countOf(f.key))}</span>
              </li>
            ))}
          </ul>
        </>
      )}
    </Card>
  );
}
