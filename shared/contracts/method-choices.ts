import { z } from 'zod';
import { doiAmong } from './citations.ts';
import { number } from './field-issues.ts';
import { PUBLISHED_IFMRS } from './ifmr-relations.ts';
import { citationsOfChoices, defineChoice, option, type MethodChoice, unionOf } from './method-option.ts';

export { clause, optionOf, unionOf, type MethodChoice, type MethodOption, type ValueOf } from './method-option.ts';

/**
 * Every choice the scenario document offers between published methods (each discriminated union),
 * declared once: each option's schema variant (fields, bounds, defaults and their doc comments),
 * label, one-line summary, citations, and the clause the methods paragraph prints for it; the
 * values it starts with in the builder are its schema's defaults (plus `start` for fields without
 * one). The scenario contract builds its unions from these (`unionOf`), and the builder
 * (src/features/scenarios/components/), the methods paragraph and the result's methods list read
 * them, so they can never cite different sources for the same choice.
 */

const list = (values: readonly number[]) => values.join(', ');

/** Upper end of a primary's initial mass: heavier stars do not end as white dwarfs. */
export const PRIMARY_MASS_MSUN = [0.01, 8] as const;
const AGE_GYR = [0.01, 13.8] as const;

// ---- primaries -------------------------------------------------------------------------

export const IMF_CHOICE = defineChoice(['primaries', 'imf'], 'law', [
  option({
    /** Single power law dN/dM ∝ M^-slope (Salpeter's slope is 2.35). */
    schema: z.strictObject({ law: z.literal('powerlaw'), slope: number(-3, 6).default(2.35) }),
    label: 'Power law (your slope)',
    cites: [],
    summary: 'dN/dM ∝ M^−slope; Salpeter’s slope is 2.35.',
    words: (o) => `a power-law initial mass function dN/dM ∝ M^−${o.slope}`,
  }),
  option({
    /** Broken power law: slopes[i] applies between breaksMsun[i-1] and breaksMsun[i]. */
    schema: z.strictObject({
      law: z.literal('brokenPowerlaw'),
      breaksMsun: z.array(number(0.01, 8)).min(1).max(8),
      slopes: z.array(number(-3, 6)).min(2).max(9),
    }),
    label: 'Broken power law (your slopes)',
    cites: [],
    summary: 'One slope per mass segment; starts from Kroupa’s values.',
    start: { breaksMsun: [0.08, 0.5], slopes: [0.3, 1.3, 2.3] },
    words: (o) => `a broken power-law initial mass function (slopes ${list(o.slopes)}, breaks at ${list(o.breaksMsun)} Msun)`,
  }),
  option({
    /** Salpeter (1955): dN/dM ∝ M^-2.35. */
    schema: z.strictObject({ law: z.literal('salpeter1955') }),
    label: 'Salpeter',
    cites: ['salpeter'],
    summary: 'Single power law dN/dM ∝ M^−2.35.',
    words: () => 'the power-law initial mass function dN/dM ∝ M^−2.35',
  }),
  option({
    /** Kroupa (2001): slopes 0.3 / 1.3 / 2.3 with breaks at 0.08 and 0.5 Msun. */
    schema: z.strictObject({ law: z.literal('kroupa2001') }),
    label: 'Kroupa',
    cites: ['kroupa'],
    summary: 'Broken power law: slopes 0.3, 1.3 and 2.3 with breaks at 0.08 and 0.5 Msun.',
    words: () => 'the broken power-law initial mass function',
  }),
  option({
    /** Chabrier (2003) single-star IMF: log-normal below 1 Msun, power law above. */
    schema: z.strictObject({ law: z.literal('chabrier2003') }),
    label: 'Chabrier, single stars',
    cites: ['chabrier'],
    summary: 'Log-normal below 1 Msun, power law above.',
    words: () => 'the single-star initial mass function',
  }),
]);

