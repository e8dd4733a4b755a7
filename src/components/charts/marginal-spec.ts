import type { VisualizationSpec } from 'vega-embed';
import { chartInk, seriesColour } from '../ui/chart-palette.ts';

/** A marginal posterior on grid nodes (density per unit of the parameter). */
export interface Marginal {
  values: number[];
  density: number[];
}
/** Its central credible intervals and the node where it peaks. */
export interface Interval {
  best: number;
  lo68: number;
  hi68: number;
  lo95: number;
  hi95: number;
}

/** The density at x, linear between grid nodes (the same reading the server's quantiles use). */
function densityAt(m: Marginal, x: number): number {
  const i = m.values.findIndex((v) => v >= x);
  if (i <= 0) return m.density[0];
  const t = (x - m.values[i - 1]) / (m.values[i] - m.values[i - 1]);
  return m.density[i - 1] * (1 - t) + m.density[i] * t;
}

/** Rows of the marginal curve with the interval ends inserted, each tagged with the bands it lies in. */
export function marginalRows(m: Marginal, iv: Interval): { x: number; density: number; in68: boolean; in95: boolean }[] {
  const xs = [...new Set([...m.values, iv.lo68, iv.hi68, iv.lo95, iv.hi95])].sort((a, b) => a - b);
  return xs.map((x) => ({ x, density: densityAt(m, x), in68: x >= iv.lo68 && x <= iv.hi68, in95: x >= iv.lo95 && x <= iv.hi95 }));
}

/**
 * The scale of a parameter's axis: the grid's own range (no rounding out to "nice" values, which
 * on a log axis can add a decade of empty plot), so the corner plot's panels of one parameter line up.
 */
export function gridScale(values: readonly number[], log: boolean) {
  const domain = [values[0], values[values.length - 1]];
  return log ? { type: 'log' as const, domain, nice: false } : { type: 'linear' as const, domain, nice: false, zero: false };
}

/**
 * Tick values of a log axis over [lo, hi]: 1, 2 and 5 times the powers of ten inside it, and the
 * grid's ends unless a tick lies within a factor 1.5 of them (so no two labels touch). Vega's own
 * log ticks label every integer multiple of a decade (crowding "0.02 0.03 0.04") and can drop
 * the domain's ends by rounding.
 */
export function logTicks(lo: number, hi: number): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    for (const m of [1, 2, 5]) {
      const t = Number((m * 10 ** e).toPrecision(12));
      if (t >= lo * (1 - 1e-9) && t <= hi * (1 + 1e-9)) ticks.push(t);
    }
  }
  const far = (end: number) => ticks.every((t) => Math.abs(Math.log(t / end)) > Math.log(1.5));
  return [...(far(lo) ? [lo] : []), ...ticks, ...(far(hi) ? [hi] : [])];
}

/** A parameter's axis: its title, and on a log grid the ticks of logTicks (labels never overlap either way). */
export function gridAxis(values: readonly number[], log: boolean, title: string) {
  return { title, labelOverlap: 'greedy' as const, format: '~g', ...(log ? { values: logTicks(values[0], values[values.length - 1]) } : {}) };
}

/** A marginal posterior: the curve, with the central 95% interval shaded light and the 68% one darker. */
export function marginalSpec(m: Marginal, iv: Interval, title: string, log: boolean): VisualizationSpec {
  const rows = marginalRows(m, iv);
  const x = { field: 'x', type: 'quantitative' as const, axis: gridAxis(m.values, log, title), scale: gridScale(m.values, log) };
  const y = { field: 'density', type: 'quantitative' as const, title: 'Posterior density' };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 'container',
    height: 180,
    data: { values: rows },
    layer: [
      { transform: [{ filter: 'datum.in95' }], mark: { type: 'area', color: seriesColour(0), opacity: 0.25 }, encoding: { x, y } },
      { transform: [{ filter: 'datum.in68' }], mark: { type: 'area', color: seriesColour(0), opacity: 0.55 }, encoding: { x, y } },
      { mark: { type: 'line', color: chartInk.text }, encoding: { x, y } },
      { data: { values: [{ x: iv.best }] }, mark: { type: 'rule', color: chartInk.mutedText, strokeDash: [4, 3] }, encoding: { x: { field: 'x', type: 'quantitative' } } },
    ],
  } as VisualizationSpec;
}
