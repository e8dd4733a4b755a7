import type { samples } from './samples.table.ts';

type LibraryEntry = Omit<typeof samples.$inferInsert, 'id' | 'departmentId' | 'ownerUserId' | 'createdAt' | 'updatedAt'> & { libraryKey: string };

/**
 * The read-only library of published constraints every department sees. Each entry states
 * only what its paper states: counts where the paper gives counts, otherwise the fraction
 * as quoted (with its uncertainty, or marked as a lower bound). Nothing here is invented or
 * converted into counts the paper does not give.
 */
export const PUBLISHED_CONSTRAINTS: LibraryEntry[] = [
  {
    libraryKey: 'tout2008-sdss-wd-dm',
    name: 'No strongly magnetic white dwarf among 1,253 with a detached M-dwarf companion (SDSS)',
    kind: 'counts',
    magnetic: 0,
    total: 1253,
    setting: 'detachedCompanion',
    fieldThresholdMG: 1,
    provenance:
      'Some 1,253 white dwarfs with a detached low-mass main-sequence companion identified in the Sloan Digital Sky Survey; none shows Zeeman-split hydrogen lines of a field above 1 MG (abstract). The same absence was first pointed out by Liebert et al. 2005, AJ 129, 2376.',
    citation: 'Tout C. A., Wickramasinghe D. T., Liebert J., Ferrario L., Pringle J. E., 2008, MNRAS, 387, 897 — "Binary star origin of high field magnetic white dwarfs"',
  },
  {
    libraryKey: 'liebert2003-at-least-10pc',
    name: 'At least ~10% of field white dwarfs have B ≳ 2 MG',
    kind: 'fraction',
    fraction: 0.1,
    lowerBound: true,
    setting: 'all',
    fieldThresholdMG: 2,
    provenance:
      'From the Palomar-Green, cool (Bergeron, Ruiz & Leggett) and local (Holberg, Oswalt & Sion) samples: "the true incidence of magnetism at the level of ~2 MG or greater is at least ~10%, and it could be higher" (abstract). A lower bound without a quoted uncertainty.',
    citation: 'Liebert J., Bergeron P., Holberg J. B., 2003, AJ, 125, 348 — "The True Incidence of Magnetism Among Field White Dwarfs"',
  },
  {
    libraryKey: 'jordan2007-about-10pc',
    name: 'About 10% of white dwarfs have fields above 1 MG',
    kind: 'fraction',
    fraction: 0.1,
    lowerBound: false,
    setting: 'all',
    fieldThresholdMG: 1,
    provenance:
      '"Current estimates find that about 10% of all white dwarfs have fields in excess of 1 MG" (abstract, summarising earlier surveys). Quoted without an uncertainty, so Tidefield reports the comparison without a p-value.',
    citation: 'Jordan S., Aznar Cuadrado R., Napiwotzki R., Schmid H. M., Solanki S. K., 2007, A&A, 462, 1097 — "The fraction of DA white dwarfs with kilo-Gauss magnetic fields"',
  },
  {
    libraryKey: 'landstreet-bagnulo2019-da-20pc',
    name: '20 ± 5% of DA white dwarfs within 20 pc are magnetic (mostly below 1 MG)',
    kind: 'fraction',
    fraction: 0.2,
    fractionSigma: 0.05,
    lowerBound: false,
    setting: 'all',
    provenance:
      'Preliminary frequency of magnetic fields among hydrogen-rich (DA) white dwarfs of the 20 pc volume: 20 ± 5%, mostly fields weaker than 1 MG (abstract). Compare with a threshold well below 1 MG.',
    citation: 'Landstreet J. D., Bagnulo S., 2019, A&A, 628, A1 — "A new weak-field magnetic DA white dwarf in the local 20 pc volume. The frequency of magnetic fields in DA stars"',
  },
  {
    libraryKey: 'bagnulo-landstreet2020-20pc',
    name: 'At least 20% of white dwarfs within 20 pc are magnetic',
    kind: 'fraction',
    fraction: 0.2,
    lowerBound: true,
    setting: 'all',
    provenance:
      'The spectropolarimetric survey of the local 20 pc volume "supports the view that at least 20% of all white dwarfs in the local 20 pc volume have magnetic fields", fields from a few MG to about 200 MG among the new discoveries and many weaker ones in the volume (abstract). A lower bound over all field strengths.',
    citation: 'Bagnulo S., Landstreet J. D., 2020, A&A, 643, A134 — "Discovery of six new strongly magnetic white dwarfs in the 20 pc local population"',
  },
  {
    libraryKey: 'ferrario2015-mean-masses',
    name: 'Magnetic white dwarfs are heavier: mean 0.784 vs 0.663 Msun',
    kind: 'meanMass',
    meanMassMagneticMsun: 0.784,
    meanMassMagneticSigma: 0.047,
    meanMassNonMagneticMsun: 0.663,
    meanMassNonMagneticSigma: 0.136,
    lowerBound: false,
    setting: 'all',
    provenance:
      'Mean mass of isolated magnetic white dwarfs 0.784 ± 0.047 Msun against 0.663 ± 0.136 Msun for non-magnetic ones, as given in the review; the ± are quoted as published.',
    citation: 'Ferrario L., de Martino D., Gänsicke B. T., 2015, Space Science Reviews, 191, 111 — "Magnetic White Dwarfs"',
  },
];
