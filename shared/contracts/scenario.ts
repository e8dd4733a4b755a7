import { z } from 'zod';
import { companionRowSchema, emptyRangeMessage, rangeSchema } from './occurrence-table.ts';
import { formatNumber, integer, number, parseFields, type FieldIssue } from './field-issues.ts';
import { boundsAt } from './schema-bounds.ts';
import {
  DISRUPTION_FIELD_CHOICE,
  DISSOLUTION_CHOICE,
  GIANT_CHOICE,
  HISTORY_CHOICE,
  IFMR_CHOICE,
  IMF_CHOICE,
  LIFETIME_CHOICE,
  PRIMARY_MASS_MSUN,
  SELECTION_CHOICE,
  unionOf,
} from './method-choices.ts';

/**
 * The scenario document: one seeded Monte Carlo population of white-dwarf progenitors and
 * their companions. Units are in the names (Msun unless a name says MJup; days; Gyr; AU; MG).
 * Every numeric field has a lower and an upper bound, and its checks word their own messages
 * (`number` in field-issues.ts); `parseScenario` reports every problem, each naming its field.
 * Defaults are written once, on the field; `.prefault` runs a parent's default through them.
 * Each choice between published methods (IMF, history, lifetime, IFMR, giant model, dissolution,
 * disruption field, selection, and inside them the superwind, tide and a row's shape) is the union
 * of the variants its options declare in method-choices.ts.
 */

// ---- primaries -------------------------------------------------------------------------

const primariesSchema = z.strictObject({
  imf: unionOf(IMF_CHOICE).prefault({ law: 'kroupa2001' }),
  /** Initial masses of the drawn primaries. */
  massRangeMsun: rangeSchema(...PRIMARY_MASS_MSUN).default([0.8, 8]),
  history: unionOf(HISTORY_CHOICE).prefault({ kind: 'constant' }),
  lifetime: unionOf(LIFETIME_CHOICE).prefault({ kind: 'scaling' }),
  ifmr: unionOf(IFMR_CHOICE).prefault({ relation: 'cummings2018' }),
});

// ---- companions and their fates ---------------------------------------------------------

const companionsSchema = z.strictObject({
  /** Global factor on every row's occurrence (what-if studies). */
  multiplier: number(0, 1000).default(1),
  rows: z.array(companionRowSchema).max(32).optional(),
  /** A stored occurrence table, resolved to rows by the server before a run. */
  tableId: z.string().min(1).max(100).optional(),
});

const envelopeSchema = z.strictObject({
  /** Common-envelope efficiency α_CE (Webbink 1984). */
  alpha: number(0.01, 10).default(1),
  /** Envelope structure parameter λ in E_bind = G M M_env / (λ R). */
  lambda: number(0.05, 5).default(0.5),
});

const disruptionSchema = z.strictObject({
  /** η in the tidal radius r_t = η R2 (M_core/M2)^(1/3); 2.44 is the fluid Roche limit. Sets the debris disc's radius of the accretion field. */
  eta: number(0.1, 5).default(2.44),
  dissolution: unionOf(DISSOLUTION_CHOICE).prefault({ kind: 'none' }),
});

/** Field of a close post-common-envelope survivor (Tout et al. 2008's near-merger case). */
const closeSurvivorFieldSchema = z.strictObject({
  kind: z.literal('lognormal'),
  medianMG: number(1e-3, 1e5).default(30),
  widthDex: number(0, 3).default(0.5),
  /** Only survivors whose final orbital period is below this get the field. */
  maxPeriodDays: number(0.001, 100).default(0.5),
});

/** Keys of engine 1 that engine 2 accepts and ignores (the result's assumptions say so). */
const ignoredEngine1Key = z.unknown().optional();

const fieldSchema = z.strictObject({
  disruption: unionOf(DISRUPTION_FIELD_CHOICE).prefault({ kind: 'companionScaled' }),
  closeSurvivor: closeSurvivorFieldSchema.prefault({ kind: 'lognormal' }),
  /**
   * A field made by a companion (disruption, close survivor) counts only once the white dwarf's
   * cooling age exceeds this (a late-emerging field); 0 = at once. Fossil fields are unaffected.
   */
  emergenceDelayGyr: number(0, 13.8).default(0),
  /** A white dwarf counts as magnetic iff its field is at least this. */
  thresholdMG: number(0.01, 1000).default(1),
  /** Engine 1's core-merger field: accepted and ignored. */
  coreMerger: ignoredEngine1Key,
});

const fossilSchema = z.strictObject({
  enabled: z.boolean().default(false),
  /** Fraction of progenitors inside massRangeMsun that carry a main-sequence field. */
  fraction: number(0, 1).default(0.05),
  massRangeMsun: rangeSchema(...PRIMARY_MASS_MSUN).default([1.5, 4]),
  /** Log-normal main-sequence surface field: median in kG, width in dex. */
  msField: z
    .strictObject({ medianKG: number(1e-3, 1e3).default(1), widthDex: number(0, 3).default(0.5) })
    .prefault({}),
});

