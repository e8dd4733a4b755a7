import { describe, expect, it } from 'vitest';
import {
  converter,
  differenceCiede2000,
  filterDeficiencyDeuter,
  filterDeficiencyProt,
  filterDeficiencyTrit,
  wcagContrast,
  type Color,
} from 'culori';
import { chartInk, chartPalette, seriesColour } from './chart-palette.ts';

/**
 * ΔE00 ≥ 15 between every pair: well beyond the ~1 of a just-noticeable difference and the
 * ~10 at which patches read as different colours, so that thin lines and small markers on a
 * dark surface still separate. A choice for this palette (common practice, no single source).
 */
const MIN_DELTA_E00 = 15;

// Colour science from culori (a reference library): CIEDE2000 after Sharma, Wu & Dalal 2005
// (Color Res. Appl. 30, 21), WCAG 2.2 contrast, and the Machado, Oliveira & Fernandes 2009
// (IEEE TVCG 15, 1291) dichromat matrices at severity 1.
const deltaE2000 = differenceCiede2000();
const toLinear = converter('lrgb');
const deficiencies = { protan: filterDeficiencyProt(1), deutan: filterDeficiencyDeuter(1), tritan: filterDeficiencyTrit(1) };

/**
 * What a dichromat sees: Machado's matrices act on linear RGB, while culori's filters apply them
 * to whatever r, g, b they are given, so the linear values go in labelled as 'rgb' and come out
 * re-labelled as linear, clipped to the gamut.
 */
function simulate(hex: string, kind: keyof typeof deficiencies): Color {
  const { r, g, b } = toLinear(hex) ?? { r: 0, g: 0, b: 0 };
  const seen = deficiencies[kind]({ mode: 'rgb', r, g, b }) as { r: number; g: number; b: number };
  const clip = (v: number) => Math.min(1, Math.max(0, v));
  return { mode: 'lrgb', r: clip(seen.r), g: clip(seen.g), b: clip(seen.b) };
}

const visions: { name: string; colour: (hex: string) => Color | string }[] = [
  { name: 'normal vision', colour: (hex) => hex },
  ...(['protan', 'deutan', 'tritan'] as const).map((kind) => ({
    name: `${kind}opia (Machado 2009, severity 1)`,
    colour: (hex: string) => simulate(hex, kind),
  })),
];

describe('chart palette', () => {
  for (const vision of visions) {
    it(`keeps every pair at least ΔE00 ${MIN_DELTA_E00} apart for ${vision.name}`, () => {
      const tooClose: string[] = [];
      chartPalette.forEach((a, i) =>
        chartPalette.slice(i + 1).forEach((b) => {
          const d = deltaE2000(vision.colour(a.hex), vision.colour(b.hex));
          if (d < MIN_DELTA_E00) tooClose.push(`${a.name}/${b.name}: ${d.toFixed(1)}`);
        }),
      );
      expect(tooClose).toEqual([]);
    });
  }

  it('gives every colour at least 3:1 contrast with the chart surface (WCAG 1.4.11)', () => {
    for (const { name, hex } of chartPalette) {
      expect(wcagContrast(hex, chartInk.background), name).toBeGreaterThanOrEqual(3);
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
