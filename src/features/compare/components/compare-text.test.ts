import { describe, expect, it } from 'vitest';
import { differenceInWords, percentagePoints, runIdsFrom } from './compare-text.ts';

describe('runIdsFrom', () => {
  it('reads the comma list without blanks or repeats', () => {
    expect(runIdsFrom(' a, b,,a ,c')).toEqual(['a', 'b', 'c']);
    expect(runIdsFrom(null)).toEqual([]);
  });
});

describe('differenceInWords', () => {
  // 2σ and 3σ conventions (common practice, no source).
  it('calls small differences noise and large ones real', () => {
    expect(differenceInWords(1.2, 0.01)).toBe('Within Monte Carlo noise (1.2σ).');
    expect(differenceInWords(2.5, 0.01)).toMatch(/^A hint/);
    expect(differenceInWords(7.04, 0.01)).toBe('A real difference between the models (7.0σ).');
    expect(differenceInWords(null, 0)).toMatch(/^Identical/);
  });
});

describe('percentagePoints', () => {
  it('rounds to two significant figures of the error, with a true minus sign', () => {
    expect(percentagePoints(0.012, 0.0015)).toBe('+1.20 ± 0.15 pp');
    expect(percentagePoints(-0.0523, 0.0031)).toBe('−5.23 ± 0.31 pp');
    expect(percentagePoints(0, 0)).toBe('0.00 ± 0.00 pp');
  });
});
