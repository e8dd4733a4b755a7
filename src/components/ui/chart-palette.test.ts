import { describe, expect, it } from 'vitest';
import {
  contrastRatio,
  deltaE2000,
  hexToLab,
  simulateDeficiencyLab,
  type Deficiency,
} from '../../lib/colour-science.ts';
import { chartInk, chartPalette, seriesColour } from './chart-palette.ts';

/**
 * ΔE00 ≥ 15 between every pair: well beyond the ~1 of a just-noticeable difference and the
 * ~10 at which patches read as different colours, so that thin lines and small markers on a
 * dark surface still separate. A choice for this palette (common practice, no single source).
 */
const MIN_DELTA_E00 = 15;

const visions: { name: string; lab: (hex: string) => readonly [number, number, number] }[] = [
  { name: 'normal vision', lab: hexToLab },
  ...(['protan', 'deutan', 'tritan'] as Deficiency[]).map((kind) => ({
    name: `${kind}opia (Machado 2009, severity 1)`,
    lab: (hex: string) => simulateDeficiencyLab(hex, kind),
  })),
];

describe('chart palette', () => {
  for (const vision of visions) {
    it(`keeps every pair at least ΔE00 ${MIN_DELTA_E00} apart for ${vision.name}`, () => {
      const tooClose: string[] = [];
      chartPalette.forEach((a, i) =>
        chartPalette.slice(i + 1).forEach((b) => {
          const d = deltaE2000(vision.lab(a.hex), vision.lab(b.hex));
          if (d < MIN_DELTA_E00) tooClose.push(`${a.name}/${b.name}: ${d.toFixed(1)}`);
        }),
      );
      expect(tooClose).toEqual([]);
    });
  }

  it('gives every colour at least 3:1 contrast with the chart surface (WCAG 1.4.11)', () => {
    for (const { name, hex } of chartPalette) {
      expect(contrastRatio(hex, chartInk.background), name).toBeGreaterThanOrEqual(3);
    }
  });

  it('has unique names and hex values', () => {
    expect(new Set(chartPalette.map((c) => c.name)).size).toBe(chartPalette.length);
    expect(new Set(chartPalette.map((c) => c.hex)).size).toBe(chartPalette.length);
  });

  it('wraps series indices, negative ones included', () => {
    expect(seriesColour(0)).toBe(chartPalette[0].hex);
    expect(seriesColour(chartPalette.length + 2)).toBe(chartPalette[2].hex);
    expect(seriesColour(-1)).toBe(chartPalette[chartPalette.length - 1].hex);
  });
});