export const HISTORY_CHOICE = defineChoice(['primaries', 'history'], 'kind', [
  option({
    /** Every star has the age ageGyr. */
    schema: z.strictObject({ kind: z.literal('burst'), ageGyr: number(...AGE_GYR).default(10) }),
    label: 'Single burst',
    cites: [],
    summary: 'Every star has the same age: a cluster.',
    words: (o) => `a single burst ${o.ageGyr} Gyr ago`,
  }),
  option({
    /** Birth times uniform over [0, ageGyr]. */
    schema: z.strictObject({ kind: z.literal('constant'), ageGyr: number(...AGE_GYR).default(10) }),
    label: 'Constant star formation',
    cites: [],
    summary: 'Birth times uniform over the age: a Galactic disc.',
    words: (o) => `constant star formation over ${o.ageGyr} Gyr`,
  }),
]);

export const LIFETIME_CHOICE = defineChoice(['primaries', 'lifetime'], 'kind', [
  option({
    /** t_MS = t0Gyr · (M/Msun)^-exponent. */
    schema: z.strictObject({
      kind: z.literal('scaling'),
      t0Gyr: number(0.1, 100).default(10),
      exponent: number(0.5, 5).default(2.5),
    }),
    label: 'Power-law scaling',
    cites: ['hansen'],
    summary: 't_MS = t0 (M/Msun)^−x; about 10 Gyr × M^−2.5 for the Sun’s composition.',
    words: (o) => `main-sequence lifetimes t_MS = ${o.t0Gyr} Gyr (M/Msun)^−${o.exponent}`,
  }),
  option({
    /** Tabulated t_MS(M), interpolated linearly in log M – log t. */
    schema: z.strictObject({
      kind: z.literal('table'),
      points: z
        .array(z.strictObject({ massMsun: number(0.01, 150), lifetimeGyr: number(1e-4, 1e5) }))
        .min(2)
        .max(200),
    }),
    label: 'Your table',
    cites: [],
    summary: 'Lifetimes at given masses, interpolated linearly in log M – log t.',
    start: { points: [{ massMsun: 0.8, lifetimeGyr: 17.5 }, { massMsun: 1, lifetimeGyr: 10 }, { massMsun: 2, lifetimeGyr: 1.77 }, { massMsun: 8, lifetimeGyr: 0.055 }] },
    words: (o) => `main-sequence lifetimes interpolated in a table of ${o.points.length} masses`,
  }),
]);

export const IFMR_CHOICE = defineChoice(['primaries', 'ifmr'], 'relation', [
  // The published relations (Kalirai et al. 2008, Cummings et al. 2018, …) are declared, with their coefficients, in ifmr-relations.ts.
  ...PUBLISHED_IFMRS,
  option({
    /** A user table of (initial, final) masses, interpolated linearly. */
    schema: z.strictObject({
      relation: z.literal('table'),
      points: z
        .array(z.strictObject({ initialMsun: number(0.01, 150), finalMsun: number(0.1, 1.4) }))
        .min(2)
        .max(200),
    }),
    label: 'Your table',
    cites: [],
    summary: 'Pairs of initial and final mass, interpolated linearly; starts from Kalirai et al. 2008.',
    start: { points: [{ initialMsun: 1.2, finalMsun: 0.525 }, { initialMsun: 3, finalMsun: 0.721 }, { initialMsun: 6.5, finalMsun: 1.103 }] },
    words: (o) => `an initial–final mass relation interpolated in a table of ${o.points.length} points`,
  }),
]);

// ---- the giant ----------------------------------------------------------------------------

/**
 * Late-AGB superwind that strips what is left of the envelope. On the AGB the wind is the
 * larger of Reimers and Blöcker; with `none` the envelope left when the core reaches the
 * IFMR mass is assumed to be lost at once (the orbit can no longer be engulfed then). The
 * superwind is timed so that the track's final core equals the IFMR mass: where the wind
 * would empty the envelope earlier, the AGB wind is scaled down at that primary mass until
 * it empties the envelope as the core reaches the IFMR mass (within 0.005 Msun).
 */
