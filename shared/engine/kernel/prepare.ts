import { byOption } from '../../contracts/method-option.ts';
import type { CompanionRow, CompanionShape } from '../../contracts/occurrence-table.ts';
import type { DissolutionOptions, GiantOptions, HistoryOptions, Scenario, SelectionOptions } from '../../contracts/scenario.ts';
import { MJUP_MSUN } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { standardNormalCdf } from '../numerics/normal-cdf.ts';
import { normalQuantile } from '../numerics/normal-quantile.ts';
import { tabulateQuantile, type QuantileTable } from '../numerics/quantile-table.ts';
import type { IfmrSegments } from '../physics/ifmr-piecewise.ts';
import { powerLawLog10Quantile, powerLawQuantileTable, type PowerLawQuantileTable } from '../physics/imf-power-law.ts';
import { buildImfSampler, type ImfSampler } from '../physics/imf-sampler.ts';
import { opticalFlux } from '../physics/selection-magnitude-limited.ts';
import { ENGINE_VERSION } from '../version.ts';
import { planChunks } from './chunks.ts';
import { buildTrackGiant, type EngulfmentGrid, type PreparedTrack, type SharedEngulfmentGrid } from './engulfment.ts';
import { buildPrimaryTable, buildWhiteDwarfDraw, type PrimaryTable, type WhiteDwarfDraw } from './primary-table.ts';
import { scenarioHash } from './scenario-hash.ts';
import {
  heaviestWhiteDwarfMsun,
  ifmrSegments,
  lifetimeGyr,
  lightestWhiteDwarfProgenitorMsun,
  multiplierMaxFor,
  preparedLifetime,
  resolvedRows,
  type PreparedLifetime,
} from './scenario-physics.ts';

/** Lightest white dwarf the magnitude-limited reference scan considers, Msun (helium white dwarfs of early ejections). */
const REFERENCE_SCAN_LO_MSUN = 0.1;

/** A companion row reduced to the numbers the hot loop needs. */
export interface PreparedRow {
  occurrence: number;
  /** Occurrence × (M1/Msun)^hostMassSlope, capped at 1 per star; 0 = independent of the host. */
  hostMassSlope: number;
  /** Presence uniforms below this draw the companion's mass and period: occurrence · m_max. */
  drawThreshold: number;
  /** Presence uniforms below this make the companion present: occurrence · multiplier. */
  presentThreshold: number;
  /** true: the mass range is a mass ratio q = M2/M1; false: masses in Msun. */
  massIsRatio: boolean;
  massLo: number;
  massHi: number;
  /** Inverse-CDF constants of dN ∝ x^massSlope dln x; null for a flat mass distribution. */
  massQuantile: PowerLawQuantileTable | null;
  periodLoDays: number;
  periodHiDays: number;
  /** Inverse-CDF constants of dN ∝ P^periodSlope dln P; null for the log-normal shape. */
  periodQuantile: PowerLawQuantileTable | null;
  /** log10 of the power-law mass quantile, tabulated (numerics/quantile-table.ts); null = exact or flat. */
  log10MassTable: QuantileTable | null;
  /** log10 of the period quantile (either shape), tabulated; null = drawn exactly. */
  log10PeriodTable: QuantileTable | null;
  meanLog10PeriodDays: number;
  sigmaLog10Period: number;
  /** Φ at the lower truncation point and Φ(hi) − Φ(lo), for the log-normal shape. */
  cdfLo: number;
  cdfSpan: number;
}

export interface PreparedFossil {
  enabled: boolean;
  fraction: number;
  massRangeMsun: [number, number];
  msField: { medianKG: number; widthDex: number };
}

export type PreparedGiant = { kind: 'fixedReach'; reachAU: number } | PreparedTrack;

export type PreparedSelection =
  | { kind: 'volume' }
  | { kind: 'magnitudeLimited'; coolingAgeFloorGyr: number; wavelengthNm: number; referenceFlux: number };

