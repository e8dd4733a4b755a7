import type { VisualizationSpec } from 'vega-embed';
import { formatPercentWithError, formatSignificant } from '../../../shared/engine/stats/format.ts';
import { chartInk, seriesColour } from '../ui/chart-palette.ts';
import type { ChartKeyItem } from './chart-key.tsx';

/**
 * A predicted fraction against one parameter (a sweep's curve, the implied-occurrence response),
 * set against an observed sample: the sample's 68% and 95% intervals as horizontal bands, the
 * parameter range the sample allows as vertical bands, and the prediction as a line with
 * ±1 se (thick) and ±2 se (thin) error bars where the points carry a Monte Carlo error.
 */

export interface ResponsePoint {
  x: number;
  /** Predicted fraction (0–1). */
  fraction: number;
  /** Monte Carlo standard error of the fraction; omit for a curve drawn without error bars. */
  se?: number;
  /** Extra tooltip line ("p = 0.42 against the sample"). */
  note?: string;
}

export interface ObservedBand {
  /** The sample's name, for tooltips. */
  name: string;
  fraction: number;
  interval68: readonly [number, number] | null;
  interval95: readonly [number, number] | null;
}

export interface AllowedRange {
  level68: readonly [number, number] | null;
  level95: readonly [number, number] | null;
}

export interface ResponseCurveInput {
  points: readonly ResponsePoint[];
  /** Axis title with its unit: "Common-envelope efficiency α_CE (dimensionless)". */
  xTitle: string;
  /** Axis title with its unit: "Predicted magnetic fraction (% of white dwarfs)". */
  yTitle: string;
  band?: ObservedBand | null;
  allowed?: AllowedRange | null;
  /** A vertical marker (the best fit, the scenario's own value). */
  marker?: { x: number; label: string } | null;
  /** Log x axis (positive values only). */
  logX?: boolean;
  /** Draw every point as a dot (sweeps); a dense curve is a line only. */
  showPoints?: boolean;
  height?: number;
}

/** The colours the chart and its key share, so that the key under a chart always matches it. */
export const RESPONSE_CURVE_COLOURS = {
  prediction: seriesColour(0),
  observed: seriesColour(4),
  allowed: seriesColour(1),
  marker: chartInk.text,
} as const;

/** Opacity of the 95% and 68% shadings; the 68% one is drawn over the 95% one and so looks darker. */
export const SHADE_OPACITY = { level95: 0.16, level68: 0.2 } as const;
/** How opaque each level looks where both are drawn (the key shows this). */
const SEEN_OPACITY = { level95: SHADE_OPACITY.level95, level68: 1 - (1 - SHADE_OPACITY.level95) * (1 - SHADE_OPACITY.level68) };

const clip = (x: number) => Math.min(1, Math.max(0, x));

export interface ResponseRow {
  x: number;
  fraction: number;
  lo1: number;
  hi1: number;
  lo2: number;
  hi2: number;
  text: string;
  note: string;
}

/** The drawn points, sorted by x, with error-bar ends clipped to [0, 1]. */
export function responseRows(points: readonly ResponsePoint[]): ResponseRow[] {
  return [...points]
    .sort((a, b) => a.x - b.x)
    .map((p) => {
      const se = p.se ?? 0;
      return {
        x: p.x,
        fraction: p.fraction,
        lo1: clip(p.fraction - se),
        hi1: clip(p.fraction + se),
        lo2: clip(p.fraction - 2 * se),
        hi2: clip(p.fraction + 2 * se),
        text: p.se === undefined ? `${formatSignificant(100 * p.fraction, 3)}%` : formatPercentWithError(p.fraction, p.se),
        note: p.note ?? '',
      };
    });
}

/** A long axis title on two lines, broken before its unit, so that it fits a phone's width. */
export function titleLines(title: string): string | string[] {
  const at = title.lastIndexOf(' (');
  return title.length > 32 && at > 0 ? [title.slice(0, at), title.slice(at + 1)] : title;
}

/** Whether a log x axis reads better: positive values spanning at least a factor of ten. */
export function prefersLogAxis(xs: readonly number[]): boolean {
  if (xs.length < 2 || xs.some((x) => !(x > 0))) return false;
  return Math.max(...xs) / Math.min(...xs) >= 10;
}

