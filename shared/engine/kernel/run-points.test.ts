import { describe, expect, it } from 'vitest';
import { parseScenario, type Scenario } from '../../contracts/scenario.ts';
import { EngineError } from '../errors.ts';
import { buildEngulfmentGrid, type EngulfmentGrid } from '../physics/engulfment-grid.ts';
import { engulfmentGridInputFor } from './engulfment.ts';
import { prepareScenario, withDrawFreeValues } from './prepare.ts';
import { runChunk } from './run-chunk.ts';
import { DRAW_FREE_PATHS, isDrawFreePath, preparePoints, runChunkPoints, type PointValues } from './run-points.ts';
import type { ChunkTally } from './tally.ts';

/**
 * The multi-point kernel's contract: point p's tally is identical (every count and bin, and the
 * scenario hash) to a separate run of the scenario with point p's values and the same seed.
 * Each draw-free path is moved over three values on a scenario where it applies, in a pass of
 * its own and in one pass over all paths with a point that moves them all at once; the separate runs are built from the document
 * with the value written in and parsed again, not from the kernel's own point preparation.
 * Small samples (one chunk of 12,000 systems) keep the test quick: exactness does not need many.
 */

const SYSTEMS = 12_000;

const base = {
  seed: 'points',
  systems: SYSTEMS,
  primaries: { imf: { law: 'salpeter1955' }, massRangeMsun: [1, 6], history: { kind: 'constant', ageGyr: 10 }, ifmr: { relation: 'kalirai2008' } },
  companions: {
    multiplier: 1,
    rows: [
      { class: 'planet', massMJup: [0.3, 40], periodDays: [2, 20000], occurrence: 0.3, shape: { kind: 'powerlaw', massSlope: -0.31, periodSlope: 0.26 } },
      { class: 'star', massRatio: [0.05, 0.6], periodDays: [0.5, 1e10], occurrence: 0.4, hostMassSlope: 0.3, shape: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 } },
      { class: 'brownDwarf', massMJup: [13, 80], periodDays: [2, 2000], occurrence: 0.1, shape: { kind: 'powerlaw', massSlope: 0, periodSlope: 0 } },
    ],
  },
  giant: { kind: 'fixedReach', reachAU: 3 },
  envelope: { alpha: 1, lambda: 0.5 },
  disruption: { eta: 2.44, dissolution: { kind: 'belowMass', massMJup: 2 } },
  field: {
    disruption: { kind: 'companionScaled', referenceMG: 100, referenceMassMJup: 100, slope: 0.6, widthDex: 0.5 },
    closeSurvivor: { kind: 'lognormal', medianMG: 30, widthDex: 0.5, maxPeriodDays: 5 },
    emergenceDelayGyr: 0,
    thresholdMG: 1,
  },
  channels: { disruption: true, closeSurvivor: true, fossil: { enabled: true, fraction: 0.2, massRangeMsun: [1.5, 4], msField: { medianKG: 1, widthDex: 0.5 } } },
  selection: { kind: 'volume' },
};

type Doc = Record<string, unknown>;

function withValues(doc: Doc, values: PointValues): Doc {
  const copy = structuredClone(doc);
  for (const [path, value] of Object.entries(values)) {
    const keys = path.split('.');
    let node = copy as Record<string, unknown>;
    for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
    node[keys[keys.length - 1]] = value;
  }
  return copy;
}

const merge = (doc: Doc, patch: Doc): Doc => ({ ...structuredClone(doc), ...structuredClone(patch) });
const fieldWith = (disruption: Doc) => ({ field: { ...base.field, disruption } });

const fixedReach = parseScenario(base) && (base as Doc);
const lognormalField = merge(base, fieldWith({ kind: 'lognormal', medianMG: 50, widthDex: 0.5 }));
const accretionField = merge(base, fieldWith({ kind: 'accretion', alpha: 0.1, aspectRatio: 0.1, discMassFraction: 1, widthDex: 0.3 }));
const magnitudeLimited = merge(base, { selection: { kind: 'magnitudeLimited', coolingAgeFloorGyr: 0.1, wavelengthNm: 550 } });
const burst = merge(base, { primaries: { ...base.primaries, history: { kind: 'burst', ageGyr: 10 } } });
const track = merge(base, { giant: { kind: 'track' } });
const noHostScaling = merge(base, { companions: { multiplier: 1, rows: base.companions.rows.map(({ hostMassSlope: _, ...row }: Doc) => row) } });

