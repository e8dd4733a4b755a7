import { shortCitations } from './citations.ts';
import { PUBLISHED_IFMRS } from './ifmr-relations.ts';
import type { MethodOption, Options } from './method-option.ts';

export type { MethodOption } from './method-option.ts';

/**
 * Every choice the scenario document offers between published methods (each discriminated union),
 * declared once: the option's label, one-line summary, its citations, the values it starts with in
 * the builder, and the clause the methods paragraph prints for it. The builder
 * (src/features/scenarios/components/scenario-options.ts), the methods paragraph and the result's
 * methods list read these, so they can never cite different sources for the same choice;
 * method-choices.test.ts checks every option's value and template against the schema.
 */
export interface MethodChoice {
  /** Where the union sits in the document. */
  path: readonly (string | number)[];
  /** Its discriminator key ("law", "kind", "relation"). */
  discriminator: string;
  options: readonly MethodOption[];
}

const list = (values: readonly number[]) => values.join(', ');

export const IMF_CHOICE: MethodChoice = {
  path: ['primaries', 'imf'],
  discriminator: 'law',
  options: [
    { value: 'kroupa2001', label: 'Kroupa', cites: ['kroupa'], summary: 'Broken power law: slopes 0.3, 1.3 and 2.3 with breaks at 0.08 and 0.5 Msun.', template: { law: 'kroupa2001' }, words: () => 'the broken power-law initial mass function' },
    { value: 'salpeter1955', label: 'Salpeter', cites: ['salpeter'], summary: 'Single power law dN/dM ∝ M^−2.35.', template: { law: 'salpeter1955' }, words: () => 'the power-law initial mass function dN/dM ∝ M^−2.35' },
    { value: 'chabrier2003', label: 'Chabrier, single stars', cites: ['chabrier'], summary: 'Log-normal below 1 Msun, power law above.', template: { law: 'chabrier2003' }, words: () => 'the single-star initial mass function' },
    { value: 'powerlaw', label: 'Power law (your slope)', cites: [], summary: 'dN/dM ∝ M^−slope; Salpeter’s slope is 2.35.', template: { law: 'powerlaw', slope: 2.35 }, words: (o) => `a power-law initial mass function dN/dM ∝ M^−${o.slope}` },
    {
      value: 'brokenPowerlaw',
      label: 'Broken power law (your slopes)',
      cites: [],
      summary: 'One slope per mass segment; starts from Kroupa’s values.',
      template: { law: 'brokenPowerlaw', breaksMsun: [0.08, 0.5], slopes: [0.3, 1.3, 2.3] },
      words: (o) => `a broken power-law initial mass function (slopes ${list(o.slopes)}, breaks at ${list(o.breaksMsun)} Msun)`,
    },
  ],
};

export const HISTORY_CHOICE: MethodChoice = {
  path: ['primaries', 'history'],
  discriminator: 'kind',
  options: [
    { value: 'constant', label: 'Constant star formation', cites: [], summary: 'Birth times uniform over the age: a Galactic disc.', template: { kind: 'constant', ageGyr: 10 }, words: (o) => `constant star formation over ${o.ageGyr} Gyr` },
    { value: 'burst', label: 'Single burst', cites: [], summary: 'Every star has the same age: a cluster.', template: { kind: 'burst', ageGyr: 10 }, words: (o) => `a single burst ${o.ageGyr} Gyr ago` },
  ],
};

export const LIFETIME_CHOICE: MethodChoice = {
  path: ['primaries', 'lifetime'],
  discriminator: 'kind',
  options: [
    {
      value: 'scaling',
      label: 'Power-law scaling',
      cites: ['hansen'],
      summary: 't_MS = t0 (M/Msun)^−x; about 10 Gyr × M^−2.5 for the Sun’s composition.',
      template: { kind: 'scaling', t0Gyr: 10, exponent: 2.5 },
      words: (o) => `main-sequence lifetimes t_MS = ${o.t0Gyr} Gyr (M/Msun)^−${o.exponent}`,
    },
    {
      value: 'table',
      label: 'Your table',
      cites: [],
      summary: 'Lifetimes at given masses, interpolated linearly in log M – log t.',
      template: { kind: 'table', points: [{ massMsun: 0.8, lifetimeGyr: 17.5 }, { massMsun: 1, lifetimeGyr: 10 }, { massMsun: 2, lifetimeGyr: 1.77 }, { massMsun: 8, lifetimeGyr: 0.055 }] },
      words: (o) => `main-sequence lifetimes interpolated in a table of ${o.points.length} masses`,
    },
  ],
};

