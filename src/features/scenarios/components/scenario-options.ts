import type { DraftPath } from './scenario-draft.ts';

/**
 * The choices of every discriminated union in the scenario document, in the builder's words:
 * what each option is, its published source as a short reference, and the values it starts
 * with when chosen (the schema's defaults, or a published example where the schema has none).
 * The templates are checked against the schema in scenario-options.test.ts.
 */
export interface KindOption {
  value: string;
  label: string;
  /** Short reference to the published source ("Kalirai et al. 2008, ApJ 676, 594"). */
  reference?: string;
  /** One line on what the option does. */
  summary: string;
  /** The object placed in the document when the option is chosen. */
  template: Record<string, unknown>;
}

export interface KindChoice {
  /** Where the union sits in the document. */
  path: DraftPath;
  /** Its discriminator key ("law", "kind", "relation"). */
  discriminator: string;
  options: readonly KindOption[];
}

export const IMF_CHOICE: KindChoice = {
  path: ['primaries', 'imf'],
  discriminator: 'law',
  options: [
    {
      value: 'kroupa2001',
      label: 'Kroupa',
      reference: 'Kroupa 2001, MNRAS 322, 231',
      summary: 'Broken power law: slopes 0.3, 1.3 and 2.3 with breaks at 0.08 and 0.5 Msun.',
      template: { law: 'kroupa2001' },
    },
    {
      value: 'salpeter1955',
      label: 'Salpeter',
      reference: 'Salpeter 1955, ApJ 121, 161',
      summary: 'Single power law dN/dM ∝ M^−2.35.',
      template: { law: 'salpeter1955' },
    },
    {
      value: 'chabrier2003',
      label: 'Chabrier, single stars',
      reference: 'Chabrier 2003, PASP 115, 763',
      summary: 'Log-normal below 1 Msun, power law above.',
      template: { law: 'chabrier2003' },
    },
    {
      value: 'powerlaw',
      label: 'Power law (your slope)',
      summary: 'dN/dM ∝ M^−slope; Salpeter’s slope is 2.35.',
      template: { law: 'powerlaw', slope: 2.35 },
    },
    {
      value: 'brokenPowerlaw',
      label: 'Broken power law (your slopes)',
      summary: 'One slope per mass segment; starts from Kroupa’s values.',
      template: { law: 'brokenPowerlaw', breaksMsun: [0.08, 0.5], slopes: [0.3, 1.3, 2.3] },
    },
  ],
};

export const HISTORY_CHOICE: KindChoice = {
  path: ['primaries', 'history'],
  discriminator: 'kind',
  options: [
    {
      value: 'constant',
      label: 'Constant star formation',
      reference: 'the textbook constant-rate disc, e.g. Binney & Merrifield 1998',
      summary: 'Birth times uniform over the age: a Galactic disc.',
      template: { kind: 'constant', ageGyr: 10 },
    },
    { value: 'burst', label: 'Single burst', summary: 'Every star has the same age: a cluster.', template: { kind: 'burst', ageGyr: 10 } },
  ],
};

export const LIFETIME_CHOICE: KindChoice = {
  path: ['primaries', 'lifetime'],
  discriminator: 'kind',
  options: [
    {
      value: 'scaling',
      label: 'Power-law scaling',
      reference: 'Hansen, Kawaler & Trimble 2004',
      summary: 't_MS = t0 (M/Msun)^−x; about 10 Gyr × M^−2.5 for the Sun’s composition.',
      template: { kind: 'scaling', t0Gyr: 10, exponent: 2.5 },
    },
    {
      value: 'table',
      label: 'Your table',
      summary: 'Lifetimes at given masses, interpolated linearly in log M – log t.',
      template: {
        kind: 'table',
        points: [
          { massMsun: 0.8, lifetimeGyr: 17.5 },
          { massMsun: 1, lifetimeGyr: 10 },
          { massMsun: 2, lifetimeGyr: 1.77 },
          { massMsun: 8, lifetimeGyr: 0.055 },
        ],
      },
    },
  ],
};

