import { describe, expect, it } from 'vitest';
import type { FitPosterior } from '../../../../shared/contracts/fits.ts';
import { cellEdges, pairSpec } from './fit-chart-specs.ts';
import { gridScale, logTicks } from '../../../components/charts/marginal-spec.ts';

/** A 20 × 20 posterior as a large fit returns it (only the fields the corner plot reads are filled). */
function posterior20(): FitPosterior {
  const logGrid = (lo: number, hi: number) => Array.from({ length: 20 }, (_, i) => lo * (hi / lo) ** (i / 19));
  const multiplier = logGrid(0.1, 4);
  const alpha = logGrid(0.01, 2);
  // A Gaussian bump in the logs, peaked at node (7, 3); row-major, the last parameter fastest.
  const logLikelihood = multiplier.flatMap((_, i) => alpha.map((_, j) => -((i - 7) ** 2 + (j - 3) ** 2) / 4));
  return {
    parameters: [
      { path: 'companions.multiplier', label: 'Occurrence multiplier', unit: '', values: multiplier, scale: 'log', prior: 'logUniform' },
      { path: 'envelope.alpha', label: 'Common-envelope efficiency α_CE', unit: '', values: alpha, scale: 'log', prior: 'logUniform' },
    ],
    logLikelihood,
    bestPoint: { values: { 'companions.multiplier': multiplier[7], 'envelope.alpha': alpha[3] } },
  } as unknown as FitPosterior;
}

interface Layer {
  data: { values: Record<string, number>[] };
  mark: string | { type: string };
  encoding: Record<string, { field?: string; scale?: unknown; title?: string }>;
}

describe('corner plot of a 20 × 20 fit', () => {
  // Common practice, no source: the trapezoid rule gives the end nodes of a grid half a step and
  // the inner nodes a whole one, so the cells of a linear grid tile [min, max] with those widths.
  it('cells of a linear grid are the trapezoid rule’s intervals', () => {
    expect(cellEdges([0, 1, 2, 3], false)).toEqual([
      [0, 0.5],
      [0.5, 1.5],
      [1.5, 2.5],
      [2.5, 3],
    ]);
  });

  // Common practice, no source: the midpoint of 1 and 100 in log10 is 10 (their geometric mean).
  it('cells of a log grid meet at geometric midpoints', () => {
    const cells = cellEdges([1, 100, 10_000], true);
    expect(cells[0]).toEqual([1, 10]);
    expect(cells[1][0]).toBeCloseTo(10, 12);
    expect(cells[1][1]).toBeCloseTo(1000, 9);
    expect(cells[2]).toEqual([cells[1][1], 10_000]);
  });

  it('axes span exactly the grid, not rounded out to whole decades', () => {
    expect(gridScale([0.1, 1, 4], true)).toEqual({ type: 'log', domain: [0.1, 4], nice: false });
    expect(gridScale([0.2, 0.6], false)).toMatchObject({ domain: [0.2, 0.6], nice: false, zero: false });
  });

  // Common practice, no source: log axes are labelled at 1, 2 and 5 times the powers of ten.
  it('labels a log axis at 1-2-5 values and at the grid’s ends when no label is close', () => {
    expect(logTicks(0.01, 2)).toEqual([0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2]);
    expect(logTicks(0.1, 4)).toEqual([0.1, 0.2, 0.5, 1, 2, 4]);
    // The ends are labelled when no 1-2-5 tick is within a factor 1.5 (0.05 / 0.03 = 1.67, 4.4 / 2 = 2.2) …
    expect(logTicks(0.03, 4.4)).toEqual([0.03, 0.05, 0.1, 0.2, 0.5, 1, 2, 4.4]);
    // … and left out when one is (0.02 / 0.015 = 1.33), so no two labels touch.
    expect(logTicks(0.015, 1)).toEqual([0.02, 0.05, 0.1, 0.2, 0.5, 1]);
  });

  it('draws 400 cells tiling the plane without gaps and marks the best grid point', () => {
    const post = posterior20();
    const spec = pairSpec(post, 0, 1) as unknown as { layer: Layer[] };
    const [cells, best] = spec.layer;
    expect(cells.data.values).toHaveLength(400);
    // Quantitative axes on the parameters' own log scales (20 ordinal labels per axis would overlap).
    expect(cells.encoding.x.scale).toEqual({ type: 'log', domain: [0.1, 4], nice: false });
    expect(cells.encoding.y.scale).toEqual({ type: 'log', domain: [0.01, 2], nice: false });
    // Neighbouring cells share their edges: the cells of one column stack from the bottom to the top of the axis.
    const column = cells.data.values.filter((r) => r.x === post.parameters[0].values[0]).sort((a, b) => a.y0 - b.y0);
    expect(column[0].y0).toBe(0.01);
    column.slice(1).forEach((r, k) => expect(r.y0).toBe(column[k].y1));
    expect(column.at(-1)!.y1).toBe(2);
    // The marker sits on the node of highest likelihood (the posterior's peak lies lower: the 1/x priors).
    expect(best.data.values).toEqual([{ x: post.parameters[0].values[7], y: post.parameters[1].values[3], label: 'Best grid point' }]);
    expect(best.mark).toMatchObject({ type: 'point' });
  });
});
