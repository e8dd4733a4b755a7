import type { VisualizationSpec } from 'vega-embed';
import { formatPercentWithError } from '../../../shared/engine/stats/format.ts';
import { chartInk } from '../ui/chart-palette.ts';

/**
 * Monte Carlo fractions as points with their standard errors: a thick bar for ±1 se and a thin
 * one for ±2 se, one row per category, several runs side by side within a row.
 */

export interface FractionPoint {
  category: string;
  /** Which run or group the point belongs to (colour); omit for a single series. */
  series?: string;
  value: number;
  se: number;
}

export interface FractionChartInput {
  points: readonly FractionPoint[];
  /** Axis title with its unit: "Magnetic fraction (% of white dwarfs in the setting)". */
  valueTitle: string;
  /** Rows in this order (default: first appearance). */
  categories?: readonly string[];
  /** Colours of the series, in legend order; a single series uses `colour`. */
  series?: readonly { name: string; colour: string }[];
  colour?: string;
  /** One colour per category instead (the axis names them, so no legend). */
  categoryColours?: readonly { name: string; colour: string }[];
  /** Print "9.6% ± 0.11%" beside each point (single series only). */
  labels?: boolean;
  /** Height per category row in px (per run within a row when there are several). */
  rowHeight?: number;
}

export interface FractionRow extends FractionPoint {
  series: string;
  lo1: number;
  hi1: number;
  lo2: number;
  hi2: number;
  text: string;
}

/** The drawn rows: error-bar ends clipped to [0, 1], and the value with its error as text. */
export function fractionRows(points: readonly FractionPoint[]): FractionRow[] {
  const clip = (x: number) => Math.min(1, Math.max(0, x));
  return points.map((p) => ({
    ...p,
    series: p.series ?? '',
    lo1: clip(p.value - p.se),
    hi1: clip(p.value + p.se),
    lo2: clip(p.value - 2 * p.se),
    hi2: clip(p.value + 2 * p.se),
    text: formatPercentWithError(p.value, p.se),
  }));
}

export function fractionChartSpec(input: FractionChartInput): VisualizationSpec {
  const rows = fractionRows(input.points);
  const categories = input.categories ?? [...new Set(rows.map((r) => r.category))];
  const grouped = Boolean(input.series && input.series.length > 1);
  // With several runs the step is per run within a row (yOffset), else per row.
  const rowHeight = input.rowHeight ?? (grouped ? 20 : 44);
  const y = { field: 'category', type: 'nominal' as const, title: null, sort: categories, axis: { labelLimit: 220 } };
  const yOffset = grouped ? { yOffset: { field: 'series', type: 'nominal' as const, sort: input.series!.map((s) => s.name) } } : {};
  const colour = grouped
    ? {
        color: {
          field: 'series',
          type: 'nominal' as const,
          title: null,
          legend: { columns: 1, labelLimit: 360 },
          scale: { domain: input.series!.map((s) => s.name), range: input.series!.map((s) => s.colour) },
        },
      }
    : {};
  const byCategory = !grouped && input.categoryColours
    ? {
        color: {
          field: 'category',
          type: 'nominal' as const,
          legend: null,
          scale: { domain: input.categoryColours.map((c) => c.name), range: input.categoryColours.map((c) => c.colour) },
        },
      }
    : null;
  const fixed = grouped || byCategory ? {} : { color: input.colour ?? input.series?.[0]?.colour ?? chartInk.text };
  const encodedColour = grouped ? colour : (byCategory ?? {});
  const tooltip = [
    { field: 'category', title: 'Group' },
    ...(grouped ? [{ field: 'series', title: 'Run' }] : []),
    { field: 'text', title: 'Fraction ± MC error' },
  ];
  // Room on the right for the printed values, which would otherwise run off the chart.
  const largest = Math.max(0, ...rows.map((r) => r.hi2));
  const top = Math.min(1, largest * (input.labels && !grouped ? 1.6 : 1.08)) || 0.01;
  const x = (field: string) => ({
    field,
    type: 'quantitative' as const,
    title: input.valueTitle,
    axis: { format: '.2~%', tickCount: 4, labelOverlap: 'greedy' as const },
    scale: { domain: [0, top], nice: true },
  });

  return {
    // The height follows the rows; only the width fits the container. A fixed height (rows ×
    // step) rather than a step size: vega-lite warns about "fit-y" for a step height even when
    // only fit-x is asked for.
    autosize: { type: 'fit-x', contains: 'padding' },
    height: rowHeight * categories.length * (grouped ? input.series!.length : 1),
    data: { values: rows },
    encoding: { y, ...yOffset },
    layer: [
      { mark: { type: 'rule', strokeWidth: 1.5, ...fixed }, encoding: { x: x('lo2'), x2: { field: 'hi2' }, ...encodedColour } },
      { mark: { type: 'rule', strokeWidth: 5, ...fixed }, encoding: { x: x('lo1'), x2: { field: 'hi1' }, ...encodedColour } },
      {
        mark: { type: 'point', filled: true, size: 110, stroke: chartInk.background, strokeWidth: 1.5, ...fixed },
        encoding: { x: x('value'), ...encodedColour, tooltip },
      },
      ...(input.labels && !grouped
        ? [
            {
              mark: { type: 'text', align: 'left', dx: 10, color: chartInk.mutedText, fontSize: 14 },
              encoding: { x: { field: 'hi2', type: 'quantitative' }, text: { field: 'text' } },
            },
          ]
        : []),
    ],
  } as VisualizationSpec;
}