/** Path → three values inside its range, far apart. */
const VALUES: Record<string, number[]> = {
  'companions.multiplier': [0.3, 1.4, 2.5],
  'envelope.alpha': [0.05, 0.4, 3],
  'envelope.lambda': [0.1, 1, 4],
  'disruption.eta': [0.5, 2.44, 4.5],
  'disruption.dissolution.massMJup': [0.5, 10, 60],
  'giant.reachAU': [0.3, 2, 8],
  'field.thresholdMG': [0.1, 10, 300],
  'field.emergenceDelayGyr': [0, 1, 4],
  'field.disruption.medianMG': [0.3, 5, 300],
  'field.disruption.widthDex': [0, 0.8, 2],
  'field.disruption.referenceMG': [1, 30, 3000],
  'field.disruption.referenceMassMJup': [1, 100, 800],
  'field.disruption.slope': [-1, 0.6, 2],
  'field.disruption.alpha': [0.001, 0.1, 0.9],
  'field.disruption.aspectRatio': [0.01, 0.1, 0.4],
  'field.disruption.discMassFraction': [0.001, 0.1, 1],
  'field.closeSurvivor.medianMG': [0.3, 30, 1000],
  'field.closeSurvivor.widthDex': [0, 1, 2.5],
  'field.closeSurvivor.maxPeriodDays': [0.1, 5, 60],
  'channels.fossil.fraction': [0, 0.3, 1],
  'channels.fossil.msField.medianKG': [0.01, 1, 100],
  'channels.fossil.msField.widthDex': [0, 1, 2.5],
};

/** Which scenarios each path is checked on (it must apply there). */
const CASES: [name: string, doc: Doc, paths: string[]][] = [
  ['fixedReach', fixedReach, DRAW_FREE_PATHS.filter((p) => !/^field\.disruption\.(medianMG|alpha|aspectRatio|discMassFraction)$/.test(p) && p !== 'disruption.eta')],
  ['fixedReach, lognormal disruption field', lognormalField, ['field.disruption.medianMG', 'field.disruption.widthDex', 'field.thresholdMG']],
  ['fixedReach, accretion disruption field', accretionField, ['disruption.eta', 'field.disruption.alpha', 'field.disruption.aspectRatio', 'field.disruption.discMassFraction', 'field.disruption.widthDex']],
  ['fixedReach, magnitude-limited', magnitudeLimited, ['companions.multiplier', 'envelope.alpha', 'giant.reachAU', 'field.thresholdMG', 'channels.fossil.fraction']],
  ['fixedReach, no host-mass scaling', noHostScaling, ['companions.multiplier', 'envelope.alpha', 'field.thresholdMG']],
  ['fixedReach, burst', burst, ['field.emergenceDelayGyr', 'envelope.lambda', 'companions.multiplier']],
  ['track', track, DRAW_FREE_PATHS.filter((p) => p !== 'giant.reachAU' && !/^field\.disruption\.(medianMG|alpha|aspectRatio|discMassFraction)$/.test(p) && p !== 'disruption.eta')],
];

const grids = new Map<string, EngulfmentGrid>();
function gridFor(s: Scenario): EngulfmentGrid | undefined {
  if (s.giant.kind !== 'track') return undefined;
  const key = JSON.stringify(engulfmentGridInputFor(s));
  if (!grids.has(key)) grids.set(key, buildEngulfmentGrid(engulfmentGridInputFor(s)));
  return grids.get(key);
}

function separateRun(doc: Doc, values: PointValues): ChunkTally {
  const s = parseScenario(withValues(doc, values));
  return runChunk(prepareScenario(s, { engulfmentGrid: gridFor(s) }), 0);
}

