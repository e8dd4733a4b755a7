import type { VisualizationSpec } from 'vega-embed';
import { chartInk } from '../ui/chart-palette.ts';
import { COUNT_AXIS, decadeAxis } from './log-axis.ts';

/**
 * Histograms that were binned on the server (a run's white-dwarf mass and field bins), drawn as
 * step outlines so that two to four series can lie on one pair of axes and stay readable.
 */

export interface BinnedSeries {
  name: string;
  colour: string;
  /** One count per bin. */
  counts: readonly number[];
}

export interface BinnedChartInput {
  /** Bin edges, one more than there are bins; log10 of the quantity when `logX`. */
  edges: readonly number[];
  series: readonly BinnedSeries[];
  /** Axis title with its unit: "White-dwarf mass (Msun)". */
  xTitle: string;
  /** Unit for tooltips: "Msun", "MG". */
  xUnit: string;
  /** Edges are log10 values: the axis shows the quantity itself on a log scale. */
  logX?: boolean;
  /** Each series as its share of its own total per bin, so that shapes compare. */
  normalise?: boolean;
  /** What one bin is, for the y title: "0.02 Msun bin", "0.1 dex bin". */
  binLabel: string;
  /** What is counted, for the y title: "White dwarfs". */
  countNoun: string;
  /** Vertical rules at these edge-unit positions (the detection threshold). */
  markers?: readonly { at: number; label: string }[];
  /** Fill under the first series' outline (the others stay outlines, so no two fills overlap). */
  fill?: boolean;
  /** Leave out empty bins at both ends (keeping one), across all series. */
  trim?: boolean;
  height?: number;
}

/** Bins [start, end) worth showing: from one before the first non-empty bin of any series to one after the last. */
export function occupiedBinRange(series: readonly { counts: readonly number[] }[], binCount: number): [number, number] {
  let first = binCount;
  let last = -1;
  for (const s of series) {
    s.counts.forEach((c, i) => {
      if (c > 0) {
        first = Math.min(first, i);
        last = Math.max(last, i);
      }
    });
  }
  if (last < 0) return [0, binCount];
  return [Math.max(0, first - 1), Math.min(binCount, last + 2)];
}

/** Each value as its share of the total (all zeros when the total is zero). */
export function shares(counts: readonly number[]): number[] {
  const total = counts.reduce((a, b) => a + b, 0);
  return counts.map((c) => (total > 0 ? c / total : 0));
}

/** A tidy number for tooltips and tick-free labels: 0.56, 1.2e+3 → "1200", 0.0032. */
function tidy(x: number): string {
  return String(Number(x.toPrecision(3)));
}

export interface BinRow {
  series: string;
  /** Bin ends in axis units (the quantity itself, also for log bins). */
  lo: number;
  hi: number;
  mid: number;
  value: number;
  count: number;
  range: string;
}

/** One row per shown bin and series, with the value drawn (count or share). */
export function binRows(input: Pick<BinnedChartInput, 'edges' | 'series' | 'logX' | 'normalise' | 'xUnit'>, range: [number, number]): BinRow[] {
  const toAxis = (edge: number) => (input.logX ? 10 ** edge : edge);
  const rows: BinRow[] = [];
  for (const s of input.series) {
    const values = input.normalise ? shares(s.counts) : s.counts;
    for (let i = range[0]; i < range[1]; i++) {
      const lo = toAxis(input.edges[i]);
      const hi = toAxis(input.edges[i + 1]);
      const mid = input.logX ? 10 ** ((input.edges[i] + input.edges[i + 1]) / 2) : (lo + hi) / 2;
      rows.push({ series: s.name, lo, hi, mid, value: values[i], count: s.counts[i], range: `${tidy(lo)}–${tidy(hi)} ${input.xUnit}` });
    }
  }
  return rows;
}

/** The outline of a step histogram: up from zero at the first edge, across each bin, down to zero at the last. */
export function stepOutline(rows: readonly BinRow[]): { series: string; x: number; y: number; order: number }[] {
  if (rows.length === 0) return [];
  const series = rows[0].series;
  const points = [{ series, x: rows[0].lo, y: 0, order: 0 }];
  rows.forEach((r, i) => {
    points.push({ series, x: r.lo, y: r.value, order: 2 * i + 1 }, { series, x: r.hi, y: r.value, order: 2 * i + 2 });
  });
  points.push({ series, x: rows[rows.length - 1].hi, y: 0, order: 2 * rows.length + 1 });
  return points;
}