export const IFMR_CHOICE: KindChoice = {
  path: ['primaries', 'ifmr'],
  discriminator: 'relation',
  options: [
    {
      value: 'cummings2018',
      label: 'Cummings et al.',
      reference: 'Cummings et al. 2018, ApJ 866, 21',
      summary: 'Piecewise linear, calibrated on MIST or PARSEC isochrones.',
      template: { relation: 'cummings2018', calibration: 'mist' },
    },
    {
      value: 'kalirai2008',
      label: 'Kalirai et al.',
      reference: 'Kalirai et al. 2008, ApJ 676, 594',
      summary: 'Mf = 0.109 Mi + 0.394 Msun (fitted over about 1.16–6.5 Msun).',
      template: { relation: 'kalirai2008' },
    },
    {
      value: 'table',
      label: 'Your table',
      summary: 'Pairs of initial and final mass, interpolated linearly; starts from Kalirai et al. 2008.',
      template: {
        relation: 'table',
        points: [
          { initialMsun: 1.2, finalMsun: 0.525 },
          { initialMsun: 3, finalMsun: 0.721 },
          { initialMsun: 6.5, finalMsun: 1.103 },
        ],
      },
    },
  ],
};

export const CALIBRATION_OPTIONS = [
  { value: 'mist', label: 'MIST-based' },
  { value: 'parsec', label: 'PARSEC-based' },
] as const;

export const GIANT_CHOICE: KindChoice = {
  path: ['giant'],
  discriminator: 'kind',
  options: [
    {
      value: 'fixedReach',
      label: 'Fixed engulfment reach',
      summary: 'A companion is engulfed when its initial separation is below a given distance: the transparent baseline.',
      template: { kind: 'fixedReach', reachAU: 2 },
    },
    {
      value: 'track',
      label: 'Analytic giant track',
      reference: 'Hurley, Pols & Tout 2000; Reimers 1975; Zahn 1977',
      summary: 'Giant-branch and AGB radii, winds widening the orbit and the equilibrium tide shrinking it, integrated once per scenario.',
      template: { kind: 'track', reimersEta: 0.477, agbZeroPointMsun: 0.522, superwind: { kind: 'bloecker1995', eta: 0.05 }, tide: { kind: 'zahn1977' } },
    },
  ],
};

export const SUPERWIND_CHOICE: KindChoice = {
  path: ['giant', 'superwind'],
  discriminator: 'kind',
  options: [
    {
      value: 'bloecker1995',
      label: 'Blöcker superwind',
      reference: 'Blöcker 1995, A&A 297, 727',
      summary: 'On the AGB the wind is the larger of Reimers and Blöcker’s rate, scaled by η_B.',
      template: { kind: 'bloecker1995', eta: 0.05 },
    },
    {
      value: 'none',
      label: 'None',
      summary: 'The envelope left when the core reaches its final mass is lost at once.',
      template: { kind: 'none' },
    },
  ],
};

export const TIDE_CHOICE: KindChoice = {
  path: ['giant', 'tide'],
  discriminator: 'kind',
  options: [
    {
      value: 'zahn1977',
      label: 'Equilibrium tide',
      reference: 'Zahn 1977, as applied by Villaver & Livio 2009 and Mustill & Villaver 2012',
      summary: 'The convective envelope drags the orbit in: (da/dt)/a ∝ (R/a)^8.',
      template: { kind: 'zahn1977' },
    },
    { value: 'none', label: 'None', summary: 'Only the widening by mass loss (a · M_total conserved).', template: { kind: 'none' } },
  ],
};

export const DISRUPTION_FIELD_CHOICE: KindChoice = {
  path: ['field', 'disruption'],
  discriminator: 'kind',
  options: [
    {
      value: 'companionScaled',
      label: 'Grows with the shredded mass',
      reference: 'the disc-dynamo trend of Nordhaus et al. 2011 (illustrative defaults, not a fit)',
      summary: 'B = reference field × (M2 / reference mass)^slope, with log-normal scatter: planets give a few MG, low-mass stars hundreds.',
      template: { kind: 'companionScaled', referenceMG: 100, referenceMassMJup: 100, slope: 0.6, widthDex: 0.5 },
    },
    {
      value: 'lognormal',
      label: 'Log-normal field',
      summary: 'Fields drawn around a median, with a width in dex, whatever the companion.',
      template: { kind: 'lognormal', medianMG: 50, widthDex: 0.5 },
    },
    {
      value: 'accretion',
      label: 'From accretion of the debris',
      reference: 'magnetospheric radius r_A = (μ⁴/(2GMṀ²))^(1/7); disc viscosity after Shakura & Sunyaev 1973',
      summary: 'The field whose magnetic pressure balances the ram pressure of the accreted debris disc at the surface.',
      template: { kind: 'accretion', alpha: 0.1, aspectRatio: 0.1, discMassFraction: 1, widthDex: 0 },
    },
  ],
};

