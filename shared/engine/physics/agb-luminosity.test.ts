import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { agbLuminosityLsun } from './agb-luminosity.ts';

describe('AGB core-mass–luminosity relation (Paczyński 1970, L = 59250 (Mc − Mc0))', () => {
  it('gives 6221.25 Lsun at Mc = 0.6 and 18071.25 Lsun at Mc = 0.8 with Mc0 = 0.495 (the published formula evaluated by hand; 1e-9 relative)', () => {
    expect(agbLuminosityLsun(0.6, 0.495) / 6221.25).toBeCloseTo(1, 9);
    expect(agbLuminosityLsun(0.8, 0.495) / 18071.25).toBeCloseTo(1, 9);
  });
  it('uses the usually quoted zero point 0.522 by default: 4621.5 Lsun at Mc = 0.6 (formula by hand; 1e-9 relative)', () => {
    expect(agbLuminosityLsun(0.6) / 4621.5).toBeCloseTo(1, 9);
  });
  it('reaches the classical AGB luminosity limit M_bol ≈ −7.1 (L ≈ 5.4×10^4 Lsun) near the Chandrasekhar core mass (common practice, from memory; 10% because the limit is quoted between −7.0 and −7.2 mag)', () => {
    const limitLsun = 10 ** ((4.74 + 7.1) / 2.5);
    expect(Math.abs(agbLuminosityLsun(1.4) / limitLsun - 1)).toBeLessThan(0.1);
  });
  it('rejects core masses at or below the zero point, or above 1.44 Msun', () => {
    expect(() => agbLuminosityLsun(0.495, 0.495)).toThrow(EngineError);
    expect(() => agbLuminosityLsun(0.51)).toThrow(/coreMassMsun = 0.51 is outside the allowed range \(0.522, 1.44\] Msun/);
    expect(() => agbLuminosityLsun(1.5, 0.495)).toThrow(/coreMassMsun = 1.5 is outside the allowed range \(0.495, 1.44\] Msun/);
    expect(() => agbLuminosityLsun(Number.NaN)).toThrow(/coreMassMsun = NaN/);
  });
});
