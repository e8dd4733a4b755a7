import type { LibraryConstraint } from '../../../shared/contracts/constraints.ts';
import { observedConstraintSchema } from '../../../shared/contracts/constraints.ts';
import { PUBLISHED_CONSTRAINTS } from '../samples/library.ts';

const cite = (key: string) => {
  const entry = PUBLISHED_CONSTRAINTS.find((e) => e.libraryKey === key);
  if (!entry?.citation) throw new Error(`library: no published sample ${key}`);
  return entry.citation;
};

/**
 * The read-only library of published constraints, each entered as its paper states it, with the
 * citations of the samples library (server/modules/samples/library.ts) so that both agree. What
 * Tidefield assumed in reading a paper is said in `provenance`; values not re-read are marked
 * `fromMemory`. The whole library is also a constraint set with the id "library".
 */
const ENTRIES: LibraryConstraint[] = [
  {
    id: 'tout2008-wd-dm-zero',
    name: 'No magnetic white dwarf among 1,253 with a detached M-dwarf companion',
    constraint: { kind: 'fraction', setting: 'postCE', magnetic: 0, total: 1253, fieldThresholdMG: 1 },
    citation: cite('tout2008-sdss-wd-dm'),
    provenance:
      'SDSS white dwarfs with a detached low-mass main-sequence companion; none shows a field above ~1 MG (abstract; first noted by Liebert et al. 2005, AJ 129, 2376). ' +
      "Compared with the model's post-common-envelope setting, the close binaries that dominate such spectroscopic samples (Tidefield's reading).",
    fromMemory: false,
  },
  {
    id: 'jordan2007-about-10pc',
    name: 'About 10% of white dwarfs have fields above 1 MG',
    constraint: { kind: 'fraction', setting: 'all', value: 0.1, error: 0.02, fieldThresholdMG: 1 },
    citation: cite('jordan2007-about-10pc'),
    provenance:
      '"About 10% of all white dwarfs have fields in excess of 1 MG" (abstract). The paper quotes no uncertainty; the ± 2% is Tidefield\'s reading of ' +
      '"about 10%" (one significant figure), not the paper\'s — copy the set and change it if you read it differently.',
    fromMemory: false,
  },
  {
    id: 'landstreet-bagnulo2019-da-20pc',
    name: '20 ± 5% of DA white dwarfs within 20 pc are magnetic (mostly below 1 MG)',
    constraint: { kind: 'fraction', setting: 'all', value: 0.2, error: 0.05, fieldThresholdMG: 0.03 },
    citation: cite('landstreet-bagnulo2019-da-20pc'),
    provenance:
      '20 ± 5% of the DA white dwarfs of the 20 pc volume have fields, mostly weaker than 1 MG (abstract). Fields down to some tens of kG count, so the ' +
      'threshold is entered as 0.03 MG (Tidefield\'s reading of "mostly weaker than 1 MG"); compare with a run of a matching field.thresholdMG.',
    fromMemory: false,
  },
  {
    id: 'bagnulo-landstreet2020-20pc-lower',
    name: 'At least 20% of white dwarfs within 20 pc are magnetic',
    constraint: { kind: 'fraction', setting: 'all', value: 0.2, bound: 'lower' },
    citation: cite('bagnulo-landstreet2020-20pc'),
    provenance: '"At least 20% of all white dwarfs in the local 20 pc volume have magnetic fields" (abstract): a lower bound over all field strengths, without an uncertainty.',
    fromMemory: false,
  },
  {
    id: 'liebert2003-at-least-10pc',
    name: 'At least ~10% of field white dwarfs have B ≳ 2 MG',
    constraint: { kind: 'fraction', setting: 'all', value: 0.1, bound: 'lower', fieldThresholdMG: 2 },
    citation: cite('liebert2003-at-least-10pc'),
    provenance: '"The true incidence of magnetism at the level of ~2 MG or greater is at least ~10%" (abstract): a lower bound without an uncertainty.',
    fromMemory: false,
  },
  {
    id: 'ferrario2015-mean-mass-magnetic',
    name: 'Mean mass of isolated magnetic white dwarfs 0.784 ± 0.047 Msun',
    constraint: { kind: 'meanMass', population: 'magnetic', setting: 'all', meanMsun: 0.784, errorMsun: 0.047 },
    citation: cite('ferrario2015-mean-masses'),
    provenance: 'Mean mass of isolated magnetic white dwarfs as given in the review, with its ± as published (taken as the error of the mean).',
    fromMemory: true,
  },
  {
    id: 'ferrario2015-mean-mass-nonmagnetic',
    name: 'Mean mass of non-magnetic white dwarfs 0.663 ± 0.136 Msun',
    constraint: { kind: 'meanMass', population: 'nonMagnetic', setting: 'all', meanMsun: 0.663, errorMsun: 0.136 },
    citation: cite('ferrario2015-mean-masses'),
    provenance: 'Mean mass of non-magnetic white dwarfs as given in the review, with its ± as published (the ± looks like a spread rather than an error of the mean; kept as published).',
    fromMemory: true,
  },
];

/** Parsed once, so that defaults are filled in exactly as for a department's own constraints. */
export const CONSTRAINT_LIBRARY: LibraryConstraint[] = ENTRIES.map((e) => ({ ...e, constraint: observedConstraintSchema.parse(e.constraint) }));

export function libraryConstraint(id: string): LibraryConstraint | undefined {
  return CONSTRAINT_LIBRARY.find((e) => e.id === id);
}
