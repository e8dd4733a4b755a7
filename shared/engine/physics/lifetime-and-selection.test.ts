import { describe, expect, it } from 'vitest';
import { mestelLuminosityRatio } from './cooling-mestel1952.ts';
import { scalingLifetimeGyr } from './lifetime-scaling.ts';
import { tabulatedLifetimeGyr } from './lifetime-table.ts';
import { magnitudeLimitedAcceptance, opticalFlux } from './selection-magnitude-limited.ts';

describe('main-sequence lifetimes', () => {
  it('scaling: the Sun lives 10 Gyr and a 2 Msun star 10 · 2^-2.5 ≈ 1.77 Gyr (common practice, no source)', () => {
    expect(scalingLifetimeGyr(1, 10, 2.5)).toBeCloseTo(10, 12);
    expect(scalingLifetimeGyr(2, 10, 2.5)).toBeCloseTo(10 * Math.pow(2, -2.5), 12);
  });
  it('table: log-log interpolation reproduces a power law exactly', () => {
    const masses = [1, 2, 4].map(Math.log10);
    const times = [1, 2, 4].map((m) => Math.log10(10 * Math.pow(m, -2.5)));
    expect(tabulatedLifetimeGyr(3, masses, times)).toBeCloseTo(10 * Math.pow(3, -2.5), 12);
    expect(tabulatedLifetimeGyr(6, masses, times)).toBeCloseTo(10 * Math.pow(6, -2.5), 12);
    expect(() => tabulatedLifetimeGyr(Number.NaN, masses, times)).toThrow(/massMsun = NaN/);
  });
});

describe('magnitude-limited selection with Mestel cooling', () => {
  it('L ∝ M t^(-7/5) (Mestel 1952): twice the mass at ten times the age is 2 · 10^-1.4', () => {
    expect(mestelLuminosityRatio(1.2, 1, 0.6, 0.1)).toBeCloseTo(2 * Math.pow(10, -1.4), 12);
  });
  it('acceptance = (F/F_ref)^(3/2) (Schmidt 1968 visible volume), 1 at the reference, floored cooling ages', () => {
    const ref = opticalFlux(0.6, 0.1, 550);
    expect(magnitudeLimitedAcceptance(0.6, 0.1, 0.1, 550, ref)).toBeCloseTo(1, 12);
    expect(magnitudeLimitedAcceptance(0.6, 0.001, 0.1, 550, ref)).toBeCloseTo(1, 12);
    expect(magnitudeLimitedAcceptance(0.6, 1, 0.1, 550, ref)).toBeCloseTo(Math.pow(opticalFlux(0.6, 1, 550) / ref, 1.5), 12);
  });
  it('selects a 1.0 Msun white dwarf less often than a 0.6 Msun one of the same cooling age: it is smaller (Nauenberg 1972), the known bias of magnitude-limited samples against massive white dwarfs (Liebert et al. 2003)', () => {
    // At the young cooling ages that dominate a magnitude-limited sample (the floor of 0.1 Gyr to
    // 0.3 Gyr). Under Mestel cooling (L ∝ M at fixed age) the massive white dwarf is hotter, and
    // beyond ≈ 0.5 Gyr its Wien-side V flux overtakes the smaller radius (stated in the assumptions).
    for (const ageGyr of [0.1, 0.2, 0.3]) {
      const ref = opticalFlux(0.3, 0.1, 550);
      expect(magnitudeLimitedAcceptance(1.0, ageGyr, 0.1, 550, ref)).toBeLessThan(magnitudeLimitedAcceptance(0.6, ageGyr, 0.1, 550, ref));
    }
  });
  it('gives the blackbody flux R²/(exp(hc/λkT) − 1) with T from L = 4πR²σT⁴ (Stefan–Boltzmann, Teff,sun = 5772 K, IAU 2015 B3) and Mestel L (values by hand; 1e-9 relative)', () => {
    // 0.6 Msun at 1 Gyr: L = 0.6 (1e9/6.3e6)^-1.4, R from Nauenberg's fit typed in here.
    const x = Math.cbrt(0.6 / 1.44);
    const radius = 0.0112 * Math.sqrt(1 / (x * x) - x * x);
    const lum = 0.6 * Math.pow(1e9 / 6.3e6, -1.4);
    const teff = 5772 * Math.pow(lum, 0.25) * Math.pow(radius, -0.5);
    expect(teff).toBeGreaterThan(5000); // a cool but not cold white dwarf at 1 Gyr (common practice: ~8000 K)
    expect(teff).toBeLessThan(12000);
    const expected = (radius * radius) / (Math.exp(1.438777e7 / (550 * teff)) - 1);
    expect(opticalFlux(0.6, 1, 550) / expected).toBeCloseTo(1, 9);
  });
});
