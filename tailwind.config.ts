import type { Config } from 'tailwindcss';

/**
 * Tidefield's own night palette: deep sea-ink surfaces, warm foam text (less blue light at
 * night), a lantern amber for actions and focus. Every text/surface pair used by the UI is
 * checked for WCAG 2.2 contrast in src/components/ui/theme-contrast.test.ts.
 */
export const colours = {
  ink: {
    950: '#0b1217', // page background
    900: '#10191f', // navigation rail, input wells
    850: '#16222b', // cards
    800: '#1e2c37', // raised rows, table header, hover
    700: '#2b3d4a', // dividers
    600: '#3d5263', // quiet borders
    500: '#71889a', // input borders (≥ 3:1 on every surface)
  },
  foam: {
    50: '#f3efe6', // body text
    300: '#cfc8ba', // secondary text
    400: '#aca596', // hints, captions
  },
  lantern: {
    300: '#ffd48a', // focus ring, links
    400: '#f4b54a', // primary action
    500: '#dc9c33', // primary action, pressed
  },
  coral: { 300: '#ff9f90', 500: '#e2705f', 600: '#c95a4a' },
  kelp: { 300: '#8ddbb8', 500: '#3fa37c' },
  tide: { 300: '#a3cdf2', 500: '#4f8fc4' },
  dusk: { 300: '#cbb7f5', 500: '#8a6fd0' },
} as const;

export default {
  theme: {
    colors: {
      transparent: 'transparent',
      current: 'currentColor',
      ...colours,
    },
    fontFamily: {
      // The plain zero of prose first (it covers only U+0030; see src/index.css), then the text face.
      sans: ['"Tidefield Prose Zero"', '"Atkinson Hyperlegible"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      mono: ['ui-monospace', '"DejaVu Sans Mono"', 'Menlo', 'monospace'],
    },
    // Base 18 px: readable from a few metres away in a dim control room.
    fontSize: {
      xs: ['0.9375rem', { lineHeight: '1.4' }],
      sm: ['1rem', { lineHeight: '1.5' }],
      base: ['1.125rem', { lineHeight: '1.6' }],
      lg: ['1.25rem', { lineHeight: '1.5' }],
      xl: ['1.5rem', { lineHeight: '1.35' }],
      '2xl': ['1.875rem', { lineHeight: '1.25' }],
      '3xl': ['2.25rem', { lineHeight: '1.2' }],
    },
    borderRadius: {
      none: '0',
      sm: '0.25rem',
      DEFAULT: '0.375rem',
      md: '0.5rem',
      lg: '0.75rem',
      xl: '1.125rem',
      full: '9999px',
    },
  },
} satisfies Config;
