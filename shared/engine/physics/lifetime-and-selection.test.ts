import { describe, expect, it } from 'vitest';
import { mestelLuminosityRatio } from './cooling-mestel1952.ts';
import { scalingLifetimeGyr } from './lifetime-scaling.ts';
import { tabulatedLifetimeGyr } from './lifetime-table.ts';
import { magnitudeLimitedAcceptance } from './selection-magnitude-limited.ts';

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
  it('acceptance ∝ L^(3/2), 1 at the reference, floored cooling ages', () => {
    expect(magnitudeLimitedAcceptance(1.2, 0.1, 0.1, 1.2, 0.1)).toBeCloseTo(1, 12);
    expect(magnitudeLimitedAcceptance(0.6, 1, 0.1, 1.2, 0.1)).toBeCloseTo(Math.pow(0.5 * Math.pow(10, -1.4), 1.5), 12);
    expect(magnitudeLimitedAcceptance(1.2, 0.001, 0.1, 1.2, 0.1)).toBeCloseTo(1, 12);
  });
});
