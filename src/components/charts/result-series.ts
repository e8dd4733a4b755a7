import { seriesColour } from '../ui/chart-palette.ts';

/**
 * Names and colours of the categories a run's result is split into, so that the run page and
 * the comparison page draw each one alike. A colour keeps one meaning across charts: the
 * disrupted fate and the disruption channel share one, the post-CE fate, setting and close-survivor
 * channel another, and the surviving fates share theirs with the settings they produce. Entries
 * marked `engine1` exist only in results stored before engine 2: `presentSeries` drops whatever a
 * result does not carry.
 */
export interface ResultSeries<K extends string> {
  key: K;
  /** In sentences and legends: "white dwarfs with a wide companion". */
  label: string;
  /** On an axis or in a tight legend. */
  short: string;
  colour: string;
  /** Only in engine-1 results (a category engine 2 removed). */
  engine1?: boolean;
}

/** The series a result carries: engine-2 results lack the engine-1 categories and vice versa. */
export function presentSeries<K extends string>(series: readonly ResultSeries<K>[], values: Partial<Record<K, unknown>>): ResultSeries<K>[] {
  return series.filter((s) => values[s.key] !== undefined);
}

export const SETTING_SERIES: readonly ResultSeries<'single' | 'wide' | 'postCE'>[] = [
  { key: 'single', label: 'Single (no surviving companion)', short: 'Single', colour: seriesColour(4) },
  { key: 'wide', label: 'With a wide companion (never engulfed)', short: 'Wide companion', colour: seriesColour(0) },
  { key: 'postCE', label: 'With a post-common-envelope companion', short: 'Post-CE companion', colour: seriesColour(1) },
];

export const CHANNEL_SERIES: readonly ResultSeries<'disruption' | 'closeSurvivor' | 'fossil' | 'coreMerger'>[] = [
  { key: 'disruption', label: 'Companion destroyed in the common envelope (debris-disc dynamo)', short: 'Disruption', colour: seriesColour(3) },
  { key: 'closeSurvivor', label: 'Close post-common-envelope survivor', short: 'Close survivor', colour: seriesColour(1) },
  { key: 'fossil', label: 'Fossil main-sequence field', short: 'Fossil', colour: seriesColour(5) },
  { key: 'coreMerger', label: 'Companion merged with the core (engine 1)', short: 'Core merger', colour: seriesColour(2), engine1: true },
];

export const FATE_SERIES: readonly ResultSeries<'wide' | 'postCE' | 'disrupted' | 'dissolved' | 'merged'>[] = [
  { key: 'wide', label: 'Survives on a wide orbit', short: 'Wide', colour: seriesColour(0) },
  { key: 'postCE', label: 'Survives the common envelope', short: 'Post-CE', colour: seriesColour(1) },
  { key: 'disrupted', label: 'Destroyed in the envelope, shredded near the core', short: 'Disrupted', colour: seriesColour(3) },
  { key: 'dissolved', label: 'Dissolved in the envelope (no field)', short: 'Dissolved', colour: seriesColour(2) },
  { key: 'merged', label: 'Merged with the core (engine 1)', short: 'Merged', colour: seriesColour(6), engine1: true },
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