export const IFMR_CHOICE: MethodChoice = {
  path: ['primaries', 'ifmr'],
  discriminator: 'relation',
  options: [
    // The published relations are declared, with their schema variants and coefficients, in ifmr-relations.ts.
    ...PUBLISHED_IFMRS,
    {
      value: 'table',
      label: 'Your table',
      cites: [],
      summary: 'Pairs of initial and final mass, interpolated linearly; starts from Kalirai et al. 2008.',
      template: { relation: 'table', points: [{ initialMsun: 1.2, finalMsun: 0.525 }, { initialMsun: 3, finalMsun: 0.721 }, { initialMsun: 6.5, finalMsun: 1.103 }] },
      words: (o) => `an initial–final mass relation interpolated in a table of ${o.points.length} points`,
    },
  ],
};

export const GIANT_CHOICE: MethodChoice = {
  path: ['giant'],
  discriminator: 'kind',
  options: [
    {
      value: 'fixedReach',
      label: 'Fixed engulfment reach',
      cites: [],
      summary: 'A companion is engulfed when its initial separation is below a given distance: the transparent baseline.',
      template: { kind: 'fixedReach', reachAU: 2 },
      words: (o) => `a companion is engulfed when its initial separation is below ${o.reachAU} AU, the envelope then being that of the final core at that separation`,
    },
    {
      value: 'track',
      label: 'Analytic giant track',
      cites: ['hurley', 'reimers', 'paczynski', 'eggleton'],
      summary: 'Giant-branch and AGB radii, winds widening the orbit and the equilibrium tide shrinking it, integrated once per scenario.',
      template: { kind: 'track', reimersEta: 0.477, agbZeroPointMsun: 0.522, superwind: { kind: 'bloecker1995', eta: 0.05 }, tide: { kind: 'zahn1977' } },
      words: (o) => `an analytic giant-branch and AGB track (Reimers η = ${o.reimersEta}, AGB zero point Mc0 = ${o.agbZeroPointMsun} Msun) decides engulfment, the common envelope starting at Roche-lobe overflow`,
    },
  ],
};

export const SUPERWIND_CHOICE: MethodChoice = {
  path: ['giant', 'superwind'],
  discriminator: 'kind',
  options: [
    { value: 'bloecker1995', label: 'Blöcker superwind', cites: ['bloecker'], summary: 'On the AGB the wind is the larger of Reimers and Blöcker’s rate, scaled by η_B.', template: { kind: 'bloecker1995', eta: 0.05 }, words: (o) => `an AGB superwind with η_B = ${o.eta}` },
    { value: 'none', label: 'None', cites: [], summary: 'The envelope left when the core reaches its final mass is lost at once.', template: { kind: 'none' }, words: () => 'no superwind' },
  ],
};

export const TIDE_CHOICE: MethodChoice = {
  path: ['giant', 'tide'],
  discriminator: 'kind',
  options: [
    { value: 'zahn1977', label: 'Equilibrium tide', cites: ['zahn', 'villaver', 'mustill'], summary: 'The convective envelope drags the orbit in: (da/dt)/a ∝ (R/a)^8.', template: { kind: 'zahn1977' }, words: () => 'the equilibrium tide' },
    { value: 'none', label: 'None', cites: [], summary: 'Only the widening by mass loss (a · M_total conserved).', template: { kind: 'none' }, words: () => 'no tide' },
  ],
};

