import { seriesColour } from '../ui/chart-palette.ts';

/**
 * Names and colours of the categories a run's result is split into, so that the run page and
 * the comparison page draw each one alike. A colour keeps one meaning across charts: the
 * disrupted fate and the disruption channel share one, the merged fate and the core merger
 * another, and the surviving fates share theirs with the settings they produce.
 */
export interface ResultSeries<K extends string> {
  key: K;
  /** In sentences and legends: "white dwarfs with a wide companion". */
  label: string;
  /** On an axis or in a tight legend. */
  short: string;
  colour: string;
}

export const SETTING_SERIES: readonly ResultSeries<'single' | 'wide' | 'postCE'>[] = [
  { key: 'single', label: 'Single (no surviving companion)', short: 'Single', colour: seriesColour(4) },
  { key: 'wide', label: 'With a wide companion (never engulfed)', short: 'Wide companion', colour: seriesColour(0) },
  { key: 'postCE', label: 'With a post-common-envelope companion', short: 'Post-CE companion', colour: seriesColour(1) },
];

export const CHANNEL_SERIES: readonly ResultSeries<'disruption' | 'coreMerger' | 'fossil'>[] = [
  { key: 'disruption', label: 'Tidal disruption of a companion', short: 'Disruption', colour: seriesColour(3) },
  { key: 'coreMerger', label: 'Companion merged with the core', short: 'Core merger', colour: seriesColour(2) },
  { key: 'fossil', label: 'Fossil main-sequence field', short: 'Fossil', colour: seriesColour(5) },
];

export const FATE_SERIES: readonly ResultSeries<'wide' | 'postCE' | 'disrupted' | 'merged'>[] = [
  { key: 'wide', label: 'Survives on a wide orbit', short: 'Wide', colour: seriesColour(0) },
  { key: 'postCE', label: 'Survives the common envelope', short: 'Post-CE', colour: seriesColour(1) },
  { key: 'disrupted', label: 'Tidally disrupted', short: 'Disrupted', colour: seriesColour(3) },
  { key: 'merged', label: 'Merged with the core', short: 'Merged', colour: seriesColour(2) },
];

/** Magnetic and non-magnetic white dwarfs in one chart. */
export const MAGNETIC_SERIES = {
  magnetic: { label: 'Magnetic', colour: seriesColour(1) },
  nonMagnetic: { label: 'Not magnetic', colour: seriesColour(4) },
} as const;

/** The colour of the i-th run of a comparison (A, B, C, D). */
export function runColour(index: number): string {
  return seriesColour(index);
}

/** "A", "B", … for the runs of a comparison, so that legends stay short and unambiguous. */
export function runLetter(index: number): string {
  return String.fromCharCode(65 + index);
}
