import { describe, expect, it } from 'vitest';
import { parseScenario, type Scenario } from '../../contracts/scenario.ts';
import { buildResult } from '../result/build-result.ts';
import { CHUNK_SYSTEMS } from '../version.ts';
import { prepareScenario } from './prepare.ts';
import { runChunk } from './run-chunk.ts';
import { addTally, emptyTallyFor } from './tally.ts';

/**
 * Every numeric scenario option, moved across its range on a scenario where it applies, changes
 * the counts (DESIGN: "every scenario option changes the result where it applies"). The counts
 * compared are the whole integer part of the result: counts and histograms. Seeds are fixed, so
 * each comparison is exact; the two values of each option are far apart within the schema's
 * range, so a change that the physics makes is not lost in one seed's noise.
 */

type Path = (string | number)[];

const base = {
  seed: 'options',
  systems: 2 * CHUNK_SYSTEMS,
  primaries: {
    imf: { law: 'kroupa2001' },
    massRangeMsun: [0.8, 8],
    history: { kind: 'constant', ageGyr: 10 },
    lifetime: { kind: 'scaling', t0Gyr: 10, exponent: 2.5 },
    ifmr: { relation: 'cummings2018', calibration: 'mist' },
  },
  companions: {
    multiplier: 1,
    rows: [
      { class: 'planet', massMJup: [0.3, 20], periodDays: [2, 20000], occurrence: 0.3, shape: { kind: 'powerlaw', massSlope: -0.31, periodSlope: 0.26 } },
      { class: 'star', massRatio: [0.05, 0.6], periodDays: [0.5, 1e10], occurrence: 0.4, shape: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 } },
    ],
  },
  giant: { kind: 'fixedReach', reachAU: 3 },
  envelope: { alpha: 1, lambda: 0.5 },
  disruption: { eta: 2.44, dissolution: { kind: 'none' } },
  field: {
    disruption: { kind: 'companionScaled', referenceMG: 100, referenceMassMJup: 100, slope: 0.6, widthDex: 0.5 },
    closeSurvivor: { kind: 'lognormal', medianMG: 30, widthDex: 0.5, maxPeriodDays: 0.5 },
    emergenceDelayGyr: 0,
    thresholdMG: 1,
  },
  channels: { disruption: true, closeSurvivor: true, fossil: { enabled: true, fraction: 0.2, massRangeMsun: [1.5, 4], msField: { medianKG: 1, widthDex: 0.5 } } },
  selection: { kind: 'volume' },
};

function withValue(doc: unknown, path: Path, value: unknown): Record<string, unknown> {
  const copy = structuredClone(doc) as Record<string, unknown>;
  let node = copy as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  node[path[path.length - 1]] = value;
  return copy;
}

function signature(s: Scenario): string {
  const prepared = prepareScenario(s);
  let tally = emptyTallyFor(prepared.scenarioHash);
  for (let i = 0; i < prepared.chunkCount; i++) tally = addTally(tally, runChunk(prepared, i));
  const r = buildResult(s, tally, { prepared });
  return JSON.stringify({ counts: r.counts, bins: r.bins });
}

function expectMoves(doc: unknown, path: Path, lo: unknown, hi: unknown): void {
  const a = signature(parseScenario(withValue(doc, path, lo)));
  const b = signature(parseScenario(withValue(doc, path, hi)));
  expect(a === b, `${path.join('.')}: ${JSON.stringify(lo)} and ${JSON.stringify(hi)} give the same counts`).toBe(false);
}

const lognormalDisruption = withValue(base, ['field', 'disruption'], { kind: 'lognormal', medianMG: 50, widthDex: 0.5 });
const accretionDisruption = withValue(base, ['field', 'disruption'], { kind: 'accretion', alpha: 0.1, aspectRatio: 0.1, discMassFraction: 1, widthDex: 0.3 });
const dissolving = withValue(base, ['disruption', 'dissolution'], { kind: 'belowMass', massMJup: 1 });
const magnitudeLimited = withValue(base, ['selection'], { kind: 'magnitudeLimited', coolingAgeFloorGyr: 0.1, wavelengthNm: 550 });
const powerLawImf = withValue(base, ['primaries', 'imf'], { law: 'powerlaw', slope: 2.35 });
const brokenImf = withValue(base, ['primaries', 'imf'], { law: 'brokenPowerlaw', breaksMsun: [2], slopes: [1.3, 2.3] });
const lifetimeTable = withValue(base, ['primaries', 'lifetime'], { kind: 'table', points: [{ massMsun: 0.8, lifetimeGyr: 20 }, { massMsun: 8, lifetimeGyr: 0.05 }] });
const ifmrTable = withValue(base, ['primaries', 'ifmr'], { relation: 'table', points: [{ initialMsun: 0.8, finalMsun: 0.55 }, { initialMsun: 8, finalMsun: 1.3 }] });

