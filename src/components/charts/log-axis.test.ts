import { describe, expect, it } from 'vitest';
import { decadeAxis, decadeLabel } from './log-axis.ts';

describe('decadeLabel', () => {
  it('writes a decade as a number or as a power of ten', () => {
    expect([-2, 0, 3].map((k) => decadeLabel(k, 'plain'))).toEqual(['0.01', '1', '1000']);
    expect([-4, 0, 4, 6].map((k) => decadeLabel(k, 'power'))).toEqual(['10⁻⁴', '10⁰', '10⁴', '10⁶']);
  });
});

describe('decadeAxis', () => {
  it('ticks every decade inside the range and thins the labels', () => {
    const axis = decadeAxis(-1, 11, 4);
    expect(axis.values).toHaveLength(13);
    expect(axis.values[0]).toBeCloseTo(0.1, 15);
    // 13 decades, at most 4 labels: every fourth decade from 10⁻¹.
    expect(axis.labelExpr.match(/\? '/g)).toHaveLength(4);
    expect(axis.labelExpr).toContain("'10³'");
    expect(axis.labelExpr).toContain("'10⁷'");
    expect(axis.labelExpr).not.toContain("'10⁵'");
  });

  it('uses one style per axis: no 10000 beside 10⁶', () => {
    const wide = decadeAxis(-2, 12, 8).labelExpr;
    expect(wide).not.toMatch(/'10000'|'100'|'0\.01'/);
    expect(wide).toContain("'10⁰'");
    const narrow = decadeAxis(-2, 3).labelExpr;
    expect(narrow).toContain("'0.01'");
    expect(narrow).toContain("'1000'");
    expect(narrow).not.toContain('⁰');
  });

  it('lets the chart drop labels that would touch', () => {
    expect(decadeAxis(0, 3).labelOverlap).toBe('greedy');
  });
});
