import type { VisualizationSpec } from 'vega-embed';
import { formatPercent, formatPercentWithError } from '../../../../shared/engine/stats/format.ts';
import { chartInk, seriesColour } from '../../../components/ui/chart-palette.ts';

export interface ComparedRow {
  label: string;
  observed: { magnetic: number; total: number; fraction: number; interval68: [number, number]; interval95: [number, number] };
  predicted: { value: number; se: number };
}

export const OBSERVED_KIND = 'Observed, 68% and 95% intervals';
export const PREDICTED_KIND = 'Predicted, ±1 and ±2 MC errors';

/** Sentence case for axis labels: "all white dwarfs" → "All white dwarfs". */
export const capitalised = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * A short axis label from the server's description of a (sub)sample: "white dwarfs with a wide
 * (never engulfed) companion" → "With a wide companion", "white dwarfs of 0.5–0.7 Msun" → "0.5–0.7 Msun".
 */
export function shortSampleLabel(label: string): string {
  const plain = label.replace(/\s*\([^)]*\)/g, '').trim();
  const short = plain
    .replace(/^(all|single) white dwarfs$/i, '$1')
    .replace(/^white dwarfs with /i, 'with ')
    .replace(/^white dwarfs of /i, '');
  return capitalised(short);
}

export function comparisonRows(rows: readonly ComparedRow[]) {
  const clip = (x: number) => Math.min(1, Math.max(0, x));
  return rows.flatMap((r) => {
    const label = shortSampleLabel(r.label);
    const { value, se } = r.predicted;
    return [
      {
        label,
        kind: OBSERVED_KIND,
        value: r.observed.fraction,
        inner: r.observed.interval68,
        outer: r.observed.interval95,
        text: `${r.observed.magnetic} of ${r.observed.total} (${formatPercent(r.observed.fraction)})`,
      },
      { label, kind: PREDICTED_KIND, value, inner: [clip(value - se), clip(value + se)], outer: [clip(value - 2 * se), clip(value + 2 * se)], text: formatPercentWithError(value, se) },
    ].map((row) => ({ ...row, innerLo: row.inner[0], innerHi: row.inner[1], outerLo: row.outer[0], outerHi: row.outer[1] }));
  });
}

/** Observed fractions with their intervals beside the predicted fractions with their errors, one row per (sub)sample. */
export function comparisonChartSpec(rows: readonly ComparedRow[]): VisualizationSpec {
  const values = comparisonRows(rows);
  const colour = {
    field: 'kind',
    type: 'nominal',
    title: null,
    legend: { labelLimit: 320 },
    scale: { domain: [OBSERVED_KIND, PREDICTED_KIND], range: [seriesColour(4), seriesColour(1)] },
  };
  const x = (field: string) => ({ field, type: 'quantitative', title: 'Magnetic fraction (% of white dwarfs)', axis: { format: '.2~%', tickCount: 6, labelOverlap: 'greedy' }, scale: { zero: true, nice: true } });
  return {
    autosize: { type: 'fit-x', contains: 'padding' },
    // 24 px per sub-row (observed, predicted), as a fixed height: vega-lite warns about
    // "fit-y" for a step height even when only fit-x is asked for.
    height: 24 * values.length,
    data: { values },
    encoding: {
      y: { field: 'label', type: 'nominal', title: null, sort: null, axis: { labelLimit: 150 } },
      yOffset: { field: 'kind', type: 'nominal', sort: [OBSERVED_KIND, PREDICTED_KIND] },
      color: colour,
    },
    layer: [
      { mark: { type: 'rule', strokeWidth: 1.5 }, encoding: { x: x('outerLo'), x2: { field: 'outerHi' } } },
      { mark: { type: 'rule', strokeWidth: 6 }, encoding: { x: x('innerLo'), x2: { field: 'innerHi' } } },
      {
        mark: { type: 'point', filled: true, size: 120, stroke: chartInk.background, strokeWidth: 1.5 },
        encoding: {
          x: x('value'),
          shape: { field: 'kind', type: 'nominal', scale: { domain: [OBSERVED_KIND, PREDICTED_KIND], range: ['circle', 'diamond'] }, title: null },
          tooltip: [
            { field: 'label', title: 'White dwarfs' },
            { field: 'kind', title: 'What' },
            { field: 'text', title: 'Value' },
          ],
        },
      },
    ],
  } as VisualizationSpec;
}