const channelsSchema = z.strictObject({
  disruption: z.boolean().default(true),
  /** Field for close post-common-envelope survivors (field.closeSurvivor); off by default. */
  closeSurvivor: z.boolean().default(false),
  /** Engine 1's core-merger channel: accepted and ignored. */
  coreMerger: ignoredEngine1Key,
  fossil: fossilSchema.prefault({}),
});

const observedSchema = z.strictObject({
  magnetic: integer(0, 1e9),
  total: integer(1, 1e9),
  label: z.string().max(200).optional(),
});

export const scenarioSchema = z
  .strictObject({
    title: z.string().max(200).optional(),
    description: z.string().max(4000).optional(),
    seed: z.string().min(1).max(200),
    /** Number of primaries drawn. */
    systems: integer(1e3, 1e10).default(1e6),
    primaries: primariesSchema.prefault({}),
    companions: companionsSchema.prefault({ rows: [] }),
    giant: unionOf(GIANT_CHOICE).prefault({ kind: 'fixedReach' }),
    envelope: envelopeSchema.prefault({}),
    disruption: disruptionSchema.prefault({}),
    field: fieldSchema.prefault({}),
    channels: channelsSchema.prefault({}),
    selection: unionOf(SELECTION_CHOICE).prefault({ kind: 'volume' }),
    /** An observed sample to test the prediction against. */
    observed: observedSchema.optional(),
  })
  .superRefine((s, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    const range = (path: (string | number)[], r: readonly [number, number]) => {
      if (!(r[0] < r[1])) issue(path, emptyRangeMessage(r));
    };
    range(['primaries', 'massRangeMsun'], s.primaries.massRangeMsun);
    range(['channels', 'fossil', 'massRangeMsun'], s.channels.fossil.massRangeMsun);

    const imf = s.primaries.imf;
    if (imf.law === 'brokenPowerlaw') {
      if (imf.slopes.length !== imf.breaksMsun.length + 1) {
        issue(['primaries', 'imf', 'slopes'], `must have one more entry than breaksMsun (got ${imf.slopes.length} slopes for ${imf.breaksMsun.length} breaks)`);
      }
      if (!isStrictlyAscending(imf.breaksMsun)) issue(['primaries', 'imf', 'breaksMsun'], `must be strictly ascending (got [${imf.breaksMsun.join(', ')}])`);
    }

    const lifetime = s.primaries.lifetime;
    if (lifetime.kind === 'table') {
      const masses = lifetime.points.map((p) => p.massMsun);
      const times = lifetime.points.map((p) => p.lifetimeGyr);
      if (!isStrictlyAscending(masses)) issue(['primaries', 'lifetime', 'points'], `masses must be strictly ascending (got [${masses.join(', ')}])`);
      else if (!isStrictlyAscending(times.slice().reverse())) issue(['primaries', 'lifetime', 'points'], `lifetimes must fall strictly as mass rises (got [${times.join(', ')}])`);
    }

    const ifmr = s.primaries.ifmr;
    if (ifmr.relation === 'table') {
      const initial = ifmr.points.map((p) => p.initialMsun);
      if (!isStrictlyAscending(initial)) issue(['primaries', 'ifmr', 'points'], `initial masses must be strictly ascending (got [${initial.join(', ')}])`);
      ifmr.points.forEach((p, i) => {
        if (!(p.finalMsun < p.initialMsun)) issue(['primaries', 'ifmr', 'points', i, 'finalMsun'], `must be below initialMsun = ${p.initialMsun} (got ${p.finalMsun})`);
      });
    }

    const { rows, tableId, multiplier } = s.companions;
    if ((rows === undefined) === (tableId === undefined)) {
      issue(['companions'], `must give exactly one of rows or tableId (got ${rows === undefined ? 'neither' : 'both'})`);
    }
    rows?.forEach((row, i) => {
      const product = row.occurrence * multiplier;
      if (product > 1 + 1e-12) {
        issue(['companions', 'rows', i, 'occurrence'], `× companions.multiplier must be at most 1, since it is a probability (got ${row.occurrence} × ${multiplier} = ${formatNumber(product)})`);
      }
    });

    if (s.observed && s.observed.magnetic > s.observed.total) {
      issue(['observed', 'magnetic'], `must not exceed observed.total = ${s.observed.total} (got ${s.observed.magnetic})`);
    }
  });

