import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { giantBranchLuminosityLsun } from './giant-branch-luminosity.ts';

// Hurley, Pols & Tout 2000 (MNRAS 315, 543) §5.2: L = min(B Mc^q, D Mc^p), eq. (37), with the
// coefficients of eq. (38) at Z = 0.02; the printed values are quoted from memory.
const D0 = 10 ** 5.37;

describe('giant-branch core-mass–luminosity relation (HPT2000 eqs. 37–38)', () => {
  it('is D Mc^6 with D = 10^5.37 on the red giant branch of a 1 Msun star (eq. 37, D0 of eq. 38; exact re-evaluation, 1e-12)', () => {
    for (const mc of [0.15, 0.25, 0.35, 0.47]) {
      expect(giantBranchLuminosityLsun(mc, 1) / (D0 * mc ** 6)).toBeCloseTo(1, 12);
    }
  });
  it('switches to B Mc^3 with B = max(3e4, 500 + 1.75e4 M^0.6) = 3e4 above Mc = (B/D)^(1/3) ≈ 0.504 (eq. 38)', () => {
    expect(giantBranchLuminosityLsun(0.8, 1) / (3e4 * 0.8 ** 3)).toBeCloseTo(1, 12);
  });
  it('uses p = 5, q = 2 and log D = max(−1, 0.975 D0 − 0.18 M, 0.5 D0 − 0.06 M) at M = 3 (eq. 38)', () => {
    const logD = Math.max(-1, 0.975 * 5.37 - 0.18 * 3, 0.5 * 5.37 - 0.06 * 3);
    const b = Math.max(3e4, 500 + 1.75e4 * 3 ** 0.6);
    const expected = Math.min(b * 0.4 ** 2, 10 ** logD * 0.4 ** 5);
    expect(giantBranchLuminosityLsun(0.4, 3) / expected).toBeCloseTo(1, 12);
  });
  it("gives the Sun's red-giant tip L ≈ 2000–3500 Lsun at Mc = 0.47 (common practice, from memory: tip at M_bol ≈ −3.5 to −4; wide because L ∝ Mc^6 turns the ±0.01 Msun uncertainty of the flash core mass into ±13%)", () => {
    const l = giantBranchLuminosityLsun(0.47, 1);
    expect(l).toBeGreaterThan(2000);
    expect(l).toBeLessThan(3500);
  });
  it('is continuous in M across M_HeF, where the coefficients start to move towards their high-mass values', () => {
    const below = giantBranchLuminosityLsun(0.3, 1.995);
    const above = giantBranchLuminosityLsun(0.3, 1.995 + 1e-9);
    expect(above / below).toBeCloseTo(1, 6);
  });
  it('rejects a core mass or initial mass out of range, naming the parameter', () => {
    expect(() => giantBranchLuminosityLsun(-0.1, 1)).toThrow(EngineError);
    expect(() => giantBranchLuminosityLsun(0.3, Number.NaN)).toThrow(/initialMassMsun = NaN/);
  });
});
