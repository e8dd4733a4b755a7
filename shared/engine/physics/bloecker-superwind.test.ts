import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { bloeckerMassLossMsunPerYr } from './bloecker-superwind.ts';
import { reimersMassLossMsunPerYr } from './reimers-mass-loss.ts';

describe('Blöcker (1995) superwind Ṁ = η_B 4.83e-9 M_ZAMS^−2.1 L^2.7 × 4e-13 L R / M', () => {
  it('gives 1.93e-21 × 0.05 × 10^14.8 × 300 ≈ 1.8285e-5 Msun/yr at L = 1e4, R = 300, M = M_ZAMS = 1 (hand arithmetic; 1e-4 covers rounding of 10^14.8)', () => {
    expect(bloeckerMassLossMsunPerYr(0.05, 1e4, 300, 1, 1) / 1.8285e-5).toBeCloseTo(1, 3);
  });
  it('scales as L^3.7 and M_ZAMS^−2.1 (eq. 16 exponents)', () => {
    const base = bloeckerMassLossMsunPerYr(0.05, 5000, 300, 1, 2);
    expect(bloeckerMassLossMsunPerYr(0.05, 10000, 300, 1, 2) / base).toBeCloseTo(2 ** 3.7, 10);
    expect(bloeckerMassLossMsunPerYr(0.05, 5000, 300, 1, 4) / base).toBeCloseTo(2 ** -2.1, 10);
  });
  it('overtakes the Reimers wind (η = 0.477) of a 1 Msun star only at the few-thousand-Lsun luminosities of the late AGB (common practice: AGB tips of low-mass stars at 3000–10000 Lsun)', () => {
    // Crossover L where η_B 4.83e-9 L^2.7 = η: independent of R and M.
    const crossover = (0.477 / (0.05 * 4.83e-9)) ** (1 / 2.7);
    expect(crossover).toBeGreaterThan(1000);
    expect(crossover).toBeLessThan(10000);
    expect(bloeckerMassLossMsunPerYr(0.05, crossover * 0.9, 200, 1, 1)).toBeLessThan(reimersMassLossMsunPerYr(0.477, crossover * 0.9, 200, 1));
    expect(bloeckerMassLossMsunPerYr(0.05, crossover * 1.1, 200, 1, 1)).toBeGreaterThan(reimersMassLossMsunPerYr(0.477, crossover * 1.1, 200, 1));
  });
  it('rejects an efficiency above 1, naming the parameter', () => {
    expect(() => bloeckerMassLossMsunPerYr(2, 1e4, 300, 1, 1)).toThrow(EngineError);
    expect(() => bloeckerMassLossMsunPerYr(2, 1e4, 300, 1, 1)).toThrow(/superwind.eta = 2/);
  });
});
