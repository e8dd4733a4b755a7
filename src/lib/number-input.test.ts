import { describe, expect, it } from 'vitest';
import { parseNumberList, parseNumberText } from './number-input.ts';

describe('parseNumberText', () => {
  it('reads the ways people write numbers', () => {
    expect(parseNumberText('0.47')).toBe(0.47);
    expect(parseNumberText(' -2 ')).toBe(-2);
    expect(parseNumberText('.5')).toBe(0.5);
    expect(parseNumberText('1e6')).toBe(1e6);
    expect(parseNumberText('2.5E-3')).toBe(2.5e-3);
    expect(parseNumberText('10^8')).toBe(1e8);
    expect(parseNumberText('3 × 10^6')).toBe(3e6);
    expect(parseNumberText('10^-2')).toBeCloseTo(0.01, 15);
  });

  it('accepts digit grouping only when asked', () => {
    expect(parseNumberText('1,253', { grouping: true })).toBe(1253);
    expect(parseNumberText('1 000 000', { grouping: true })).toBe(1e6);
    expect(parseNumberText('1_000', { grouping: true })).toBe(1000);
    expect(parseNumberText('1,253')).toBeNaN();
  });

  it('gives null for nothing and NaN for words', () => {
    expect(parseNumberText('')).toBeNull();
    expect(parseNumberText('   ')).toBeNull();
    expect(parseNumberText('ten')).toBeNaN();
    expect(parseNumberText('1.2.3')).toBeNaN();
    expect(parseNumberText('0x10')).toBeNaN();
  });
});

describe('parseNumberList', () => {
  it('splits on commas, semicolons and spaces', () => {
    expect(parseNumberList('0.5, 1,2;4  8')).toEqual([0.5, 1, 2, 4, 8]);
    expect(parseNumberList('')).toEqual([]);
  });

  it('marks a word that is not a number as NaN', () => {
    const values = parseNumberList('1, two, 3');
    expect(values[0]).toBe(1);
    expect(values[1]).toBeNaN();
    expect(values[2]).toBe(3);
  });
});
