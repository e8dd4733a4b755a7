import { colours } from '../../../tailwind.config.ts';

/**
 * Tidefield's categorical palette for chart series, drawn on card surfaces (ink-850).
 * Found by a constrained search and then named; chart-palette.test.ts checks that every pair
 * stays at least ΔE00 = 15 apart for normal vision and under simulated protanopia,
 * deuteranopia and tritanopia (Machado et al. 2009, severity 1), and that each colour has at
 * least 3:1 contrast with the surface (WCAG 2.2, 1.4.11 non-text contrast).
 * Use the colours in this order: the first ones are the most often needed.
 */
export const chartPalette = [
  { name: 'reef', hex: '#07ad82' },
  { name: 'lantern', hex: '#faa109' },
  { name: 'iris', hex: '#7965ee' },
  { name: 'ember', hex: '#d94f3a' },
  { name: 'frost', hex: '#c5cfff' },
  { name: 'heather', hex: '#ad89ad' },
  { name: 'primrose', hex: '#f3ffa9' },
  { name: 'shell', hex: '#edcfcf' },
] as const;

/** The series colour for the i-th category; wraps after eight (add a second cue by then). */
export function seriesColour(index: number): string {
  return chartPalette[((index % chartPalette.length) + chartPalette.length) % chartPalette.length].hex;
}

/** The non-data ink of a chart, from the theme: surface, text, axes and grid. */
export const chartInk = {
  background: colours.ink[850],
  text: colours.foam[50],
  mutedText: colours.foam[300],
  axis: colours.ink[500],
  grid: colours.ink[700],
} as const;
