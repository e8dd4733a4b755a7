import type { VisualizationSpec } from 'vega-embed';
import type { FitPosterior } from '../../../../shared/contracts/fits.ts';
import { chartPalette } from '../../../components/ui/chart-palette.ts';

/** Posterior ramp: the theme's dark ground to the first palette colour (lightness rises with probability). */
const POSTERIOR_RAMP = ['#2b3d4a', chartPalette[0].hex];

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

const tidy = (x: number) => String(Number(x.toPrecision(3)));

/** One panel of the corner plot: the joint posterior of a pair as a heat map (grid values as cells). */
export function pairSpec(post: FitPosterior, a: number, b: number): VisualizationSpec {
  const rows = pairDensity(post, a, b).map((r) => ({ ...r, xs: tidy(r.x), ys: tidy(r.y) }));
  const pa = post.parameters[a];
  const pb = post.parameters[b];
  const axisTitle = (p: typeof pa) => `${p.label}${p.unit ? ` (${p.unit})` : ''}`;
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: 'container',
    height: 220,
    data: { values: rows },
    mark: 'rect',
    encoding: {
      x: { field: 'xs', type: 'ordinal', title: axisTitle(pa), sort: pa.values.map(tidy) },
      y: { field: 'ys', type: 'ordinal', title: axisTitle(pb), sort: [...pb.values.map(tidy)].reverse() },
      color: { field: 'p', type: 'quantitative', title: 'Posterior / peak', scale: { range: POSTERIOR_RAMP, domain: [0, 1] } },
      tooltip: [
        { field: 'x', title: pa.label },
        { field: 'y', title: pb.label },
        { field: 'p', title: 'Posterior / peak', format: '.3f' },
      ],
    },
  } as VisualizationSpec;
}
