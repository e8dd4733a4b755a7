import type { VisualizationSpec } from 'vega-embed';
import type { FitPosterior } from '../../../../shared/contracts/fits.ts';
import { chartInk, chartPalette } from '../../../components/ui/chart-palette.ts';
import { gridAxis, gridScale } from '../../../components/charts/marginal-spec.ts';

/** Posterior ramp: the theme's dark ground to the first palette colour (lightness rises with probability). */
const POSTERIOR_RAMP = ['#2b3d4a', chartPalette[0].hex];
/** The best grid point's marker: the palette's second colour, far from the ramp's hue. */
const BEST_POINT = chartPalette[1].hex;

/**
 * The joint posterior of parameters a and b (the others integrated out): exp(ln L − max) times the
 * priors, summed over the other axes with trapezoid weights, scaled to a peak of 1.
 */
export function pairDensity(post: FitPosterior, a: number, b: number): { x: number; y: number; p: number }[] {
  const sizes = post.parameters.map((p) => p.values.length);
  const strides = sizes.map((_, i) => sizes.slice(i + 1).reduce((s, n) => s * n, 1));
  const weights = post.parameters.map((p) => p.values.map((_, i, v) => ((i + 1 < v.length ? v[i + 1] : v[i]) - (i > 0 ? v[i - 1] : v[i])) / 2));
  const finite = post.logLikelihood.filter((x): x is number => x !== null && Number.isFinite(x));
  const peak = Math.max(...finite);
  const grid = new Array<number>(sizes[a] * sizes[b]).fill(0);
  post.logLikelihood.forEach((ll, node) => {
    if (ll === null || !Number.isFinite(ll)) return;
    let p = Math.exp(ll - peak);
    for (let k = 0; k < sizes.length; k++) {
      const i = Math.floor(node / strides[k]) % sizes[k];
      if (post.parameters[k].prior === 'logUniform') p /= post.parameters[k].values[i];
      if (k !== a && k !== b) p *= weights[k][i];
    }
    const ia = Math.floor(node / strides[a]) % sizes[a];
    const ib = Math.floor(node / strides[b]) % sizes[b];
    grid[ia * sizes[b] + ib] += p;
  });
  const top = Math.max(...grid);
  return grid.map((p, k) => ({ x: post.parameters[a].values[Math.floor(k / sizes[b])], y: post.parameters[b].values[k % sizes[b]], p: top > 0 ? p / top : 0 }));
}

/**
 * Each grid node's cell on the axis: from the midpoint with its lower neighbour to the midpoint
 * with its upper one (geometric midpoints on a log grid, where the cells then look equal), the
 * grid's ends closing the outer cells. These are the trapezoid rule's weights drawn as areas.
 */
export function cellEdges(values: readonly number[], log: boolean): [number, number][] {
  const mid = (a: number, b: number) => (log ? Math.sqrt(a * b) : (a + b) / 2);
  return values.map((v, i) => [i > 0 ? mid(values[i - 1], v) : v, i + 1 < values.length ? mid(v, values[i + 1]) : v]);
}

const axisTitle = (p: FitPosterior['parameters'][number]) => `${p.label}${p.unit ? ` (${p.unit})` : ''}`;

/**
 * One panel of the corner plot: the joint posterior of a pair as a heat map on the parameters'
 * own (log or linear) axes, each grid node filling its cell, and the best grid point marked.
 */
export function pairSpec(post: FitPosterior, a: number, b: number): VisualizationSpec {
  const pa = post.parameters[a];
  const pb = post.parameters[b];
  const xCells = cellEdges(pa.values, pa.scale === 'log');
  const yCells = cellEdges(pb.values, pb.scale === 'log');
  const rows = pairDensity(post, a, b).map((r, k) => {
    const [x, x2] = xCells[Math.floor(k / pb.values.length)];
    const [y, y2] = yCells[k % pb.values.length];
    return { ...r, x0: x, x1: x2, y0: y, y1: y2 };
  });
  const best = { x: post.bestPoint.values[pa.path], y: post.bestPoint.values[pb.path] };
  const x = { field: 'x0', type: 'quantitative' as const, axis: gridAxis(pa.values, pa.scale === 'log', axisTitle(pa)), scale: gridScale(pa.values, pa.scale === 'log') };
  const y = { field: 'y0', type: 'quantitative' as const, axis: gridAxis(pb.values, pb.scale === 'log', axisTitle(pb)), scale: gridScale(pb.values, pb.scale === 'log') };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 'container',
    height: 260,
    layer: [
      {
        data: { values: rows },
        mark: 'rect',
        encoding: {
          x,
          x2: { field: 'x1' },
          y,
          y2: { field: 'y1' },
          color: { field: 'p', type: 'quantitative', title: 'Posterior / peak', scale: { range: POSTERIOR_RAMP, domain: [0, 1] } },
          tooltip: [
            { field: 'x', title: pa.label, format: '.3~g' },
            { field: 'y', title: pb.label, format: '.3~g' },
            { field: 'p', title: 'Posterior / peak', format: '.3f' },
          ],
        },
      },
      {
        data: { values: [{ ...best, label: 'Best grid point' }] },
        mark: { type: 'point', shape: 'diamond', size: 140, filled: true, color: BEST_POINT, stroke: chartInk.background, strokeWidth: 1.5 },
        encoding: {
          x: { ...x, field: 'x' },
          y: { ...y, field: 'y' },
          tooltip: [
            { field: 'label', title: ' ' },
            { field: 'x', title: pa.label, format: '.3~g' },
            { field: 'y', title: pb.label, format: '.3~g' },
          ],
        },
      },
    ],
  } as VisualizationSpec;
}