/**
 * Everything runChunk needs, as plain structured-clone-able data. Fields keep the scenario
 * contract's names and nesting (envelope.alpha, disruption.eta, channels.fossil.msField, …);
 * derived numbers say what they are (dissolutionBelowMsun, multiplierMax, …).
 */
export interface PreparedScenario {
  engineVersion: string;
  scenarioHash: string;
  seed: string;
  systems: number;
  chunkCount: number;
  imf: ImfSampler;
  massRangeMsun: [number, number];
  constantHistory: boolean;
  ageGyr: number;
  lifetime: PreparedLifetime;
  /** The primary's mass and main-sequence lifetime tabulated over its mass uniform (primary-table.ts). */
  primary: PrimaryTable;
  /** How many of a chunk's primaries are white dwarfs today, and how each is drawn (primary-table.ts). */
  whiteDwarfs: WhiteDwarfDraw;
  ifmr: IfmrSegments;
  rows: PreparedRow[];
  multiplier: number;
  /** Largest multiplier the rows allow, 1 / max(occurrence) (1 if no row has any). */
  multiplierMax: number;
  giant: PreparedGiant;
  envelope: { alpha: number; lambda: number };
  disruption: {
    eta: number;
    /** Destroyed companions lighter than this (Msun) dissolve in the envelope; 0 = none do. */
    dissolutionBelowMsun: number;
  };
  field: Scenario['field'];
  /** Which channels make a field (channels.disruption, channels.closeSurvivor) and the fossil channel's options. */
  channels: { disruption: boolean; closeSurvivor: boolean; fossil: PreparedFossil };
  selection: PreparedSelection;
}

/**
 * Reduces a parsed scenario to plain data for the kernel. For `giant.kind = "track"` the
 * engulfment grid is built here unless one is passed in (the server caches grids by
 * engulfmentGridKey(engulfmentGridInputFor(scenario))).
 */
export function prepareScenario(scenario: Scenario, options: { engulfmentGrid?: EngulfmentGrid | SharedEngulfmentGrid } = {}): PreparedScenario {
  const rows = resolvedRows(scenario);
  const { chunkCount } = planChunks(scenario.systems);
  const p = scenario.primaries;
  const ifmr = ifmrSegments(scenario);
  const lifetime = preparedLifetime(scenario);
  const maxOccurrence = rows.reduce((m, r) => Math.max(m, r.occurrence), 0);
  const multiplierMax = multiplierMaxFor(rows);
  const imf = buildImfSampler(p.imf, p.massRangeMsun);
  const primary = buildPrimaryTable(imf, lifetime);
  const constantHistory = isConstantHistory(p.history);
  return {
    engineVersion: ENGINE_VERSION,
    scenarioHash: scenarioHash(scenario),
    seed: scenario.seed,
    systems: scenario.systems,
    chunkCount,
    imf,
    massRangeMsun: [p.massRangeMsun[0], p.massRangeMsun[1]],
    constantHistory,
    ageGyr: p.history.ageGyr,
    lifetime,
    primary,
    whiteDwarfs: buildWhiteDwarfDraw(primary, { constant: constantHistory, ageGyr: p.history.ageGyr }),
    ifmr,
    multiplierMax,
    selection: preparedSelection(scenario.selection, scenario, lifetime, ifmr),
    ...drawFreeParts(
      scenario,
      rows.map((row) => prepareRow(row, maxOccurrence, multiplierMax)),
      preparedGiant(scenario.giant, scenario, options.engulfmentGrid),
    ),
  };
}

/**
 * The preparation of `scenario`, which must differ from the scenario `prepared` was made from only
 * in draw-free values (run-points.ts: DRAW_FREE_PATHS): `prepared` with its scenario hash and the
 * parts those values decide (drawFreeParts) replaced, everything the draws need (quantile tables,
 * the primary table and white-dwarf draw, a track's grid) shared. Equal to prepareScenario(scenario) at a fraction of
 * its cost (run-points.test.ts checks every path); the caller checks that only draw-free paths differ.
 */
