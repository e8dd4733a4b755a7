import { describe, expect, it } from 'vitest';
import type { SweepDetail } from '../../../../shared/contracts/sweeps.ts';
import { heatCells } from './sweep-heatmap-spec.ts';

const point = (over: Partial<SweepDetail['points'][number]>): SweepDetail['points'][number] => ({
  index: 0, values: [1, 2], runId: 'r', status: 'succeeded', fraction: 0.1, fractionSe: 0.001, whiteDwarfs: 1000, magnetic: 100, pValue: null, consistent68: null, consistent95: null, ...over,
});

describe('heatCells', () => {
  it('labels each cell with its fraction and error on two lines, and says what the sample makes of it', () => {
    const [allowed, edge, rejected] = heatCells(
      {
        points: [
          point({ pValue: 0.5, consistent68: true, consistent95: true }),
          point({ fraction: 0.2, pValue: 0.1, consistent68: false, consistent95: true }),
          point({ fraction: 0.3, pValue: 0.001, consistent68: false, consistent95: false }),
        ],
      },
      [0.1, 0.3],
    );
    expect(allowed.lines).toEqual(['10.00%', '± 0.10%']);
    expect([allowed.verdict, edge.verdict, rejected.verdict]).toEqual(['allowed68', 'allowed95', 'rejected']);
    // The top of the ramp is light (primrose): dark text there.
    expect([allowed.ink, rejected.ink]).toEqual(['light', 'dark']);
  });

  it('shows an unfinished point by its status, without a colour', () => {
    const [cell] = heatCells({ points: [point({ status: 'running', fraction: null, fractionSe: null })] }, [0, 1]);
    expect(cell.fraction).toBeNull();
    expect(cell.lines).toEqual(['running']);
    expect(cell.verdict).toBe('untested');
  });
});