describe('multi-point kernel: each point equals a separate run', { timeout: 120_000 }, () => {
  for (const [name, doc, paths] of CASES) {
    it(`${name}: ${paths.length} draw-free paths`, () => {
      const scenario = parseScenario(doc);
      const prepared = prepareScenario(scenario, { engulfmentGrid: gridFor(scenario) });
      const check = (points: PointValues[]) => {
        const tallies = runChunkPoints(prepared, preparePoints(scenario, prepared, points), 0);
        expect(tallies).toHaveLength(points.length);
        points.forEach((values, p) => expect(tallies[p], JSON.stringify(values)).toEqual(separateRun(doc, values)));
        return tallies;
      };
      // One pass per path (the scenario's own value first, then three others) ...
      for (const path of paths) {
        const tallies = check([{}, ...VALUES[path].map((value) => ({ [path]: value }))]);
        // not vacuous: the path changes the counts on this scenario
        expect(new Set(tallies.map((t) => JSON.stringify({ ...t, scenarioHash: '' }))).size, path).toBeGreaterThan(1);
      }
      // ... and one pass over all of them, with a point that moves every path at once.
      check([...paths.flatMap((path) => VALUES[path].map((value) => ({ [path]: value }))), Object.fromEntries(paths.map((path) => [path, VALUES[path][2]]))]);
    });
  }

  // The kernel tallies each point as a change from the point before it, and skips a point whose
  // companions present are those of the point before when only presence varies for the system:
  // grids in both orders, and a multiplier that goes up and comes back, must still equal separate runs.
  it('grids in either order and revisited values: every point equals a separate run', () => {
    const scenario = parseScenario(base);
    const prepared = prepareScenario(scenario);
    const multipliers = [0.3, 2.5, 0.3, 1.4, 1.4, 0.3];
    const alphas = [0.05, 3, 0.4];
    const grids: PointValues[][] = [
      multipliers.map((m) => ({ 'companions.multiplier': m })),
      multipliers.flatMap((m) => alphas.map((a) => ({ 'companions.multiplier': m, 'envelope.alpha': a }))),
      alphas.flatMap((a) => multipliers.map((m) => ({ 'companions.multiplier': m, 'envelope.alpha': a }))),
      multipliers.flatMap((m) => [0.1, 300, 0.1].map((t) => ({ 'companions.multiplier': m, 'field.thresholdMG': t }))),
    ];
    for (const points of grids) {
      const tallies = runChunkPoints(prepared, preparePoints(scenario, prepared, points), 0);
      points.forEach((values, p) => expect(tallies[p], JSON.stringify(values)).toEqual(separateRun(base, values)));
    }
  }, 120_000);

  it('the one-point pass is the single run, and the scenario hashes are those of the points’ scenarios', () => {
    const scenario = parseScenario(base);
    const prepared = prepareScenario(scenario);
    const [only] = runChunkPoints(prepared, preparePoints(scenario, prepared, [{}]), 0);
    expect(only).toEqual(runChunk(prepared, 0));
    const [a, b] = runChunkPoints(prepared, preparePoints(scenario, prepared, [{ 'envelope.alpha': 1 }, { 'envelope.alpha': 2 }]), 0);
    expect(a.scenarioHash).toBe(prepared.scenarioHash);
    expect(b.scenarioHash).toBe(prepareScenario(parseScenario(withValues(base, { 'envelope.alpha': 2 }))).scenarioHash);
  });
});

describe('withDrawFreeValues (how preparePoints derives each point from the shared preparation)', () => {
  it('equals the full preparation of the point\'s document for every draw-free path and value', () => {
    for (const [name, doc, paths] of CASES) {
      const scenario = parseScenario(doc);
      const prepared = prepareScenario(scenario, { engulfmentGrid: gridFor(scenario) });
      for (const path of paths) {
        for (const value of VALUES[path]) {
          const point = parseScenario(withValues(doc, { [path]: value }));
          expect(withDrawFreeValues(prepared, point), `${name}: ${path} = ${value}`).toEqual(prepareScenario(point, { engulfmentGrid: gridFor(point) }));
        }
      }
    }
  }, 120_000);
});

describe('preparePoints validation', () => {
  const scenario = parseScenario(base);
  const prepared = prepareScenario(scenario);
  const fails = (values: PointValues, s: Scenario = scenario) => () => preparePoints(s, s === scenario ? prepared : prepareScenario(s), [values]);

  it('lists the draw-free paths and refuses others, naming the field', () => {
    expect(isDrawFreePath('envelope.alpha')).toBe(true);
    expect(isDrawFreePath('primaries.history.ageGyr')).toBe(false);
    expect(fails({ 'primaries.history.ageGyr': 5 })).toThrow(EngineError);
    expect(fails({ 'primaries.history.ageGyr': 5 })).toThrow(/primaries\.history\.ageGyr = 5 is outside the allowed range of the draw-free parameters/);
    expect(() => preparePoints(scenario, prepared, [])).toThrow(/points/);
  });

  it('refuses values outside the contract range with that range (schema bounds of scenario.ts)', () => {
    expect(fails({ 'envelope.alpha': 50 })).toThrow('envelope.alpha = 50 is outside the allowed range [0.01, 10]');
    expect(fails({ 'field.thresholdMG': 0 })).toThrow('field.thresholdMG = 0 is outside the allowed range [0.01, 1000]');
    expect(fails({ 'field.disruption.slope': Number.NaN })).toThrow('field.disruption.slope = NaN is outside the allowed range [-2, 3]');
  });

  it('refuses a multiplier above 1 / the largest occurrence (a probability above 1)', () => {
    const error = (() => {
      try {
        fails({ 'companions.multiplier': 3 })();
      } catch (e) {
        return e as EngineError;
      }
    })();
    expect(error).toBeInstanceOf(EngineError);
    expect(error?.parameter).toMatch(/^companions/);
  });

  it('refuses a path this scenario does not have, saying why', () => {
    expect(fails({ 'field.disruption.medianMG': 5 })).toThrow(/field\.disruption\.kind = companionScaled/);
    const trackScenario = parseScenario(track);
    expect(() => preparePoints(trackScenario, prepareScenario(trackScenario, { engulfmentGrid: gridFor(trackScenario) }), [{ 'giant.reachAU': 2 }])).toThrow(/giant\.kind = track/);
  }, 60_000);
});