export const SUPERWIND_CHOICE = defineChoice(['giant', 'superwind'], 'kind', [
  option({
    /** Blöcker (1995, A&A 297, 727) rate η_B · 4.83×10⁻⁹ M_ZAMS^−2.1 L^2.7 × (Reimers with η = 1), efficiency η_B. */
    schema: z.object({ kind: z.literal('bloecker1995'), eta: number(0.001, 1).default(0.05) }),
    label: 'Blöcker superwind',
    cites: ['bloecker'],
    summary: 'On the AGB the wind is the larger of Reimers and Blöcker’s rate, scaled by η_B.',
    words: (o) => `an AGB superwind with η_B = ${o.eta}`,
  }),
  option({
    schema: z.object({ kind: z.literal('none') }),
    label: 'None',
    cites: [],
    summary: 'The envelope left when the core reaches its final mass is lost at once.',
    words: () => 'no superwind',
  }),
]);

/**
 * Equilibrium tide on the companion's orbit (Zahn 1977 as used by Villaver & Livio 2009 and
 * Mustill & Villaver 2012): (da/dt)/a = −(f/τ)(M_env/M) q(1+q)(R/a)^8 with
 * f = (9/2) min[1, (P/2τ)²] and τ = [M_env R²/(3L)]^(1/3). `none` leaves only the widening by
 * mass loss (a · M_total conserved).
 */
export const TIDE_CHOICE = defineChoice(['giant', 'tide'], 'kind', [
  option({
    schema: z.object({ kind: z.literal('zahn1977') }),
    label: 'Equilibrium tide',
    cites: ['zahn', 'villaver', 'mustill'],
    summary: 'The convective envelope drags the orbit in: (da/dt)/a ∝ (R/a)^8.',
    words: () => 'the equilibrium tide',
  }),
  option({
    schema: z.object({ kind: z.literal('none') }),
    label: 'None',
    cites: [],
    summary: 'Only the widening by mass loss (a · M_total conserved).',
    words: () => 'no tide',
  }),
]);

/**
 * Options of the analytic giant-branch + AGB track (`giant.kind = "track"`). The track's physics
 * lives in shared/engine/physics/giant-track.ts and the engulfment grid in
 * shared/engine/physics/engulfment-grid.ts. The track is for solar metallicity (Z = 0.02) and
 * primaries of 0.8–8 Msun.
 */
export const giantTrackSchema = z.strictObject({
  kind: z.literal('track'),
  /**
   * Reimers (1975) efficiency η of Ṁ = 4×10⁻¹³ η L R / M (Msun/yr, solar units), applied on the
   * red giant branch and the AGB; McDonald & Zijlstra (2015) find 0.477 ± 0.070 from globular
   * clusters.
   */
  reimersEta: number(0.05, 3).default(0.477),
  /**
   * Zero point Mc0 of Paczyński's (1970, Acta Astron. 20, 47) AGB core-mass–luminosity relation
   * L = 59250 (Mc − Mc0) Lsun: 0.522 Msun as the relation is usually quoted, 0.495 Msun in a later
   * recalibration (both values from memory). The AGB starts where the relation gives ≈ 300 Lsun.
   */
  agbZeroPointMsun: number(0.45, 0.55).default(0.522),
  superwind: unionOf(SUPERWIND_CHOICE).prefault({ kind: 'bloecker1995' }),
  tide: unionOf(TIDE_CHOICE).prefault({ kind: 'zahn1977' }),
});

export const GIANT_CHOICE = defineChoice(['giant'], 'kind', [
  option({
    schema: z.strictObject({
      kind: z.literal('fixedReach'),
      /** Engulfed iff the initial semi-major axis is below this. */
      reachAU: number(0.01, 100).default(2),
    }),
    label: 'Fixed engulfment reach',
    cites: [],
    summary: 'A companion is engulfed when its initial separation is below a given distance: the transparent baseline.',
    words: (o) => `a companion is engulfed when its initial separation is below ${o.reachAU} AU, the envelope then being that of the final core at that separation`,
  }),
  option({
    schema: giantTrackSchema,
    label: 'Analytic giant track',
    cites: ['hurley', 'reimers', 'paczynski', 'eggleton'],
    summary: 'Giant-branch and AGB radii, winds widening the orbit and the equilibrium tide shrinking it, integrated once per scenario.',
    words: (o) => `an analytic giant-branch and AGB track (Reimers η = ${o.reimersEta}, AGB zero point Mc0 = ${o.agbZeroPointMsun} Msun) decides engulfment, the common envelope starting at Roche-lobe overflow`,
  }),
]);

