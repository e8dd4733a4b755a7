import { describe, expect, it } from 'vitest';
import { publishedIfmrPieces } from './ifmr-relations.ts';
import { finalMassMsun, MAX_WHITE_DWARF_MSUN } from '../engine/physics/ifmr-piecewise.ts';
import { ifmrFromTable } from '../engine/physics/ifmr-table.ts';

const KALIRAI_2008 = publishedIfmrPieces({ relation: 'kalirai2008' });
const CUMMINGS_2018 = { mist: publishedIfmrPieces({ relation: 'cummings2018', calibration: 'mist' }), parsec: publishedIfmrPieces({ relation: 'cummings2018', calibration: 'parsec' }) };

describe('initial–final mass relations', () => {
  it('Kalirai et al. 2008 linear fit (Mf = 0.109 Mi + 0.394) at the cluster masses', () => {
    // Hand-evaluated from the printed coefficients; 1e-12 is rounding.
    for (const [mi, mf] of [[1.16, 0.52044], [2, 0.612], [3, 0.721], [4, 0.83], [6.5, 1.1025]]) {
      expect(finalMassMsun(KALIRAI_2008, mi)).toBeCloseTo(mf, 12);
    }
    // The paper's lowest-mass point (Mi ≈ 1.16 → Mf ≈ 0.53, as quoted in DESIGN.md) lies within the
    // fit's intercept uncertainty of ±0.025 Msun.
    expect(Math.abs(finalMassMsun(KALIRAI_2008, 1.16) - 0.53)).toBeLessThan(0.025);
  });

  it('Cummings et al. 2018 MIST-based relation on each branch and continuous at the breaks', () => {
    const mist = CUMMINGS_2018.mist;
    for (const [mi, mf] of [[1, 0.569], [2.85, 0.717], [3.2, 0.7824], [5, 1.006], [7.2, 1.2414]]) {
      expect(finalMassMsun(mist, mi)).toBeCloseTo(mf, 3); // printed coefficients have 3 decimals
    }
    // The published pieces meet at 2.85 and 3.60 Msun to within the last printed digit (0.001).
    expect(Math.abs(0.08 * 2.85 + 0.489 - (0.187 * 2.85 + 0.184))).toBeLessThan(1e-3);
    expect(Math.abs(0.187 * 3.6 + 0.184 - (0.107 * 3.6 + 0.471))).toBeLessThan(2e-3);
  });

  it('Cummings et al. 2018 PARSEC-based relation', () => {
    const parsec = CUMMINGS_2018.parsec;
    for (const [mi, mf] of [[1, 0.5633], [3, 0.753], [5, 0.9825], [8.2, 1.2497]]) {
      expect(finalMassMsun(parsec, mi)).toBeCloseTo(mf, 3);
    }
  });

  it('a user table interpolates linearly and extends its end segments', () => {
    const t = ifmrFromTable([{ initialMsun: 1, finalMsun: 0.55 }, { initialMsun: 3, finalMsun: 0.75 }, { initialMsun: 6, finalMsun: 1.05 }]);
    expect(finalMassMsun(t, 2)).toBeCloseTo(0.65, 12);
    expect(finalMassMsun(t, 4.5)).toBeCloseTo(0.9, 12);
    expect(finalMassMsun(t, 0.5)).toBeCloseTo(0.5, 12);
    expect(finalMassMsun(t, 7)).toBeCloseTo(1.15, 12);
  });

  it('caps white dwarfs below the Chandrasekhar mass', () => {
    expect(finalMassMsun(KALIRAI_2008, 20)).toBe(MAX_WHITE_DWARF_MSUN);
  });
});