export function withDrawFreeValues(prepared: PreparedScenario, scenario: Scenario): PreparedScenario {
  return { ...prepared, scenarioHash: scenarioHash(scenario), ...drawFreeParts(scenario, prepared.rows, prepared.giant) };
}

type DrawnRow = Omit<PreparedRow, 'presentThreshold'>;
type DrawFreeParts = Pick<PreparedScenario, 'multiplier' | 'rows' | 'giant' | 'envelope' | 'disruption' | 'field' | 'channels'>;

/**
 * What the draw-free parameters decide, from the scenario and the rows and giant that its draws
 * fix: the multiplier and each row's presence threshold, the reach of `fixedReach` (a track giant
 * is kept: none of its options is draw-free), α_CE and λ, η and the dissolution mass, the field
 * options, and the channels (the fossil fraction and main-sequence field).
 */
function drawFreeParts(scenario: Scenario, rows: readonly DrawnRow[], giant: PreparedGiant): DrawFreeParts {
  // occurrence × multiplier ≤ 1 is the contract's rule (scenario.ts checks it when the document is
  // parsed, the one place); presence is still capped at the draw threshold, so that rounding never
  // lets "present" exceed "drawn".
  const multiplier = scenario.companions.multiplier;
  const fossil = scenario.channels.fossil;
  return {
    multiplier,
    rows: rows.map((row) => ({ ...row, presentThreshold: Math.min(row.drawThreshold, row.occurrence * multiplier) })),
    giant: giant.kind === 'track' ? giant : preparedGiant(scenario.giant, scenario, undefined),
    envelope: { alpha: scenario.envelope.alpha, lambda: scenario.envelope.lambda },
    disruption: {
      eta: scenario.disruption.eta,
      dissolutionBelowMsun: dissolutionBelowMsun(scenario.disruption.dissolution),
    },
    field: scenario.field,
    channels: {
      disruption: scenario.channels.disruption,
      closeSurvivor: scenario.channels.closeSurvivor,
      fossil: {
        enabled: fossil.enabled,
        fraction: fossil.fraction,
        massRangeMsun: [fossil.massRangeMsun[0], fossil.massRangeMsun[1]],
        msField: { medianKG: fossil.msField.medianKG, widthDex: fossil.msField.widthDex },
      },
    },
  };
}

// One entry per option of each choice the preparation reads (a new variant without one is a type error).
const isConstantHistory = byOption<HistoryOptions, 'kind', boolean>('kind', { constant: () => true, burst: () => false });

const preparedGiant = byOption<GiantOptions, 'kind', PreparedGiant, [Scenario, EngulfmentGrid | SharedEngulfmentGrid | undefined]>('kind', {
  fixedReach: (giant) => ({ kind: 'fixedReach', reachAU: giant.reachAU }),
  track: (_giant, scenario, grid) => buildTrackGiant(scenario, grid),
});

const dissolutionBelowMsun = byOption<DissolutionOptions, 'kind', number>('kind', {
  none: () => 0,
  belowMass: (dissolution) => dissolution.massMJup * MJUP_MSUN,
});

/** A row's draw numbers (its presence threshold is drawFreeParts'). */
function prepareRow(row: CompanionRow, maxOccurrence: number, multiplierMax: number): DrawnRow {
  // The most frequent row is always drawn.
  const drawThreshold = row.occurrence === maxOccurrence ? 1 : Math.min(1, row.occurrence * multiplierMax);
  const [massLo, massHi] = row.massRatio ?? (row.massMsun ? row.massMsun : [row.massMJup![0] * MJUP_MSUN, row.massMJup![1] * MJUP_MSUN]);
  const [periodLoDays, periodHiDays] = row.periodDays;
  const base = {
    occurrence: row.occurrence,
    hostMassSlope: row.hostMassSlope ?? 0,
    drawThreshold,
    massIsRatio: row.massRatio !== undefined,
    massLo,
    massHi,
    periodLoDays,
    periodHiDays,
  };
  return { ...base, ...preparedShape(row.shape, row, massLo, massHi) };
}

