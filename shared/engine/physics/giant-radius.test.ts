import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { giantRadiusRsun } from './giant-radius.ts';

describe('giant-branch radius R = 1.1 M^−0.3 (L^0.4 + 0.383 L^0.76) (HPT2000 eq. 46 at Z = 0.02)', () => {
  it('evaluates the printed formula (L = 2500, M = 1 → 186.3 Rsun; hand arithmetic, 1e-3)', () => {
    expect(giantRadiusRsun(2500, 1) / (1.1 * (2500 ** 0.4 + 0.383 * 2500 ** 0.76))).toBeCloseTo(1, 12);
    expect(giantRadiusRsun(2500, 1)).toBeCloseTo(186.3, 0);
  });
  it("puts the Sun's red-giant tip (L ≈ 2500 Lsun, M ≈ 0.7–1 Msun) at 150–260 Rsun (common practice, from memory; wide to cover published solar-tip radii from ~170 to ~256 Rsun)", () => {
    for (const m of [0.7, 0.85, 1]) {
      const r = giantRadiusRsun(2500, m);
      expect(r).toBeGreaterThan(150);
      expect(r).toBeLessThan(260);
    }
  });
  it('reproduces Arcturus (L ≈ 170 Lsun, M ≈ 1.08 Msun, R ≈ 25.4 Rsun; Ramírez & Allende Prieto 2011, from memory) within 25%, wide because Arcturus is metal-poor ([Fe/H] ≈ −0.5) and such giants are smaller than the Z = 0.02 fit', () => {
    expect(Math.abs(giantRadiusRsun(170, 1.08) / 25.4 - 1)).toBeLessThan(0.25);
  });
  it('grows as the envelope is lost (R ∝ M^−0.3 at fixed L)', () => {
    expect(giantRadiusRsun(3000, 0.6) / giantRadiusRsun(3000, 1.2)).toBeCloseTo(2 ** 0.3, 12);
  });
  it('rejects out-of-range inputs, naming the parameter', () => {
    expect(() => giantRadiusRsun(0, 1)).toThrow(EngineError);
    expect(() => giantRadiusRsun(100, -1)).toThrow(/massMsun = -1/);
  });
});
