import { describe, expect, it } from 'vitest';
import { LSUN_ERG_S, MSUN_G, YEAR_S } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { coreGrowthRateMsunPerYr } from './core-growth.ts';

describe('core growth dMc/dt = A L (A = 1.44e-5 Msun/Lsun/Myr, HPT2000 §5.2)', () => {
  it('matches the energy budget of hydrogen-shell burning, 1/(X Q), to 5%', () => {
    // Atomic masses (AME/CODATA, from memory): 1H 1.00782503 u, 4He 4.00260325 u;
    // 1 u = 931.494 MeV/c² = 1.66053907e-24 g. Per 4 H: 26.73 MeV, of which ≈ 1.7 MeV leave
    // as CN-cycle neutrinos (13N and 15O decays; from memory). X = 0.70 in the envelope.
    // Tolerance 5%: X is 0.68–0.72 for solar-like stars and the neutrino loss is 2–6%.
    const u = 1.66053907e-24;
    const mevErg = 1.602176634e-6;
    const releasedMeV = (4 * 1.00782503 - 4.00260325) * 931.494 - 1.7;
    const ergPerGramHydrogen = (releasedMeV * mevErg) / (4 * 1.00782503 * u);
    const msunPerLsunYr = (LSUN_ERG_S * YEAR_S) / (0.7 * ergPerGramHydrogen) / MSUN_G;
    expect(Math.abs(coreGrowthRateMsunPerYr(1) / msunPerLsunYr - 1)).toBeLessThan(0.05);
  });
  it('gives 3.6e-8 Msun/yr at 2500 Lsun (the doc example, exact arithmetic)', () => {
    expect(coreGrowthRateMsunPerYr(2500) / 3.6e-8).toBeCloseTo(1, 12);
  });
  it('rejects negative or non-finite luminosities', () => {
    expect(() => coreGrowthRateMsunPerYr(-1)).toThrow(EngineError);
    expect(() => coreGrowthRateMsunPerYr(Infinity)).toThrow(/luminosityLsun = Infinity/);
  });
});
