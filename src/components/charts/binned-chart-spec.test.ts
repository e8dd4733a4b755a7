import { describe, expect, it } from 'vitest';
import { binnedChartSpec, binRows, occupiedBinRange, shares, stepFill, stepOutline } from './binned-chart-spec.ts';

describe('occupiedBinRange', () => {
  it('keeps one empty bin on each side of what any series fills', () => {
    expect(occupiedBinRange([{ counts: [0, 0, 0, 3, 1, 0, 0] }, { counts: [0, 0, 0, 0, 0, 2, 0] }], 7)).toEqual([2, 7]);
    expect(occupiedBinRange([{ counts: [5, 0, 0] }], 3)).toEqual([0, 2]);
  });

  it('shows every bin when nothing was counted', () => {
    expect(occupiedBinRange([{ counts: [0, 0, 0] }], 3)).toEqual([0, 3]);
  });
});

describe('shares', () => {
  it('divides by the series total, and gives zeros for an empty series', () => {
    expect(shares([1, 3])).toEqual([0.25, 0.75]);
    expect(shares([0, 0])).toEqual([0, 0]);
  });
});

describe('binRows and stepOutline', () => {
  it('turns log10 edges into the quantity and closes the outline at zero', () => {
    const rows = binRows({ edges: [-1, 0, 1], series: [{ name: 'B', colour: '#fff', counts: [2, 6] }], logX: true, xUnit: 'MG' }, [0, 2]);
    expect(rows.map((r) => [r.lo, r.hi, r.value, r.range])).toEqual([
      [0.1, 1, 2, '0.1–1 MG'],
      [1, 10, 6, '1–10 MG'],
    ]);
    expect(rows[0].mid).toBeCloseTo(10 ** -0.5, 12);
    expect(stepOutline(rows).map((p) => [p.x, p.y])).toEqual([
      [0.1, 0],
      [0.1, 2],
      [1, 2],
      [1, 6],
      [10, 6],
      [10, 0],
    ]);
    expect(stepFill(rows).map((p) => [p.x, p.y])).toEqual([
      [0.1, 2],
      [1, 6],
      [10, 6],
    ]);
  });

  it('draws shares when normalised, keeping the counts for tooltips', () => {
    const rows = binRows({ edges: [0, 1, 2], series: [{ name: 'm', colour: '#fff', counts: [1, 3] }], normalise: true, xUnit: 'Msun' }, [0, 2]);
    expect(rows.map((r) => [r.value, r.count])).toEqual([
      [0.25, 1],
      [0.75, 3],
    ]);
  });
});

describe('binnedChartSpec', () => {
  it('titles both axes with units and pins the colours of the series', () => {
    const spec = binnedChartSpec({
      edges: [0.5, 0.52, 0.54],
      series: [
        { name: 'Magnetic', colour: '#111111', counts: [1, 2] },
        { name: 'Not magnetic', colour: '#222222', counts: [3, 4] },
      ],
      xTitle: 'White-dwarf mass (Msun)',
      xUnit: 'Msun',
      binLabel: '0.02 Msun bin',
      countNoun: 'White dwarfs',
      markers: [{ at: 0.52, label: 'here' }],
    }) as { layer: { encoding: Record<string, { title?: unknown; scale?: { range?: string[] } }> }[] };
    const line = spec.layer[0].encoding;
    expect(line.x.title).toBe('White-dwarf mass (Msun)');
    expect(line.y.title).toBe('White dwarfs per 0.02 Msun bin (count)');
    expect(line.color.scale?.range).toEqual(['#111111', '#222222']);
    expect(spec.layer).toHaveLength(4);
  });
});

describe('binnedChartSpec markers', () => {
  it('widens the shown range so that a marker outside the filled bins stays in view', () => {
    const spec = binnedChartSpec({
      edges: [-2, -1, 0, 1, 2, 3],
      series: [{ name: 'B', colour: '#fff', counts: [0, 0, 0, 0, 5] }],
      xTitle: 'B (MG)',
      xUnit: 'MG',
      logX: true,
      binLabel: '1 dex bin',
      countNoun: 'White dwarfs',
      markers: [{ at: 0, label: 'threshold' }],
    }) as { layer: { encoding: { x: { scale?: { domain?: number[] } } } }[] };
    expect(spec.layer[0].encoding.x.scale?.domain).toEqual([1, 1000]);
  });
});
