import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors.ts';
import { HELIUM_FLASH_MAX_MASS_MSUN, rgbTipCoreMassMsun } from './rgb-tip-core-mass.ts';

describe('core mass at the end of the red giant branch', () => {
  it('puts the helium flash of low-mass stars at Mc ≈ 0.47 Msun (DESIGN; common practice, from memory: 0.45–0.49 at Z = 0.02)', () => {
    for (const m of [0.8, 1, 1.5, 1.9]) {
      const mc = rgbTipCoreMassMsun(m)!;
      expect(mc).toBeGreaterThanOrEqual(0.45);
      expect(mc).toBeLessThanOrEqual(0.49);
    }
  });
  it('uses M_HeF = 1.995 Msun, HPT2000 eq. (2) at ζ = 0 (from memory)', () => {
    expect(HELIUM_FLASH_MAX_MASS_MSUN).toBe(1.995);
  });
  it('passes near the minimum ignition core mass ≈ 0.33 Msun at ≈ 2.2 Msun (common practice, from memory; ±0.05 because that minimum itself varies by that much between model grids)', () => {
    expect(rgbTipCoreMassMsun(2.2)!).toBeGreaterThan(0.28);
    expect(rgbTipCoreMassMsun(2.2)!).toBeLessThan(0.38);
  });
  it('is continuous at M_HeF and falls monotonically to no red giant branch at 2.5 Msun', () => {
    expect(rgbTipCoreMassMsun(HELIUM_FLASH_MAX_MASS_MSUN + 1e-9)!).toBeCloseTo(0.47, 6);
    let previous = Infinity;
    for (let m = 2.0; m < 2.5; m += 0.05) {
      const mc = rgbTipCoreMassMsun(m)!;
      expect(mc).toBeLessThan(previous);
      previous = mc;
    }
    expect(rgbTipCoreMassMsun(2.5)).toBeNull();
    expect(rgbTipCoreMassMsun(6)).toBeNull();
  });
  it('rejects masses outside 0.5–10 Msun with an EngineError naming the parameter', () => {
    expect(() => rgbTipCoreMassMsun(Number.NaN)).toThrow(EngineError);
    expect(() => rgbTipCoreMassMsun(12)).toThrow(/initialMassMsun = 12 is outside the allowed range \[0.5, 10\] Msun/);
  });
});