// ---- companions, their destruction and fields --------------------------------------------

export const SHAPE_CHOICE = defineChoice(['companions', 'rows', 0, 'shape'], 'kind', [
  option({
    /** dN ∝ M^massSlope P^periodSlope dlnM dlnP (0 = log-uniform), the form of Cumming et al. 2008. */
    schema: z.strictObject({
      kind: z.literal('powerlaw'),
      massSlope: number(-3, 3).default(0),
      periodSlope: number(-3, 3).default(0),
    }),
    label: 'Power law in ln M and ln P',
    cites: ['cumming'],
    summary: 'dN ∝ M^a P^b dlnM dlnP; 0 and 0 are log-uniform.',
    words: () => 'power laws in ln M and ln P',
  }),
  option({
    /** log10 P normal (Raghavan et al. 2010; Duquennoy & Mayor 1991), truncated to the row; mass flat. */
    schema: z.strictObject({
      kind: z.literal('lognormalPeriod'),
      meanLog10PeriodDays: number(-2, 12).default(5.03),
      sigmaLog10Period: number(0.01, 10).default(2.28),
    }),
    label: 'Log-normal in period, flat in mass',
    cites: ['raghavan', 'duquennoy'],
    summary: 'log10 P normal, truncated to the row’s periods.',
    words: () => 'a log-normal period distribution flat in mass',
  }),
]);

export const DISSOLUTION_CHOICE = defineChoice(['disruption', 'dissolution'], 'kind', [
  option({
    /** Every companion that cannot eject the envelope reaches the core and is shredded (default). */
    schema: z.strictObject({ kind: z.literal('none') }),
    label: 'Every destroyed companion reaches the core',
    cites: [],
    summary: 'Its debris disc makes the field (the default).',
    words: () => 'every destroyed companion reaches the core',
  }),
  option({
    /**
     * Companions lighter than massMJup dissolve in the envelope before they reach the core: no
     * debris disc, no field (an assumption; the mass is the user's choice).
     */
    schema: z.strictObject({ kind: z.literal('belowMass'), massMJup: number(0.01, 100).default(1) }),
    label: 'Light planets dissolve first',
    cites: [],
    summary: 'Companions below a mass dissolve in the envelope before reaching the core: no disc, no field (an assumption).',
    words: (o) => `companions below ${o.massMJup} MJup dissolve in the envelope without a disc`,
  }),
]);

