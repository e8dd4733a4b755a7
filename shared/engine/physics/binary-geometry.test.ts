import { describe, expect, it } from 'vitest';
import { RJUP_RSUN } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { companionRadiusRsun } from './companion-radius.ts';
import { mainSequenceRadiusRsun } from './main-sequence-radius-demircan1991.ts';
import { rocheLobeFraction } from './roche-lobe-eggleton1983.ts';
import { tidalRadiusRsun } from './tidal-disruption.ts';
import { whiteDwarfRadiusRsun } from './white-dwarf-radius-nauenberg1972.ts';

describe('Roche lobe (Eggleton 1983, ApJ 268, 368)', () => {
  it.each([
    [0.1, 0.2068],
    [0.5, 0.3208],
    [1, 0.3789],
    [2, 0.44],
    [10, 0.5782],
  ])('q = %f gives r_L/a = %f (values evaluated from the published formula, 4 digits)', (q, expected) => {
    expect(rocheLobeFraction(q)).toBeCloseTo(expected, 4);
  });
  it('rejects a non-positive mass ratio with the parameter named', () => {
    expect(() => rocheLobeFraction(0)).toThrow(EngineError);
    expect(() => rocheLobeFraction(Number.NaN)).toThrow(/q = NaN/);
  });
});

describe('white-dwarf radius (Nauenberg 1972, ApJ 175, 417, M_Ch = 1.44)', () => {
  it('gives about 0.0125 Rsun at 0.6 Msun', () => {
    // DESIGN.md quotes R(0.6) ≈ 0.0125 Rsun; the formula gives 0.01244, so 1% covers the rounding.
    expect(Math.abs(whiteDwarfRadiusRsun(0.6) / 0.0125 - 1)).toBeLessThan(0.01);
  });
  it('shrinks with mass and vanishes at the Chandrasekhar mass', () => {
    expect(whiteDwarfRadiusRsun(1.2)).toBeLessThan(whiteDwarfRadiusRsun(0.6));
    // At 1.0 Msun: 0.0112 √((1/1.44)^(-2/3) − (1/1.44)^(2/3)), hand-evaluated = 0.00809.
    expect(whiteDwarfRadiusRsun(1)).toBeCloseTo(0.0112 * Math.sqrt(Math.pow(1 / 1.44, -2 / 3) - Math.pow(1 / 1.44, 2 / 3)), 10);
    expect(() => whiteDwarfRadiusRsun(1.5)).toThrow(/massMsun = 1.5/);
  });
});

describe('main-sequence and companion radii', () => {
  it('Demircan & Kahraman (1991): R = 1.06 M^0.945 below 1.66 Msun, 1.33 M^0.555 above', () => {
    expect(mainSequenceRadiusRsun(0.3)).toBeCloseTo(1.06 * Math.pow(0.3, 0.945), 12);
    expect(mainSequenceRadiusRsun(2)).toBeCloseTo(1.33 * Math.pow(2, 0.555), 12);
    // The Sun: the fit gives 1.06 Rsun (the fit's normalisation; the Sun itself is 1.00 — 6% is the fit's scatter).
    expect(Math.abs(mainSequenceRadiusRsun(1) - 1)).toBeLessThan(0.07);
  });
  it('companions below the hydrogen-burning limit have one Jupiter radius, and the two relations meet there', () => {
    expect(companionRadiusRsun(1e-3)).toBe(RJUP_RSUN);
    expect(companionRadiusRsun(0.05)).toBe(RJUP_RSUN);
    // Within 10% at 0.08 Msun (Chabrier & Baraffe 2000 Fig. 6: ~1 RJup at the limit, from memory).
    expect(Math.abs(companionRadiusRsun(0.0801) / RJUP_RSUN - 1)).toBeLessThan(0.1);
  });
});

describe('tidal disruption radius', () => {
  it('r_t = η R2 (M/M2)^(1/3): Jupiter around a 0.6 Msun core at η = 2.44 is ≈ 2.1 Rsun', () => {
    const mJup = 9.546e-4; // Jupiter/Sun mass ratio (IAU 2015, from memory)
    expect(tidalRadiusRsun(2.44, RJUP_RSUN, 0.6, mJup)).toBeCloseTo(2.44 * RJUP_RSUN * Math.cbrt(0.6 / mJup), 10);
    expect(tidalRadiusRsun(2.44, RJUP_RSUN, 0.6, mJup)).toBeGreaterThan(2.0);
    expect(tidalRadiusRsun(2.44, RJUP_RSUN, 0.6, mJup)).toBeLessThan(2.2);
  });
});