/** The hot loop's numbers for a row's distribution shape. */
type ShapeNumbers = Omit<PreparedRow, 'occurrence' | 'hostMassSlope' | 'drawThreshold' | 'presentThreshold' | 'massIsRatio' | 'massLo' | 'massHi' | 'periodLoDays' | 'periodHiDays'>;

const preparedShape = byOption<CompanionShape, 'kind', ShapeNumbers, [CompanionRow, number, number]>('kind', {
  powerlaw: (shape, row, massLo, massHi) => {
    const [periodLoDays, periodHiDays] = row.periodDays;
    const massQuantile = powerLawQuantileTable(massLo, massHi, shape.massSlope);
    const periodQuantile = powerLawQuantileTable(periodLoDays, periodHiDays, shape.periodSlope);
    return {
      massQuantile,
      periodQuantile,
      log10MassTable: tabulateQuantile((u) => powerLawLog10Quantile(massQuantile, u)),
      log10PeriodTable: tabulateQuantile((u) => powerLawLog10Quantile(periodQuantile, u)),
      meanLog10PeriodDays: 0,
      sigmaLog10Period: 1,
      cdfLo: 0,
      cdfSpan: 1,
    };
  },
  lognormalPeriod: (shape, row) => {
    const [periodLoDays, periodHiDays] = row.periodDays;
    const mean = shape.meanLog10PeriodDays;
    const sigma = shape.sigmaLog10Period;
    const cdfLo = standardNormalCdf((Math.log10(periodLoDays) - mean) / sigma);
    const cdfHi = standardNormalCdf((Math.log10(periodHiDays) - mean) / sigma);
    if (!(cdfHi - cdfLo > 1e-12)) {
      throw new EngineError('companions.rows[].periodDays', row.periodDays, `a range holding more than 1e-12 of the log-normal (mean ${mean}, sigma ${sigma})`);
    }
    return {
      massQuantile: null,
      periodQuantile: null,
      log10MassTable: null,
      log10PeriodTable: tabulateQuantile((u) => mean + sigma * normalQuantile(cdfLo + u * (cdfHi - cdfLo))),
      meanLog10PeriodDays: mean,
      sigmaLog10Period: sigma,
      cdfLo,
      cdfSpan: cdfHi - cdfLo,
    };
  },
});

const preparedSelection = byOption<SelectionOptions, 'kind', PreparedSelection, [Scenario, PreparedLifetime, IfmrSegments]>('kind', {
  volume: () => ({ kind: 'volume' }),
  magnitudeLimited: (selection, scenario, lifetime, ifmr) => {
    const p = scenario.primaries;
    const [lo, hi] = p.massRangeMsun;
    const age = p.history.ageGyr;
    const lightest = lightestWhiteDwarfProgenitorMsun(lifetime, p.massRangeMsun, age) ?? lo;
    const heaviest = heaviestWhiteDwarfMsun(ifmr, lightest, hi);
    // The youngest cooling age any white dwarf can have: zero for constant star formation, and
    // age − t_MS(heaviest primary) for a burst, raised to the floor. The flux falls with cooling
    // age, so the brightest white dwarf of the run is among those; its mass is found by a scan
    // from the lightest helium white dwarf (0.1 Msun) to the heaviest, and normalising to it keeps
    // the acceptance ≤ 1.
    const youngest = Math.max(selection.coolingAgeFloorGyr, isConstantHistory(p.history) ? 0 : Math.max(0, age - lifetimeGyr(lifetime, hi)));
    let referenceFlux = 0;
    const scan = 256;
    for (let k = 0; k <= scan; k++) {
      const mass = REFERENCE_SCAN_LO_MSUN + ((heaviest - REFERENCE_SCAN_LO_MSUN) * k) / scan;
      referenceFlux = Math.max(referenceFlux, opticalFlux(mass, youngest, selection.wavelengthNm));
    }
    return { kind: 'magnitudeLimited', coolingAgeFloorGyr: selection.coolingAgeFloorGyr, wavelengthNm: selection.wavelengthNm, referenceFlux: referenceFlux * (1 + 1e-6) };
  },
});