export function responseCurveSpec(input: ResponseCurveInput): VisualizationSpec {
  const rows = responseRows(input.points);
  const withErrors = input.points.some((p) => p.se !== undefined);
  const x = {
    field: 'x',
    type: 'quantitative' as const,
    title: titleLines(input.xTitle),
    // A log axis is not rounded out to whole decades, which would squeeze a short grid into a corner.
    scale: input.logX ? { type: 'log' as const, nice: false, padding: 16 } : { type: 'linear' as const, zero: false, nice: true },
    // On a narrow screen a log axis offers more ticks than fit: those that would touch are left out.
    axis: { format: '~g', labelOverlap: 'greedy' as const, labelSeparation: 6 },
  };
  const y = (field: string) => ({
    field,
    type: 'quantitative' as const,
    title: input.yTitle,
    axis: { format: '.1~%' },
    scale: { zero: false, nice: true },
  });

  const bands = input.band
    ? [
        ...(input.band.interval95 ? [{ lo: input.band.interval95[0], hi: input.band.interval95[1], level: '95%' }] : []),
        ...(input.band.interval68 ? [{ lo: input.band.interval68[0], hi: input.band.interval68[1], level: '68%' }] : []),
      ]
    : [];
  const allowed = input.allowed
    ? [
        ...(input.allowed.level95 ? [{ lo: input.allowed.level95[0], hi: input.allowed.level95[1], level: '95%' }] : []),
        ...(input.allowed.level68 ? [{ lo: input.allowed.level68[0], hi: input.allowed.level68[1], level: '68%' }] : []),
      ]
    : [];
  const opacityByLevel = {
    field: 'level',
    type: 'nominal' as const,
    legend: null,
    scale: { domain: ['95%', '68%'], range: [SHADE_OPACITY.level95, SHADE_OPACITY.level68] },
  };

  const layers: unknown[] = [];
  // A range of one grid value has no width: it is drawn as a broad line instead.
  const points = allowed.filter((a) => a.lo === a.hi);
  if (points.length > 0) {
    layers.push({
      data: { values: points },
      mark: { type: 'rule', strokeWidth: 8, color: RESPONSE_CURVE_COLOURS.allowed, opacity: 0.45 },
      encoding: { x: { ...x, field: 'lo' }, tooltip: [{ field: 'level', title: 'Allowed only at' }, { field: 'lo', title: 'value', format: '~g' }] },
    });
  }
  if (allowed.length > 0) {
    layers.push({
      data: { values: allowed },
      mark: { type: 'rect', color: RESPONSE_CURVE_COLOURS.allowed },
      encoding: {
        x: { ...x, field: 'lo' },
        x2: { field: 'hi' },
        opacity: opacityByLevel,
        tooltip: [{ field: 'level', title: 'Allowed range at' }, { field: 'lo', title: 'from', format: '~g' }, { field: 'hi', title: 'to', format: '~g' }],
      },
    });
  }
  // The observed value is drawn whenever there is a sample, also a quoted fraction without intervals.
  if (input.band) {
    if (bands.length > 0) {
      layers.push({
        data: { values: bands },
        mark: { type: 'rect', color: RESPONSE_CURVE_COLOURS.observed },
        encoding: {
          y: y('lo'),
          y2: { field: 'hi' },
          opacity: opacityByLevel,
          tooltip: [{ field: 'level', title: 'Observed interval' }, { field: 'lo', title: 'from', format: '.2%' }, { field: 'hi', title: 'to', format: '.2%' }],
        },
      });
    }
    layers.push({
      data: { values: [{ fraction: input.band.fraction, name: input.band.name }] },
      mark: { type: 'rule', strokeDash: [8, 5], strokeWidth: 2, color: RESPONSE_CURVE_COLOURS.observed },
      encoding: { y: y('fraction'), tooltip: [{ field: 'name', title: 'Observed' }, { field: 'fraction', title: 'fraction', format: '.2%' }] },
    });
  }
  if (input.marker) {
    layers.push(
      {
        data: { values: [input.marker] },
        mark: { type: 'rule', strokeDash: [2, 4], strokeWidth: 2, color: RESPONSE_CURVE_COLOURS.marker },
        encoding: { x: { ...x, field: 'x' } },
      },
      {
        data: { values: [input.marker] },
        mark: { type: 'text', align: 'left', baseline: 'top', dx: 6, y: 4, color: chartInk.text, fontSize: 14 },
        encoding: { x: { ...x, field: 'x' }, text: { field: 'label' } },
      },
    );
  }
  const tooltip = [
    { field: 'x', title: input.xTitle, format: '~g' },
    { field: 'text', title: withErrors ? 'Predicted ± MC error' : 'Predicted' },
    ...(rows.some((r) => r.note) ? [{ field: 'note', title: 'Against the sample' }] : []),
  ];
  layers.push({
    data: { values: rows },
    mark: { type: 'line', strokeWidth: 2.5, color: RESPONSE_CURVE_COLOURS.prediction, interpolate: 'linear' },
    encoding: { x, y: y('fraction') },
  });
  if (withErrors) {
    layers.push(
      {
        data: { values: rows },
        mark: { type: 'rule', strokeWidth: 1.5, color: RESPONSE_CURVE_COLOURS.prediction },
        encoding: { x, y: y('lo2'), y2: { field: 'hi2' } },
      },
      {
        data: { values: rows },
        mark: { type: 'rule', strokeWidth: 5, color: RESPONSE_CURVE_COLOURS.prediction },
        encoding: { x, y: y('lo1'), y2: { field: 'hi1' } },
      },
    );
  }
  layers.push({
    data: { values: rows },
    // Invisible on a dense curve, but still the target of its tooltips.
    mark: {
      type: 'point',
      filled: true,
      size: input.showPoints ? 90 : 160,
      opacity: input.showPoints ? 1 : 0,
      color: RESPONSE_CURVE_COLOURS.prediction,
      stroke: chartInk.background,
      strokeWidth: 1.5,
    },
    encoding: { x, y: y('fraction'), tooltip },
  });

  return {
    height: input.height ?? 300,
    // One x scale over the curve and the allowed range (a band may lie beyond the points).
    resolve: { scale: { x: 'shared', y: 'shared' } },
    layer: layers,
  } as VisualizationSpec;
}