export const SELECTION_CHOICE: KindChoice = {
  path: ['selection'],
  discriminator: 'kind',
  options: [
    { value: 'volume', label: 'Volume-limited', summary: 'Every white dwarf counts equally.', template: { kind: 'volume' } },
    {
      value: 'magnitudeLimited',
      label: 'Magnitude-limited',
      reference: 'Mestel 1952 cooling; Nauenberg 1972 radius; Schmidt 1968 volume weighting',
      summary: 'A white dwarf is kept with probability ∝ F^(3/2), F its blackbody flux in the survey band: young ones are over-represented, and small (massive) ones under-represented at young ages.',
      template: { kind: 'magnitudeLimited', coolingAgeFloorGyr: 0.1, wavelengthNm: 550 },
    },
  ],
};

export const SHAPE_OPTIONS: readonly KindOption[] = [
  {
    value: 'powerlaw',
    label: 'Power law in ln M and ln P',
    reference: 'the form of Cumming et al. 2008',
    summary: 'dN ∝ M^a P^b dlnM dlnP; 0 and 0 are log-uniform.',
    template: { kind: 'powerlaw', massSlope: 0, periodSlope: 0 },
  },
  {
    value: 'lognormalPeriod',
    label: 'Log-normal in period, flat in mass',
    reference: 'Raghavan et al. 2010; Duquennoy & Mayor 1991',
    summary: 'log10 P normal, truncated to the row’s periods.',
    template: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 },
  },
];

export const COMPANION_CLASS_OPTIONS = [
  { value: 'planet', label: 'Planet' },
  { value: 'brownDwarf', label: 'Brown dwarf' },
  { value: 'star', label: 'Low-mass star' },
] as const;

/** The three ways a row may give its mass range; exactly one is used. */
export const MASS_UNITS = [
  { key: 'massMJup', value: 'MJup', label: 'Jupiter masses', unit: 'MJup' },
  { key: 'massMsun', value: 'Msun', label: 'Solar masses', unit: 'Msun' },
  { key: 'massRatio', value: 'q', label: 'Mass ratio q = M2/M1', unit: 'q' },
] as const;
export type MassKey = (typeof MASS_UNITS)[number]['key'];

/** The mass key a row uses (the first present; a new row starts in Jupiter masses). */
export function massKeyOf(row: Record<string, unknown>): MassKey {
  return MASS_UNITS.find((u) => row[u.key] !== undefined)?.key ?? 'massMJup';
}

/** A new companion row: a log-uniform band of giant planets, to be edited. */
export function newCompanionRow(): Record<string, unknown> {
  return {
    label: 'New row',
    class: 'planet',
    massMJup: [1, 10],
    periodDays: [10, 1000],
    occurrence: 0.05,
    shape: { kind: 'powerlaw', massSlope: 0, periodSlope: 0 },
  };
}

export function optionOf(options: readonly KindOption[], value: unknown): KindOption | undefined {
  return options.find((o) => o.value === value);
}

export const DISSOLUTION_CHOICE: KindChoice = {
  path: ['disruption', 'dissolution'],
  discriminator: 'kind',
  options: [
    { value: 'none', label: 'Every destroyed companion reaches the core', summary: 'Its debris disc makes the field (the default).', template: { kind: 'none' } },
    {
      value: 'belowMass',
      label: 'Light planets dissolve first',
      summary: 'Companions below a mass dissolve in the envelope before reaching the core: no disc, no field (an assumption).',
      template: { kind: 'belowMass', massMJup: 1 },
    },
  ],
};
