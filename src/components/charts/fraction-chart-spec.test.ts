import { describe, expect, it } from 'vitest';
import { fractionChartSpec, fractionRows } from './fraction-chart-spec.ts';

describe('fractionRows', () => {
  it('clips the error bars to [0, 1] and writes the value with its error', () => {
    const [row] = fractionRows([{ category: 'Single', value: 0.01, se: 0.008 }]);
    expect(row.lo1).toBeCloseTo(0.002, 12);
    expect(row.lo2).toBe(0);
    expect(row.hi2).toBeCloseTo(0.026, 12);
    // PDG rounding of 0.80% (formatPercentWithError): leading digits 800 → one significant figure.
    expect(row.text).toBe('1.0% ± 0.8%');
  });
});

describe('fractionChartSpec', () => {
  it('puts a run per colour within each row when there are several', () => {
    const spec = fractionChartSpec({
      points: [
        { category: 'All', series: 'A', value: 0.1, se: 0.01 },
        { category: 'All', series: 'B', value: 0.2, se: 0.01 },
      ],
      valueTitle: 'Magnetic fraction (%)',
      series: [
        { name: 'A', colour: '#aaaaaa' },
        { name: 'B', colour: '#bbbbbb' },
      ],
    }) as { encoding: Record<string, unknown>; layer: { encoding: { x: { title: string }; color?: { scale: { range: string[] } } } }[] };
    expect(spec.encoding.yOffset).toBeDefined();
    expect(spec.layer[2].encoding.x.title).toBe('Magnetic fraction (%)');
    expect(spec.layer[2].encoding.color?.scale.range).toEqual(['#aaaaaa', '#bbbbbb']);
  });
});
