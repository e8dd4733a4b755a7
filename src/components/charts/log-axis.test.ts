import { describe, expect, it } from 'vitest';
import { decadeAxis, decadeLabel } from './log-axis.ts';

describe('decadeLabel', () => {
  it('writes ordinary decades as numbers and far ones as powers of ten', () => {
    expect([-4, -3, 0, 2, 4, 5].map(decadeLabel)).toEqual(['10⁻⁴', '0.001', '1', '100', '10000', '10⁵']);
  });
});

describe('decadeAxis', () => {
  it('ticks every decade inside the range and thins the labels', () => {
    const axis = decadeAxis(-1, 11, 4);
    expect(axis.values).toHaveLength(13);
    expect(axis.values[0]).toBeCloseTo(0.1, 15);
    // 13 decades, at most 4 labels: every fourth decade from 10⁻¹.
    expect(axis.labelExpr.match(/\? '/g)).toHaveLength(4);
    expect(axis.labelExpr).toContain("'1000'");
    expect(axis.labelExpr).toContain("'10⁷'");
    expect(axis.labelExpr).not.toContain("'10⁵'");
  });
});
