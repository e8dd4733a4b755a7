import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { reimersMassLossMsunPerYr } from './reimers-mass-loss.ts';

describe('Reimers (1975) wind Ṁ = 4e-13 η L R / M', () => {
  it('gives 2e-8 Msun/yr for η = 0.5, L = 1000 Lsun, R = 100 Rsun, M = 1 Msun (worked example, exact arithmetic)', () => {
    expect(reimersMassLossMsunPerYr(0.5, 1000, 100, 1) / 2e-8).toBeCloseTo(1, 12);
  });
  it('scales as η L R / M', () => {
    const base = reimersMassLossMsunPerYr(0.4, 2000, 150, 0.8);
    expect(reimersMassLossMsunPerYr(0.8, 2000, 150, 0.8) / base).toBeCloseTo(2, 12);
    expect(reimersMassLossMsunPerYr(0.4, 4000, 300, 1.6) / base).toBeCloseTo(2, 12);
  });
  it('rejects a negative efficiency or a non-finite radius, naming the parameter', () => {
    expect(() => reimersMassLossMsunPerYr(-0.1, 1000, 100, 1)).toThrow(EngineError);
    expect(() => reimersMassLossMsunPerYr(0.5, 1000, Number.NaN, 1)).toThrow(/radiusRsun = NaN/);
  });
});
