import { describe, expect, it } from 'vitest';
import { fractionOrLimitText } from './fraction-text.ts';

describe('fractionOrLimitText', () => {
  it('gives the 95% Clopper–Pearson upper limit when nothing was drawn, never "0% ± 0%"', () => {
    // k = 0: the central 95% interval's upper end is 1 − 0.025^(1/n) (Clopper & Pearson 1934);
    // for n = 300,000 that is 1.2296e-5, i.e. 0.0012% to two significant figures.
    expect(fractionOrLimitText(0, 300_000, 0)).toBe('< 0.0012% (95% upper limit, none of 300,000)');
    // n = 10: 1 − 0.025^(1/10) = 0.3085 (the "rule of three" region does not apply at n = 10).
    expect(fractionOrLimitText(0, 10, 0)).toBe('< 31% (95% upper limit, none of 10)');
  });

  it('gives the value with its standard error otherwise, and nothing without white dwarfs', () => {
    // 21 of 1000 with se √(0.021·0.979/1000) = 0.0045: the PDG rule keeps one digit of 0.45%.
    expect(fractionOrLimitText(21, 1000, Math.sqrt((0.021 * 0.979) / 1000))).toBe('2.1% ± 0.5%');
    expect(fractionOrLimitText(0, 0, 0)).toBeNull();
  });
});
