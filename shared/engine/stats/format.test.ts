import { describe, expect, it } from 'vitest';
import { formatAtResolution, formatPValue, formatPercent, formatPercentRange, formatPercentWithError, formatSigma, formatSignificant } from './format.ts';

describe('summary number formatting', () => {
  it('rounds a value and its error by the Particle Data Group rule (PDG Introduction; examples from memory)', () => {
    // PDG: 0.827 ± 0.119 → 0.83 ± 0.12 and 0.827 ± 0.367 → 0.8 ± 0.4; 950–999 rounds up to 1000.
    expect(formatPercentWithError(0.00827, 0.00119)).toBe('0.83% ± 0.12%');
    expect(formatPercentWithError(0.00827, 0.00367)).toBe('0.8% ± 0.4%');
    expect(formatPercentWithError(0.0213, 0.00097)).toBe('2.13% ± 0.10%');
    expect(formatPercentWithError(0.35, 0)).toBe('35%');
  });

  it('writes significant figures without exponents for ordinary sizes', () => {
    expect(formatSignificant(0.0948, 2)).toBe('0.095');
    expect(formatSignificant(150, 2)).toBe('150');
    expect(formatSignificant(0.42, 2)).toBe('0.42');
    expect(formatSignificant(0, 2)).toBe('0');
    expect(formatSignificant(5.7e-10, 2)).toBe('5.7 × 10⁻¹⁰');
    expect(formatPercent(0.09489)).toBe('9.5%');
  });

  it('gives observed ranges enough digits to keep their ends apart', () => {
    expect(formatPercentRange(0.15, 0.0321, 0.3789)).toEqual(['15', '3.2', '38']);
    expect(formatPercentRange(0.1005, 0.09991, 0.10109)).toEqual(['10.05', '9.99', '10.11']);
    expect(formatPercentRange(0, 0, 0.0949)).toEqual(['0', '0', '9.5']);
    expect(formatAtResolution(2.4137, 0.0213)).toBe('2.414');
    expect(formatAtResolution(2.4137, 3)).toBe('2.4'); // never coarser than two significant figures
    expect(formatAtResolution(0.0848, 3)).toBe('0.085');
  });

  it('writes p-values from their logs, also below the smallest double', () => {
    expect(formatPValue(Math.log(0.4567))).toBe('0.46');
    expect(formatPValue(0)).toBe('1');
    expect(formatPValue(Math.log(5.7e-10))).toBe('5.7 × 10⁻¹⁰');
    // ln p = 1e6 ln ½ → p = 10^(−301029.996) = 1.0 × 10⁻³⁰¹⁰³⁰
    expect(formatPValue(1e6 * Math.log(0.5))).toBe('1.0 × 10⁻³⁰¹⁰³⁰');
    expect(formatSigma(6.1985)).toBe('6.2σ');
    expect(formatSigma(1665.1)).toBe('1665σ');
  });
});
