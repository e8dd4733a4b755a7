import { describe, expect, it } from 'vitest';
import { formatGridValue, intervalCaveat } from './fit-interval-words.ts';

const grid = { min: 0.01, max: 2 };

describe('intervalCaveat', () => {
  it('says nothing of an interval the data bound', () => {
    expect(intervalCaveat({ lowerEdge: false, upperEdge: false, lowerLimit: false, upperLimit: false, flat: false }, grid, '')).toBeNull();
  });

  it('names the edge (or edges) that cut the interval, with its value and unit', () => {
    expect(intervalCaveat({ lowerEdge: true, upperEdge: false, lowerLimit: false, upperLimit: false, flat: false }, grid, '')).toBe(
      "cut by the grid's lower edge (0.01), where the posterior is still high",
    );
    expect(intervalCaveat({ lowerEdge: true, upperEdge: true, lowerLimit: false, upperLimit: false, flat: false }, { min: 1, max: 4 }, 'AU')).toBe(
      "cut by the grid's lower edge (1 AU) and upper edge (4 AU), where the posterior is still high",
    );
  });

  it('says when the posterior piles at the parameter’s own limit, so that the result is in effect one-sided', () => {
    expect(intervalCaveat({ lowerEdge: false, upperEdge: false, lowerLimit: true, upperLimit: false, flat: false }, { min: 0, max: 4.35 }, '')).toBe(
      'the posterior piles up at the lowest value the parameter can take (0): read it as an upper limit',
    );
    expect(intervalCaveat({ lowerEdge: true, upperEdge: false, lowerLimit: false, upperLimit: true, flat: false }, { min: 0.5, max: 4.35 }, '')).toBe(
      "cut by the grid's lower edge (0.5), where the posterior is still high; the posterior piles up at the highest value the parameter can take (4.35): read it as a lower limit",
    );
  });

  it('calls a flat parameter unconstrained and its interval the prior’s, whatever its edges', () => {
    expect(intervalCaveat({ lowerEdge: true, upperEdge: true, lowerLimit: false, upperLimit: false, flat: true }, grid, '')).toBe(
      "not constrained: the likelihood is flat along it, so the interval is the prior's over the grid's 0.01–2",
    );
  });
});

describe('formatGridValue', () => {
  it('keeps three significant figures and switches to exponent form outside 10^-3 … 10^4', () => {
    expect(formatGridValue(0.011347)).toBe('0.0113');
    expect(formatGridValue(2)).toBe('2');
    expect(formatGridValue(12345)).toBe('1.23e+4');
    expect(formatGridValue(0.0005)).toBe('5.00e-4');
  });
});
