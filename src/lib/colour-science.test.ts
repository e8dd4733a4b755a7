import { describe, expect, it } from 'vitest';
import {
  MACHADO_2009,
  contrastRatio,
  deltaE2000,
  hexToLab,
  linearRgbToLab,
  relativeLuminance,
  simulateDeficiency,
  simulateDeficiencyLab,
  type Lab,
  type Rgb,
} from './colour-science.ts';

describe('CIEDE2000', () => {
  // Test pairs 1, 2, 3, 4, 7 and 13 of Sharma, Wu & Dalal 2005, Table 1 (ΔE00 to 4 decimals).
  const pairs: [Lab, Lab, number][] = [
    [[50, 2.6772, -79.7751], [50, 0, -82.7485], 2.0425],
    [[50, 3.1571, -77.2803], [50, 0, -82.7485], 2.8615],
    [[50, 2.8361, -74.02], [50, 0, -82.7485], 3.4412],
    [[50, -1.3802, -84.2814], [50, 0, -82.7485], 1.0],
    [[50, 0, 0], [50, -1, 2], 2.3669],
    [[50, 2.49, -0.001], [50, -2.49, 0.0009], 7.1792],
  ];
  it.each(pairs)('%j vs %j → %f', (a, b, expected) => {
    expect(deltaE2000(a, b)).toBeCloseTo(expected, 4);
    expect(deltaE2000(b, a)).toBeCloseTo(expected, 4);
  });

  it('is zero for identical colours', () => {
    expect(deltaE2000([62, 10, -20], [62, 10, -20])).toBe(0);
  });
});

describe('CIELAB and WCAG contrast', () => {
  it('maps white and black to L* 100 and 0 (D65 white point)', () => {
    const white = hexToLab('#ffffff');
    expect(white[0]).toBeCloseTo(100, 2);
    expect(Math.abs(white[1]) + Math.abs(white[2])).toBeLessThan(0.05);
    expect(hexToLab('#000000')[0]).toBeCloseTo(0, 6);
  });

  it('gives 21:1 for black on white and 4.48:1 for #777 on white (WCAG 2.2 definition)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrastRatio('#ffffff', '#777777')).toBeCloseTo(4.48, 2);
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 6);
  });

  it('rejects what is not #rrggbb', () => {
    expect(() => hexToLab('teal')).toThrow('colour = "teal" is not a #rrggbb hex colour');
  });
});

describe('colour-vision deficiency (Machado et al. 2009, severity 1)', () => {
  it('leaves greys grey: each matrix row sums to 1', () => {
    for (const kind of ['protan', 'deutan', 'tritan'] as const) {
      const [l, a, b] = simulateDeficiencyLab('#808080', kind);
      expect(l).toBeCloseTo(hexToLab('#808080')[0], 1);
      expect(Math.hypot(a, b)).toBeLessThan(0.5);
    }
  });

  it('collapses a protan or deutan confusion line to one colour, as a dichromat sees it', () => {
    // Protanopia and deuteranopia are 2-D colour spaces: the matrices are singular, and colours
    // that differ only along the null direction look the same. Tritanopia is only approximated
    // by a full-rank matrix in the paper, so it is not tested this way.
    for (const kind of ['protan', 'deutan'] as const) {
      const [r0, r1] = MACHADO_2009[kind];
      const n = [r0[1] * r1[2] - r0[2] * r1[1], r0[2] * r1[0] - r0[0] * r1[2], r0[0] * r1[1] - r0[1] * r1[0]];
      const scale = 0.12 / Math.hypot(...n);
      const a: Rgb = [0.3 + n[0] * scale, 0.3 + n[1] * scale, 0.3 + n[2] * scale];
      const b: Rgb = [0.3 - n[0] * scale, 0.3 - n[1] * scale, 0.3 - n[2] * scale];
      expect(deltaE2000(linearRgbToLab(a), linearRgbToLab(b))).toBeGreaterThan(15);
      expect(deltaE2000(linearRgbToLab(simulateDeficiency(a, kind)), linearRgbToLab(simulateDeficiency(b, kind)))).toBeLessThan(0.5);
    }
  });
});