/** The points of a filled step histogram: each bin's left edge, then the last bin's right edge (for step-after). */
export function stepFill(rows: readonly BinRow[]): { series: string; x: number; y: number }[] {
  if (rows.length === 0) return [];
  const last = rows[rows.length - 1];
  return [...rows.map((r) => ({ series: r.series, x: r.lo, y: r.value })), { series: last.series, x: last.hi, y: last.value }];
}

export function binnedChartSpec(input: BinnedChartInput): VisualizationSpec {
  const binCount = input.edges.length - 1;
  const range: [number, number] = input.trim === false ? [0, binCount] : occupiedBinRange(input.series, binCount);
  // Markers (a threshold) stay in view even where no bin is filled.
  for (const m of input.markers ?? []) {
    const i = input.edges.findIndex((e, k) => k < binCount && m.at >= e && m.at < input.edges[k + 1]);
    if (i >= 0) range.splice(0, 2, Math.min(range[0], i), Math.max(range[1], i + 1));
  }
  const rows = binRows(input, range);
  const outline = input.series.flatMap((s) => stepOutline(rows.filter((r) => r.series === s.name)));
  const toAxis = (edge: number) => (input.logX ? 10 ** edge : edge);
  const domain = [toAxis(input.edges[range[0]]), toAxis(input.edges[range[1]])];
  const yTitle = input.normalise
    ? `Share of each series per ${input.binLabel} (%)`
    : `${input.countNoun} per ${input.binLabel} (count)`;
  const colour = {
    field: 'series',
    type: 'nominal' as const,
    title: null,
    // One entry per line, so that long run names are not cut short.
    legend: { columns: input.series.length > 2 ? 1 : undefined, labelLimit: 360 },
    scale: { domain: input.series.map((s) => s.name), range: input.series.map((s) => s.colour) },
  };
  const x = {
    field: 'x',
    type: 'quantitative' as const,
    title: input.xTitle,
    scale: input.logX ? { type: 'log' as const, domain, nice: false } : { type: 'linear' as const, domain, nice: false, zero: false },
    axis: input.logX ? decadeAxis(input.edges[range[0]], input.edges[range[1]]) : { format: '~g', labelOverlap: 'greedy' as const },
  };
  const y = {
    field: 'y',
    type: 'quantitative' as const,
    title: yTitle,
    axis: input.normalise ? { format: '.0%' } : COUNT_AXIS,
  };
  const markers = (input.markers ?? []).map((m) => ({ x: toAxis(m.at), label: m.label }));

  return {
    height: input.height ?? 260,
    layer: [
      // One fill layer with a fixed colour (an encoded one would merge into the legend and switch it off),
      // under the first series only: two translucent fills over each other mix into a third colour
      // (orange over pale blue reads as brown) that belongs to neither series.
      ...(input.fill
        ? input.series.slice(0, 1).map((s) => ({
            // Areas are drawn in x order, so they get the bins' own step points rather than the outline.
            data: { values: stepFill(rows.filter((r) => r.series === s.name)) },
            mark: { type: 'area' as const, opacity: 0.22, interpolate: 'step-after' as const, color: s.colour },
            encoding: { x, y: { ...y, stack: null } },
          }))
        : []),
      {
        data: { values: outline },
        mark: { type: 'line' as const, strokeWidth: 2.5, interpolate: 'linear' as const },
        encoding: { x, y, order: { field: 'order', type: 'quantitative' as const }, color: colour },
      },
      {
        // Invisible targets at bin centres carry the tooltips.
        data: { values: rows },
        mark: { type: 'point' as const, opacity: 0, size: 220, filled: true },
        encoding: {
          x: { ...x, field: 'mid' },
          y: { ...y, field: 'value' },
          tooltip: [
            { field: 'series', title: 'Series' },
            { field: 'range', title: 'Bin' },
            { field: 'count', title: 'Count', format: ',' },
            ...(input.normalise ? [{ field: 'value', title: 'Share', format: '.2%' }] : []),
          ],
        },
      },
      ...(markers.length
        ? [
            {
              data: { values: markers },
              mark: { type: 'rule' as const, strokeDash: [6, 4], strokeWidth: 2, color: chartInk.text },
              encoding: { x: { field: 'x', type: 'quantitative' as const } },
            },
            {
              data: { values: markers },
              mark: { type: 'text' as const, align: 'left' as const, baseline: 'top' as const, dx: 6, y: 4, color: chartInk.text, fontSize: 14 },
              encoding: { x: { field: 'x', type: 'quantitative' as const }, text: { field: 'label' } },
            },
          ]
        : []),
    ],
  } as VisualizationSpec;
}
