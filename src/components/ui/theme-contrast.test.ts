import { describe, expect, it } from 'vitest';
import { colours } from '../../../tailwind.config.ts';
import { formatHex, parse, wcagContrast, type Rgb } from 'culori';

const { ink, foam, lantern, coral, kelp, tide, dusk } = colours;

// WCAG 2.2 contrast ratio from culori (a reference library).
const contrastRatio = wcagContrast;

/** The colour of `top` at `alpha` over `base`, as the browser composites a tinted badge (in encoded sRGB). */
function over(top: string, alpha: number, base: string): string {
  const [t, b] = [parse(top) as Rgb, parse(base) as Rgb];
  const mix = (x: number, y: number) => alpha * x + (1 - alpha) * y;
  return formatHex({ mode: 'rgb', r: mix(t.r, b.r), g: mix(t.g, b.g), b: mix(t.b, b.b) });
}

const surfaces = { 'ink-950': ink[950], 'ink-900': ink[900], 'ink-850': ink[850], 'ink-800': ink[800] };

// WCAG 2.2 AA: 4.5:1 for text (1.4.3), 3:1 for component boundaries and focus rings (1.4.11).
const TEXT = 4.5;
const NON_TEXT = 3;

describe('theme contrast (WCAG 2.2 AA)', () => {
  const text = { 'foam-50': foam[50], 'foam-300': foam[300], 'foam-400': foam[400], 'lantern-300': lantern[300], 'coral-300': coral[300] };
  for (const [textName, textHex] of Object.entries(text)) {
    for (const [surfaceName, surfaceHex] of Object.entries(surfaces)) {
      it(`${textName} text on ${surfaceName}`, () => {
        expect(contrastRatio(textHex, surfaceHex)).toBeGreaterThanOrEqual(TEXT);
      });
    }
  }

  it('body text reaches AAA (7:1) on every surface', () => {
    for (const surface of Object.values(surfaces)) expect(contrastRatio(foam[50], surface)).toBeGreaterThanOrEqual(7);
  });

  it('dark label text on filled buttons, in every state', () => {
    for (const fill of [lantern[300], lantern[400], lantern[500], coral[300], coral[500], coral[600]]) {
      expect(contrastRatio(ink[950], fill), fill).toBeGreaterThanOrEqual(TEXT);
    }
  });

  it('badge text on its own 12% tint over cards and raised rows', () => {
    for (const tone of [foam[300], dusk[300], tide[300], kelp[300], lantern[300], coral[300]]) {
      for (const base of [ink[850], ink[800]]) {
        expect(contrastRatio(tone, over(tone, 0.12, base)), `${tone} on ${base}`).toBeGreaterThanOrEqual(TEXT);
      }
    }
  });

  it('input borders and the focus ring stand out from every surface', () => {
    for (const surface of Object.values(surfaces)) {
      expect(contrastRatio(ink[500], surface)).toBeGreaterThanOrEqual(NON_TEXT);
      expect(contrastRatio(lantern[300], surface)).toBeGreaterThanOrEqual(NON_TEXT);
    }
  });
});
