import { describe, expect, it } from 'vitest';
import { periodDays, semiMajorAxisAU } from './kepler.ts';

describe('Kepler third law', () => {
  it('puts the Earth at 1 AU (sidereal year 365.25636 d; Earth/Sun mass ratio 3.0035e-6, IAU 2009 system)', () => {
    // The Gaussian constant defines the AU so that a massless body with P = 2π/k days sits
    // at 1 AU; the Earth's mass shifts a by (1 + m/M)^(1/3) − 1 ≈ 1e-6, and the modern
    // sidereal year differs from 2π/k by ~1e-7, so 1e-5 is a generous tolerance.
    expect(semiMajorAxisAU(365.25636, 1 + 3.0035e-6)).toBeCloseTo(1, 5);
  });
  it('gives Jupiter a ≈ 5.20 AU for P = 4332.59 d (NASA planetary fact sheet, from memory)', () => {
    expect(semiMajorAxisAU(4332.59, 1 + 9.5479e-4)).toBeCloseTo(5.2034, 2);
  });
  it('inverts exactly', () => {
    const a = semiMajorAxisAU(1234.5, 1.7);
    expect(periodDays(a, 1.7)).toBeCloseTo(1234.5, 8);
  });
});
