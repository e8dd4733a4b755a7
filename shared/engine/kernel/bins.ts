/** A uniform binning: `count` bins of equal width from `lo` to `hi`. */
export interface UniformBins {
  lo: number;
  hi: number;
  count: number;
}

/** The histograms every run fills (part of the engine version: changing them changes results). */
export const BINS = {
  /** White-dwarf mass, Msun (from 0.1: helium white dwarfs of red-giant-branch ejections). */
  wdMassMsun: { lo: 0.1, hi: 1.4, count: 65 },
  /** log10 of the cooling age in Gyr, 1 Myr to 14 Gyr. */
  log10CoolingAgeGyr: { lo: -3, hi: Math.log10(14), count: 50 },
  /** log10 of a post-common-envelope companion's final period in days, 0.01 to 10^4 d. */
  log10PostCEPeriodDays: { lo: -2, hi: 4, count: 60 },
  /** log10 of the field in MG. */
  log10FieldMG: { lo: -3, hi: 5, count: 80 },
  /** log10 of the companion mass in Msun (fate map, first axis). */
  log10CompanionMsun: { lo: -4, hi: 1, count: 20 },
  /** log10 of the initial period in days (fate map, second axis). */
  log10PeriodDays: { lo: -1, hi: 11, count: 24 },
  /** log10 of a surviving companion's final separation in AU. */
  log10SeparationAU: { lo: -3, hi: 5, count: 80 },
  /** Bins of the smallest multiplier at which a white dwarf becomes magnetic, on [0, m_max]. */
  multiplierBins: 256,
} as const satisfies Record<string, UniformBins | number>;

/** Fates of one companion, in the order of the fate map's first index. */
export const FATES = ['wide', 'postCE', 'disrupted', 'dissolved'] as const;
/** Where a white dwarf's companions leave it, in tally order. */
export const SETTINGS = ['single', 'wide', 'postCE'] as const;
/** Channels that make a magnetic white dwarf, in tally order. */
export const CHANNELS = ['disruption', 'closeSurvivor', 'fossil'] as const;

/** Bin index of x, values outside the range going to the first or last bin. */
export function binIndex(bins: UniformBins, x: number): number {
  const i = Math.floor(((x - bins.lo) / (bins.hi - bins.lo)) * bins.count);
  return i < 0 ? 0 : i >= bins.count ? bins.count - 1 : i;
}

/** The count + 1 edges of a uniform binning. */
export function binEdges(bins: UniformBins): number[] {
  const width = (bins.hi - bins.lo) / bins.count;
  return Array.from({ length: bins.count + 1 }, (_, i) => roundEdge(bins.lo + i * width));
}

function roundEdge(x: number): number {
  return Math.round(x * 1e9) / 1e9; // edges print as 0.22, not 0.22000000000000003
}
