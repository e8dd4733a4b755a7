import type { VisualizationSpec } from 'vega-embed';
import type { SweepDetail } from '../../../../shared/contracts/sweeps.ts';
import { formatPercentWithError, formatSignificant } from '../../../../shared/engine/stats/format.ts';
import { titleLines } from '../../../components/charts/response-curve-spec.ts';
import { chartInk, chartPalette } from '../../../components/ui/chart-palette.ts';

/**
 * A 2-D sweep as a grid of cells coloured by the predicted fraction, each cell labelled with
 * the fraction and its Monte Carlo error. With a counts sample, cells whose prediction the
 * sample does not reject at 95% get a thick outline and those allowed at 68% a filled corner mark.
 */

/**
 * Tidefield's sequential ramp for fractions, dark to light, from the theme and the categorical
 * palette (iris → reef → lantern → primrose). Lightness rises monotonically along it, so the
 * order of the cells reads the same under every colour-vision deficiency.
 */
export const FRACTION_RAMP = ['#2b3d4a', chartPalette[2].hex, chartPalette[0].hex, chartPalette[1].hex, chartPalette[6].hex] as const;

export interface HeatCell {
  x: string;
  y: string;
  xValue: number;
  yValue: number;
  fraction: number | null;
  /** The fraction and its error on two lines (a narrow cell), or the point's status. */
  lines: string[];
  text: string;
  status: string;
  p: string;
  /** 'allowed68' | 'allowed95' | 'rejected' | 'untested' */
  verdict: string;
  /** Dark text on light cells, light text on dark ones. */
  ink: 'dark' | 'light';
}

const tidy = (x: number) => String(Number(x.toPrecision(4)));

/** The cells of the grid: one per point, with the words drawn in it. */
export function heatCells(detail: Pick<SweepDetail, 'points'>, fractionDomain: [number, number]): HeatCell[] {
  const [lo, hi] = fractionDomain;
  return detail.points.map((p) => {
    const done = p.status === 'succeeded' && p.fraction !== null;
    const position = done && hi > lo ? (p.fraction! - lo) / (hi - lo) : 0;
    const text = done ? (p.fractionSe !== null ? formatPercentWithError(p.fraction!, p.fractionSe) : `${formatSignificant(100 * p.fraction!, 3)}%`) : p.status;
    const verdict = p.pValue === null ? 'untested' : p.consistent68 ? 'allowed68' : p.consistent95 ? 'allowed95' : 'rejected';
    return {
      x: tidy(p.values[0]),
      y: tidy(p.values[1]),
      xValue: p.values[0],
      yValue: p.values[1],
      fraction: done ? p.fraction : null,
      lines: text.split(' ± ').map((part, i) => (i === 0 ? part : `± ${part}`)),
      text,
      status: p.status,
      p: p.pValue === null ? '—' : formatSignificant(p.pValue, 2),
      verdict,
      // The lighter half of the ramp (lantern, primrose) carries dark text.
      ink: done && position > 0.55 ? 'dark' : 'light',
    };
  });
}

export interface HeatmapInput {
  detail: Pick<SweepDetail, 'points' | 'axes'>;
  xTitle: string;
  yTitle: string;
}

export function sweepHeatmapSpec({ detail, xTitle, yTitle }: HeatmapInput): VisualizationSpec {
  const fractions = detail.points.filter((p) => p.status === 'succeeded' && p.fraction !== null).map((p) => p.fraction!);
  const domain: [number, number] = fractions.length ? [Math.min(...fractions), Math.max(...fractions)] : [0, 1];
  if (domain[0] === domain[1]) domain[1] = domain[0] + 1e-9;
  const cells = heatCells(detail, domain);
  const xSort = [...detail.axes[0].values].sort((a, b) => a - b).map(tidy);
  // Rows from the largest value at the top, as on a plot with the y axis going up.
  const ySort = [...detail.axes[1].values].sort((a, b) => b - a).map(tidy);
  const x = { field: 'x', type: 'ordinal' as const, title: titleLines(xTitle), sort: xSort, axis: { labelAngle: 0 } };
  const y = { field: 'y', type: 'ordinal' as const, title: titleLines(yTitle), sort: ySort };
  const tooltip = [
    { field: 'x', title: xTitle },
    { field: 'y', title: yTitle },
    { field: 'text', title: 'Predicted ± MC error' },
    { field: 'p', title: 'p against the sample' },
  ];
  const cellSize = Math.max(44, Math.min(72, Math.floor(640 / Math.max(xSort.length, 1))));
  return {
    // A few columns share the card's width (a phone too); many get fixed cells and the chart scrolls.
    ...(xSort.length > 6 ? { width: { step: cellSize * 1.6 } } : {}),
    // A fixed height (rows × cell) rather than a step: vega-lite warns about "fit-y" for a step
    // height beside a container width.
    height: cellSize * ySort.length,
    data: { values: cells },
    encoding: { x, y },
    layer: [
      {
        mark: { type: 'rect', stroke: chartInk.background, strokeWidth: 2 },
        encoding: {
          color: {
            field: 'fraction',
            type: 'quantitative',
            title: ['Predicted magnetic fraction', '(% of white dwarfs)'],
            scale: { domain, range: [...FRACTION_RAMP], interpolate: 'lab' },
            legend: { format: '.1~%', orient: 'bottom', direction: 'horizontal', gradientLength: 260, titleLimit: 420 },
            // A point without a result yet is left unfilled (dashed outline below), so that it cannot
            // be read as a fraction near 0%, whose colour is the ramp's first.
            condition: { test: 'datum.fraction === null', value: chartInk.background },
          },
          tooltip,
        },
      },
      {
        transform: [{ filter: 'datum.fraction === null' }],
        mark: { type: 'rect', fillOpacity: 0, stroke: chartInk.axis, strokeWidth: 1.5, strokeDash: [5, 4] },
        encoding: { tooltip },
      },
      {
        transform: [{ filter: "datum.verdict === 'allowed68' || datum.verdict === 'allowed95'" }],
        mark: { type: 'rect', fillOpacity: 0, stroke: chartInk.text, strokeWidth: 3.5 },
        encoding: { tooltip },
      },
      {
        transform: [{ filter: "datum.verdict === 'allowed68'" }],
        mark: { type: 'text', text: '●', align: 'center', baseline: 'middle', dy: -cellSize * 0.34, fontSize: 11 },
        encoding: { color: { condition: { test: "datum.ink === 'dark'", value: chartInk.background }, value: chartInk.text } },
      },
      {
        mark: { type: 'text', fontSize: 13, fontWeight: 700, lineHeight: 16 },
        encoding: {
          text: { field: 'lines' },
          color: { condition: { test: "datum.ink === 'dark'", value: chartInk.background }, value: chartInk.text },
          tooltip,
        },
      },
    ],
  } as VisualizationSpec;
}