export const DISRUPTION_FIELD_CHOICE: MethodChoice = {
  path: ['field', 'disruption'],
  discriminator: 'kind',
  options: [
    {
      value: 'companionScaled',
      label: 'Grows with the shredded mass',
      cites: ['nordhaus'],
      summary: 'B = reference field × (M2 / reference mass)^slope, with log-normal scatter: planets give a few MG, low-mass stars hundreds (illustrative defaults, not a fit).',
      template: { kind: 'companionScaled', referenceMG: 100, referenceMassMJup: 100, slope: 0.6, widthDex: 0.5 },
      words: (o) => `B = ${o.referenceMG} MG (M2/${o.referenceMassMJup} MJup)^${o.slope} with ${o.widthDex} dex scatter, an illustrative reading of the disc-dynamo trend`,
    },
    { value: 'lognormal', label: 'Log-normal field', cites: ['ferrario'], summary: 'Fields drawn around a median, with a width in dex, whatever the companion.', template: { kind: 'lognormal', medianMG: 50, widthDex: 0.5 }, words: (o) => `log-normal fields (median ${o.medianMG} MG, ${o.widthDex} dex)` },
    {
      value: 'accretion',
      label: 'From accretion of the debris',
      cites: ['fkr', 'shakura'],
      summary: 'The field whose magnetic pressure balances the ram pressure of the accreted debris disc at the surface.',
      template: { kind: 'accretion', alpha: 0.1, aspectRatio: 0.1, discMassFraction: 1, widthDex: 0 },
      words: (o) => `magnetospheric-balance fields from the debris disc's viscous accretion (α = ${o.alpha}, H/R = ${o.aspectRatio})`,
    },
  ],
};

export const SELECTION_CHOICE: MethodChoice = {
  path: ['selection'],
  discriminator: 'kind',
  options: [
    { value: 'volume', label: 'Volume-limited', cites: [], summary: 'Every white dwarf counts equally.', template: { kind: 'volume' }, words: () => 'a volume-limited sample' },
    {
      value: 'magnitudeLimited',
      label: 'Magnitude-limited',
      cites: ['schmidt', 'mestel', 'nauenberg'],
      summary: 'A white dwarf is kept with probability ∝ F^(3/2), F its blackbody flux in the survey band: young ones are over-represented, and small (massive) ones under-represented at young ages.',
      template: { kind: 'magnitudeLimited', coolingAgeFloorGyr: 0.1, wavelengthNm: 550 },
      words: (o) => `a magnitude-limited sample (visible volume ∝ F^(3/2) at ${o.wavelengthNm} nm, Mestel cooling)`,
    },
  ],
};

export const SHAPE_CHOICE: MethodChoice = {
  path: ['companions', 'rows', 0, 'shape'],
  discriminator: 'kind',
  options: [
    { value: 'powerlaw', label: 'Power law in ln M and ln P', cites: ['cumming'], summary: 'dN ∝ M^a P^b dlnM dlnP; 0 and 0 are log-uniform.', template: { kind: 'powerlaw', massSlope: 0, periodSlope: 0 }, words: () => 'power laws in ln M and ln P' },
    {
      value: 'lognormalPeriod',
      label: 'Log-normal in period, flat in mass',
      cites: ['raghavan', 'duquennoy'],
      summary: 'log10 P normal, truncated to the row’s periods.',
      template: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 },
      words: () => 'a log-normal period distribution flat in mass',
    },
  ],
};

export const DISSOLUTION_CHOICE: MethodChoice = {
  path: ['disruption', 'dissolution'],
  discriminator: 'kind',
  options: [
    { value: 'none', label: 'Every destroyed companion reaches the core', cites: [], summary: 'Its debris disc makes the field (the default).', template: { kind: 'none' }, words: () => 'every destroyed companion reaches the core' },
    {
      value: 'belowMass',
      label: 'Light planets dissolve first',
      cites: [],
      summary: 'Companions below a mass dissolve in the envelope before reaching the core: no disc, no field (an assumption).',
      template: { kind: 'belowMass', massMJup: 1 },
      words: (o) => `companions below ${o.massMJup} MJup dissolve in the envelope without a disc`,
    },
  ],
};

/** Every choice, for checks that walk them all. */
export const METHOD_CHOICES: readonly MethodChoice[] = [
  IMF_CHOICE, HISTORY_CHOICE, LIFETIME_CHOICE, IFMR_CHOICE, GIANT_CHOICE, SUPERWIND_CHOICE, TIDE_CHOICE, DISRUPTION_FIELD_CHOICE, SELECTION_CHOICE, SHAPE_CHOICE, DISSOLUTION_CHOICE,
];

export function optionOf(choice: MethodChoice, value: unknown): MethodOption | undefined {
  return choice.options.find((o) => o.value === value);
}

/** The paragraph's clause for the option the document chose: its words and, when it has any, its citations ("… (Kroupa 2001)"). */
export function clause(choice: MethodChoice, chosen: Options): string {
  const option = optionOf(choice, chosen[choice.discriminator]);
  if (!option) return '';
  const words = option.words(chosen);
  return option.cites.length > 0 ? `${words} (${shortCitations(option.cites)})` : words;
}
