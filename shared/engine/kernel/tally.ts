import { ENGINE_VERSION } from '../version.ts';
import { BINS, CHANNELS, FATES, SETTINGS } from './bins.ts';

/**
 * Integer counts from one chunk or from any number of chunks summed. Plain JSON (numbers and
 * arrays of numbers), so the server can store running totals and resume. Every entry is an
 * integer below 2^53, so sums are exact and independent of the order of addition.
 */
export interface ChunkTally {
  engineVersion: string;
  scenarioHash: string;
  /** Chunks summed into this tally. */
  chunks: number;
  /** Primaries drawn. */
  systems: number;
  /** Primaries that are white dwarfs today (before any selection). */
  whiteDwarfsFormed: number;
  /** White dwarfs in the sample (after selection). */
  whiteDwarfs: number;
  magnetic: number;
  /** Magnetic white dwarfs by channel, in CHANNELS order. */
  byChannel: number[];
  /** White dwarfs by setting, in SETTINGS order. */
  settingWhiteDwarfs: number[];
  /** Magnetic white dwarfs by setting, in SETTINGS order. */
  settingMagnetic: number[];
  /** Magnetic white dwarfs, index channel · 3 + setting. */
  channelBySetting: number[];
  /** Companions present (at the run's multiplier) around sampled white dwarfs, by fate. */
  companionFates: number[];
  wdMassMagnetic: number[];
  wdMassNonMagnetic: number[];
  /** log10 field of every sampled white dwarf with a field, magnetic or below the threshold. */
  logField: number[];
  /** The same by the channel that made the field, index channel · fieldBins + bin. */
  logFieldByChannel: number[];
  /** White-dwarf mass by setting and magnetism, index (setting · 2 + (magnetic ? 0 : 1)) · massBins + bin. */
  wdMassBySetting: number[];
  /** log10 cooling age, index (magnetic ? 0 : 1) · bins + bin. */
  coolingAge: number[];
  /** log10 final period of the post-CE companion of post-CE white dwarfs, index (magnetic ? 0 : 1) · bins + bin. */
  postCEPeriod: number[];
  /** Sampled white dwarfs with a helium core (envelope ejected on the red giant branch). */
  heliumWhiteDwarfs: number;
  /** Fate map, index (fate · massBins + massBin) · periodBins + periodBin. */
  fateMap: number[];
  /** log10 final separation of surviving companions, index setting' · bins + bin (wide, postCE). */
  survivorSeparation: number[];
  /** White dwarfs magnetic at any multiplier (fossil fields). */
  multiplierFossil: number;
  /** White dwarfs by the smallest multiplier at which they become magnetic, on [0, m_max]. */
  multiplierBins: number[];
}

/** The array fields of a tally, in a fixed order (the packed layout of packed-tally.ts follows it). */
export const ARRAY_FIELDS = [
  'byChannel',
  'settingWhiteDwarfs',
  'settingMagnetic',
  'channelBySetting',
  'companionFates',
  'wdMassMagnetic',
  'wdMassNonMagnetic',
  'logField',
  'logFieldByChannel',
  'wdMassBySetting',
  'coolingAge',
  'postCEPeriod',
  'fateMap',
  'survivorSeparation',
  'multiplierBins',
] as const;
/** The scalar counts of a tally, in a fixed order. */
export const SCALAR_FIELDS = ['chunks', 'systems', 'whiteDwarfsFormed', 'whiteDwarfs', 'magnetic', 'heliumWhiteDwarfs', 'multiplierFossil'] as const;

/** An all-zero tally for the scenario with this hash. */
export function emptyTallyFor(scenarioHash: string): ChunkTally {
  const zeros = (n: number) => new Array<number>(n).fill(0);
  return {
    engineVersion: ENGINE_VERSION,
    scenarioHash,
    chunks: 0,
    systems: 0,
    whiteDwarfsFormed: 0,
    whiteDwarfs: 0,
    magnetic: 0,
    byChannel: zeros(CHANNELS.length),
    settingWhiteDwarfs: zeros(SETTINGS.length),
    settingMagnetic: zeros(SETTINGS.length),
    channelBySetting: zeros(CHANNELS.length * SETTINGS.length),
    companionFates: zeros(FATES.length),
    wdMassMagnetic: zeros(BINS.wdMassMsun.count),
    wdMassNonMagnetic: zeros(BINS.wdMassMsun.count),
    logField: zeros(BINS.log10FieldMG.count),
    logFieldByChannel: zeros(CHANNELS.length * BINS.log10FieldMG.count),
    wdMassBySetting: zeros(SETTINGS.length * 2 * BINS.wdMassMsun.count),
    coolingAge: zeros(2 * BINS.log10CoolingAgeGyr.count),
    postCEPeriod: zeros(2 * BINS.log10PostCEPeriodDays.count),
    heliumWhiteDwarfs: 0,
    fateMap: zeros(FATES.length * BINS.log10CompanionMsun.count * BINS.log10PeriodDays.count),
    survivorSeparation: zeros(2 * BINS.log10SeparationAU.count),
    multiplierFossil: 0,
    multiplierBins: zeros(BINS.multiplierBins),
  };
}

/** Exact element-wise sum of two tallies of the same scenario and engine version (inputs untouched). */
export function addTally(a: ChunkTally, b: ChunkTally): ChunkTally {
  return addTallyInto(structuredClone(a), b);
}

/**
 * Adds `b` into `target` in place and returns `target`: the allocation-free form of addTally for
 * running sums that the caller owns (the pool runner and the workers' batch sums).
 */
export function addTallyInto(target: ChunkTally, b: ChunkTally): ChunkTally {
  if (target.engineVersion !== b.engineVersion) throw new Error(`cannot add tallies of engine ${target.engineVersion} and ${b.engineVersion}`);
  if (target.scenarioHash !== b.scenarioHash) throw new Error(`cannot add tallies of scenarios ${target.scenarioHash} and ${b.scenarioHash}`);
  for (const key of ARRAY_FIELDS) {
    if (target[key].length !== b[key].length) throw new Error(`cannot add tallies: ${key} has ${target[key].length} and ${b[key].length} entries`);
  }
  return addCountsInto(target, b);
}

/** Adds every count of `b` into `target` in place (no checks: the caller knows both have one layout). */
export function addCountsInto(target: ChunkTally, b: ChunkTally): ChunkTally {
  for (const key of SCALAR_FIELDS) target[key] += b[key];
  for (const key of ARRAY_FIELDS) {
    const x = target[key];
    const y = b[key];
    for (let i = 0; i < x.length; i++) x[i] += y[i];
  }
  return target;
}