export const DISRUPTION_FIELD_CHOICE = defineChoice(['field', 'disruption'], 'kind', [
  option({
    schema: z.strictObject({
      kind: z.literal('lognormal'),
      medianMG: number(1e-3, 1e5),
      widthDex: number(0, 3).default(0.5),
    }),
    label: 'Log-normal field',
    cites: ['ferrario'],
    summary: 'Fields drawn around a median, with a width in dex, whatever the companion.',
    start: { medianMG: 50 },
    words: (o) => `log-normal fields (median ${o.medianMG} MG, ${o.widthDex} dex)`,
  }),
  option({
    /**
     * B = referenceMG · (M2 / referenceMassMJup)^slope with log-normal scatter widthDex: the field
     * grows with the shredded mass, the trend of the disc-dynamo estimates (Nordhaus et al. 2011,
     * PNAS 108, 3135). The defaults (100 MG at 100 MJup, slope 0.6: ≈ 6 MG for 1 MJup, ≈ 260 MG for
     * 0.5 Msun) are an illustrative reading of that trend, not a fit.
     */
    schema: z.strictObject({
      kind: z.literal('companionScaled'),
      referenceMG: number(1e-3, 1e5).default(100),
      referenceMassMJup: number(0.01, 1000).default(100),
      slope: number(-2, 3).default(0.6),
      widthDex: number(0, 3).default(0.5),
    }),
    label: 'Grows with the shredded mass',
    cites: ['nordhaus'],
    summary: 'B = reference field × (M2 / reference mass)^slope, with log-normal scatter: planets give a few MG, low-mass stars hundreds (illustrative defaults, not a fit).',
    words: (o) => `B = ${o.referenceMG} MG (M2/${o.referenceMassMJup} MJup)^${o.slope} with ${o.widthDex} dex scatter, an illustrative reading of the disc-dynamo trend`,
  }),
  option({
    schema: z.strictObject({
      kind: z.literal('accretion'),
      /** Shakura & Sunyaev (1973) viscosity parameter of the debris disc. */
      alpha: number(1e-4, 1).default(0.1),
      /** Disc aspect ratio H/R. */
      aspectRatio: number(1e-3, 0.5).default(0.1),
      /** Fraction of the companion's mass that ends in the disc. */
      discMassFraction: number(1e-4, 1).default(1),
      /** Log-normal scatter (dex) around the computed field; 0 = none. */
      widthDex: number(0, 3).default(0),
    }),
    label: 'From accretion of the debris',
    cites: ['fkr', 'shakura'],
    summary: 'The field whose magnetic pressure balances the ram pressure of the accreted debris disc at the surface.',
    words: (o) => `magnetospheric-balance fields from the debris disc's viscous accretion (α = ${o.alpha}, H/R = ${o.aspectRatio})`,
  }),
]);

// ---- the sample ---------------------------------------------------------------------------

export const SELECTION_CHOICE = defineChoice(['selection'], 'kind', [
  option({
    schema: z.strictObject({ kind: z.literal('volume') }),
    label: 'Volume-limited',
    cites: [],
    summary: 'Every white dwarf counts equally.',
    words: () => 'a volume-limited sample',
  }),
  option({
    /**
     * Accept each white dwarf with probability ∝ F^(3/2), F its optical flux: a blackbody at
     * wavelengthNm from its radius (Nauenberg 1972) and effective temperature (Mestel cooling).
     */
    schema: z.strictObject({
      kind: z.literal('magnitudeLimited'),
      /** Cooling ages below this are raised to it (Mestel's law fails for hot young white dwarfs). */
      coolingAgeFloorGyr: number(1e-3, 2).default(0.1),
      /** Wavelength of the survey's band, nm (V band ≈ 550 nm). */
      wavelengthNm: number(300, 2500).default(550),
    }),
    label: 'Magnitude-limited',
    cites: ['schmidt', 'mestel', 'nauenberg'],
    summary: 'A white dwarf is kept with probability ∝ F^(3/2), F its blackbody flux in the survey band: young ones are over-represented, and small (massive) ones under-represented at young ages.',
    words: (o) => `a magnitude-limited sample (visible volume ∝ F^(3/2) at ${o.wavelengthNm} nm, Mestel cooling)`,
  }),
]);

/** Every choice, for checks that walk them all. */
export const METHOD_CHOICES: readonly MethodChoice[] = [
  IMF_CHOICE, HISTORY_CHOICE, LIFETIME_CHOICE, IFMR_CHOICE, GIANT_CHOICE, SUPERWIND_CHOICE, TIDE_CHOICE, DISRUPTION_FIELD_CHOICE, SELECTION_CHOICE, SHAPE_CHOICE, DISSOLUTION_CHOICE,
];

/** Every citation the choices' options carry (keys resolved, inline ones as written), each once. */
export const CHOICE_CITATIONS = citationsOfChoices(METHOD_CHOICES);

/** The DOI of a citation given in its full or short form, when it is known (citations.ts or a declaration's inline citation). */
export const doiOf = (reference: string): string | undefined => doiAmong(reference, CHOICE_CITATIONS);

