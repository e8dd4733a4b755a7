import { describe, expect, it } from 'vitest';
import { fateCells } from './fate-map-spec.ts';

describe('fateCells', () => {
  // A 2 × 2 map by hand: counts[fate][massBin][periodBin].
  const map = {
    log10MassEdgesMsun: [-3, -2, -1],
    log10PeriodEdgesDays: [0, 1, 2],
    fates: ['wide', 'postCE', 'disrupted', 'merged'] as ('wide' | 'postCE' | 'disrupted' | 'merged')[],
    counts: [
      [
        [0, 90],
        [0, 0],
      ],
      [
        [0, 0],
        [0, 0],
      ],
      [
        [9, 10],
        [0, 0],
      ],
      [
        [0, 0],
        [0, 0],
      ],
    ],
  };

  it('keeps occupied cells only, with their most common fate and its share', () => {
    const cells = fateCells(map);
    expect(cells).toHaveLength(2);
    expect(cells[0]).toMatchObject({ massLo: 0.001, massHi: 0.01, periodLo: 1, periodHi: 10, total: 9, dominant: 'Disrupted', dominantShare: 1 });
    expect(cells[1]).toMatchObject({ total: 100, dominant: 'Wide', dominantShare: 0.9, wide: 90, disrupted: 10, periodRange: '10–100 d' });
  });

  it('weights cells by log count, the fullest at 1', () => {
    const [few, many] = fateCells(map);
    expect(many.weight).toBe(1);
    expect(few.weight).toBeCloseTo(Math.log10(10) / Math.log10(101), 12);
  });
});