const FAST: [string, unknown, Path, unknown, unknown][] = [
  ['base', base, ['systems'], CHUNK_SYSTEMS, 2 * CHUNK_SYSTEMS],
  ['base', base, ['primaries', 'massRangeMsun'], [0.8, 8], [1, 6]],
  ['base', base, ['primaries', 'history', 'ageGyr'], 10, 5],
  ['base', base, ['primaries', 'lifetime', 't0Gyr'], 10, 5],
  ['base', base, ['primaries', 'lifetime', 'exponent'], 2.5, 3.5],
  ['power-law IMF', powerLawImf, ['primaries', 'imf', 'slope'], 2.35, 1.5],
  ['broken power-law IMF', brokenImf, ['primaries', 'imf', 'breaksMsun'], [2], [4]],
  ['broken power-law IMF', brokenImf, ['primaries', 'imf', 'slopes'], [1.3, 2.3], [1.3, 3.5]],
  ['lifetime table', lifetimeTable, ['primaries', 'lifetime', 'points', 0, 'lifetimeGyr'], 20, 40],
  ['IFMR table', ifmrTable, ['primaries', 'ifmr', 'points', 1, 'finalMsun'], 1.3, 0.9],
  ['base', base, ['companions', 'multiplier'], 1, 0.5],
  ['base', base, ['companions', 'rows', 0, 'occurrence'], 0.3, 0.1],
  ['base', base, ['companions', 'rows', 0, 'hostMassSlope'], 0, 1.5],
  ['base', base, ['companions', 'rows', 0, 'massMJup'], [0.3, 20], [5, 60]],
  ['base', base, ['companions', 'rows', 0, 'periodDays'], [2, 20000], [200, 20000]],
  ['base', base, ['companions', 'rows', 0, 'shape', 'massSlope'], -0.31, 1],
  ['base', base, ['companions', 'rows', 0, 'shape', 'periodSlope'], 0.26, -1],
  ['base', base, ['companions', 'rows', 1, 'massRatio'], [0.05, 0.6], [0.3, 1]],
  ['base', base, ['companions', 'rows', 1, 'shape', 'meanLog10PeriodDays'], 5.03, 2],
  ['base', base, ['companions', 'rows', 1, 'shape', 'sigmaLog10Period'], 2.28, 0.5],
  ['base', base, ['companions', 'rows', 1, 'hostMassSlope'], 0, -1],
  ['base', base, ['giant', 'reachAU'], 3, 1],
  ['base', base, ['envelope', 'alpha'], 1, 0.1],
  ['base', base, ['envelope', 'lambda'], 0.5, 0.1],
  ['base', base, ['field', 'disruption', 'referenceMG'], 100, 3],
  ['base', base, ['field', 'disruption', 'referenceMassMJup'], 100, 1],
  ['base', base, ['field', 'disruption', 'slope'], 0.6, 0],
  ['base', base, ['field', 'disruption', 'widthDex'], 0.5, 2],
  ['log-normal disruption field', lognormalDisruption, ['field', 'disruption', 'medianMG'], 50, 2],
  ['log-normal disruption field', lognormalDisruption, ['field', 'disruption', 'widthDex'], 0.5, 2],
  ['accretion field', accretionDisruption, ['disruption', 'eta'], 2.44, 0.5],
  ['accretion field', accretionDisruption, ['field', 'disruption', 'alpha'], 0.1, 0.001],
  ['accretion field', accretionDisruption, ['field', 'disruption', 'aspectRatio'], 0.1, 0.01],
  ['accretion field', accretionDisruption, ['field', 'disruption', 'discMassFraction'], 1, 0.001],
  ['accretion field', accretionDisruption, ['field', 'disruption', 'widthDex'], 0.3, 1.5],
  ['dissolution on', dissolving, ['disruption', 'dissolution', 'massMJup'], 1, 10],
  ['base', base, ['field', 'closeSurvivor', 'medianMG'], 30, 0.1],
  ['base', base, ['field', 'closeSurvivor', 'widthDex'], 0.5, 2],
  ['base', base, ['field', 'closeSurvivor', 'maxPeriodDays'], 0.5, 5],
  ['base', base, ['field', 'emergenceDelayGyr'], 0, 3],
  ['base', base, ['field', 'thresholdMG'], 1, 30],
  ['base', base, ['channels', 'fossil', 'fraction'], 0.2, 0.05],
  ['base', base, ['channels', 'fossil', 'massRangeMsun'], [1.5, 4], [2, 3]],
  ['base', base, ['channels', 'fossil', 'msField', 'medianKG'], 1, 0.01],
  ['base', base, ['channels', 'fossil', 'msField', 'widthDex'], 0.5, 1.5],
  ['magnitude-limited', magnitudeLimited, ['selection', 'coolingAgeFloorGyr'], 0.1, 1],
  ['magnitude-limited', magnitudeLimited, ['selection', 'wavelengthNm'], 550, 2000],
];

describe('every numeric option changes the counts where it applies (fixedReach and the field options)', () => {
  for (const [where, doc, path, lo, hi] of FAST) {
    it(`${path.join('.')} on the ${where} scenario`, () => expectMoves(doc, path, lo, hi), 60_000);
  }
});

describe('every numeric option of the track giant changes the counts', () => {
  const track = withValue(
    withValue(base, ['giant'], { kind: 'track', reimersEta: 0.477, agbZeroPointMsun: 0.522, superwind: { kind: 'bloecker1995', eta: 0.05 }, tide: { kind: 'zahn1977' } }),
    ['primaries', 'massRangeMsun'],
    [0.8, 3],
  );
  const TRACK: [Path, unknown, unknown][] = [
    [['giant', 'reimersEta'], 0.477, 1.5],
    [['giant', 'agbZeroPointMsun'], 0.522, 0.495],
    [['giant', 'superwind', 'eta'], 0.05, 0.8],
  ];
  for (const [path, lo, hi] of TRACK) {
    it(`${path.join('.')}`, () => expectMoves(track, path, lo, hi), 300_000);
  }
});