export type ScenarioInput = z.input<typeof scenarioSchema>;
export type Scenario = z.output<typeof scenarioSchema>;
export type ImfOptions = Scenario['primaries']['imf'];
export type HistoryOptions = Scenario['primaries']['history'];
export type LifetimeOptions = Scenario['primaries']['lifetime'];
export type IfmrOptions = Scenario['primaries']['ifmr'];
export type GiantOptions = Scenario['giant'];
export type GiantTrackOptions = Extract<GiantOptions, { kind: 'track' }>;
export type FieldOptions = Scenario['field'];
export type DisruptionFieldOptions = FieldOptions['disruption'];
export type LognormalFieldOptions = Extract<DisruptionFieldOptions, { kind: 'lognormal' }>;
export type AccretionFieldOptions = Extract<DisruptionFieldOptions, { kind: 'accretion' }>;
export type CompanionScaledFieldOptions = Extract<DisruptionFieldOptions, { kind: 'companionScaled' }>;
export type CloseSurvivorFieldOptions = z.output<typeof closeSurvivorFieldSchema>;
export type DissolutionOptions = Scenario['disruption']['dissolution'];
export type FossilOptions = Scenario['channels']['fossil'];
export type SelectionOptions = Scenario['selection'];
export type ObservedSample = z.output<typeof observedSchema>;

function isStrictlyAscending(values: readonly number[]): boolean {
  for (let i = 1; i < values.length; i++) if (!(values[i] > values[i - 1])) return false;
  return true;
}

/** A scenario that failed validation; `issues` lists every problem, each naming its field. */
export class ScenarioValidationError extends Error {
  override readonly name = 'ScenarioValidationError';
  constructor(readonly issues: FieldIssue[]) {
    super(issues.map((i) => i.message).join('; '));
  }
}

/** Validates a scenario document and fills in the defaults; throws ScenarioValidationError. */
export function parseScenario(input: unknown): Scenario {
  const parsed = parseFields(scenarioSchema, input);
  if (parsed.success) return parsed.data;
  throw new ScenarioValidationError(parsed.issues);
}

// ---- sweeps -----------------------------------------------------------------------------

export interface SweepableParameter {
  path: string;
  label: string;
  unit: string;
  min: number;
  max: number;
  /** Present only for some scenarios (e.g. giant.reachAU needs giant.kind = fixedReach). */
  requires?: string;
}

const SWEEP_DEFINITIONS: Omit<SweepableParameter, 'min' | 'max'>[] = [
  { path: 'companions.multiplier', label: 'Occurrence multiplier', unit: '' },
  { path: 'envelope.alpha', label: 'Common-envelope efficiency α_CE', unit: '' },
  { path: 'envelope.lambda', label: 'Envelope binding parameter λ', unit: '' },
  { path: 'disruption.eta', label: 'Tidal-radius factor η', unit: '', requires: 'field.disruption.kind = accretion' },
  { path: 'field.thresholdMG', label: 'Magnetic detection threshold', unit: 'MG' },
  { path: 'giant.reachAU', label: 'Engulfment reach', unit: 'AU', requires: 'giant.kind = fixedReach' },
  { path: 'giant.reimersEta', label: 'Reimers mass-loss efficiency η_R', unit: '', requires: 'giant.kind = track' },
  { path: 'primaries.history.ageGyr', label: 'Population age', unit: 'Gyr' },
];

const SWEEP_SAMPLE_INPUT: Record<string, unknown> = {
  'giant.reachAU': { giant: { kind: 'fixedReach' } },
  'giant.reimersEta': { giant: { kind: 'track' } },
};

/**
 * The numeric fields a sweep may vary, with bounds read from the schema itself. Sweeping any
 * of the first six keeps common random numbers (the kernel's draws do not depend on them).
 */
export const SWEEPABLE_PARAMETERS: readonly SweepableParameter[] = SWEEP_DEFINITIONS.map((d) => {
  const bounds = boundsAt(scenarioSchema, d.path.split('.'), SWEEP_SAMPLE_INPUT[d.path] ?? {});
  if (!bounds || bounds.min === null || bounds.max === null) throw new Error(`sweep parameter ${d.path} has no numeric bounds in the schema`);
  return { ...d, min: bounds.min, max: bounds.max };
});

/** A new scenario with the numeric field at `path` set to `value`, validated again. */
export function withParameter(scenario: Scenario, path: string, value: number): Scenario {
  const known = SWEEPABLE_PARAMETERS.find((p) => p.path === path);
  if (!known) {
    throw new ScenarioValidationError([
      { field: path, message: `${path} is not a sweepable parameter (allowed: ${SWEEPABLE_PARAMETERS.map((p) => p.path).join(', ')})` },
    ]);
  }
  const copy = structuredClone(scenario) as Record<string, unknown>;
  const keys = path.split('.');
  let node = copy;
  for (const key of keys.slice(0, -1)) {
    const next = node[key];
    if (next === null || typeof next !== 'object') {
      throw new ScenarioValidationError([{ field: path, message: `${path} does not exist in this scenario` }]);
    }
    node = next as Record<string, unknown>;
  }
  const last = keys[keys.length - 1];
  if (!(last in node)) {
    throw new ScenarioValidationError([{ field: path, message: `${path} does not apply to this scenario (needs ${known.requires ?? 'a different scenario'})` }]);
  }
  node[last] = value;
  return parseScenario(copy);
}