/** The key under a response curve, in the chart's own colours and shadings. */
export function responseCurveKey(input: Pick<ResponseCurveInput, 'band' | 'allowed' | 'marker' | 'points'> & { predictionLabel: string; parameterLabel: string }): ChartKeyItem[] {
  const items: ChartKeyItem[] = [];
  const withErrors = input.points.some((p) => p.se !== undefined);
  items.push({
    label: withErrors ? `${input.predictionLabel} (bars: ±1 and ±2 Monte Carlo standard errors)` : input.predictionLabel,
    colour: RESPONSE_CURVE_COLOURS.prediction,
    look: 'line',
  });
  if (input.band) {
    items.push({ label: `Observed: ${input.band.name}`, colour: RESPONSE_CURVE_COLOURS.observed, look: 'dashed' });
    if (input.band.interval68) items.push({ label: 'Observed 68% interval (Clopper–Pearson)', colour: RESPONSE_CURVE_COLOURS.observed, look: 'area', opacity: SEEN_OPACITY.level68 });
    if (input.band.interval95) items.push({ label: 'Observed 95% interval', colour: RESPONSE_CURVE_COLOURS.observed, look: 'area', opacity: SEEN_OPACITY.level95 });
  }
  if (input.allowed?.level68) items.push({ label: `${input.parameterLabel} allowed at 68%`, colour: RESPONSE_CURVE_COLOURS.allowed, look: 'area', opacity: SEEN_OPACITY.level68 });
  if (input.allowed?.level95) items.push({ label: `${input.parameterLabel} allowed at 95%`, colour: RESPONSE_CURVE_COLOURS.allowed, look: 'area', opacity: SEEN_OPACITY.level95 });
  if (input.marker) items.push({ label: input.marker.label, colour: RESPONSE_CURVE_COLOURS.marker, look: 'dotted' });
  return items;
}
