import type { ConstraintEvaluation } from '../../../../shared/contracts/constraints.ts';
import { VegaChart } from '../../../components/charts/vega-chart.tsx';

const AXIS: Record<NonNullable<ConstraintEvaluation['overlay']>['chart'], string> = {
  wdMass: 'White-dwarf mass (Msun)',
  logField: 'log10 field (MG)',
  coolingAge: 'log10 cooling age (Gyr)',
  postCommonEnvelopePeriod: 'log10 post-CE period (days)',
};

/** The observed list over the predicted histogram (scaled to the same number), on the model's bins. */
export function ObservedOverlayChart({ evaluation }: { evaluation: ConstraintEvaluation }) {
  const overlay = evaluation.overlay;
  if (!overlay) return null;
  const rows = overlay.observed.flatMap((observed, i) => [
    { lo: overlay.edges[i], hi: overlay.edges[i + 1], count: observed, series: 'observed' },
    { lo: overlay.edges[i], hi: overlay.edges[i + 1], count: overlay.predicted[i], series: 'predicted (scaled to the observed number)' },
  ]);
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v5.json',
    width: 'container',
    height: 220,
    data: { values: rows },
    mark: { type: 'rect', opacity: 0.6 },
    encoding: {
      x: { field: 'lo', type: 'quantitative', title: AXIS[overlay.chart] },
      x2: { field: 'hi' },
      y: { field: 'count', type: 'quantitative', title: 'White dwarfs per bin' },
      color: { field: 'series', type: 'nominal', title: null },
    },
  } as const;
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="font-bold">{evaluation.label}: observed over predicted</figcaption>
      <VegaChart description={`${evaluation.label}: the observed values binned on the model's bins, over the predicted histogram scaled to the same number. ${evaluation.verdict}`} spec={spec} />
    </figure>
  );
}
