import { describe, expect, it } from 'vitest';
import { parseScenario, ScenarioValidationError, type Scenario } from '../../contracts/scenario.ts';
import { prepareScenario, withDrawFreeValues } from './prepare.ts';
import { DRAW_FREE_PATHS } from './run-points.ts';

/**
 * A large fit derives each grid point's preparation from the pass's shared one
 * (withDrawFreeValues) instead of preparing it in full. The derivation must be the full
 * preparation exactly: for every draw-free path, on scenarios where it applies, the derived
 * preparation deep-equals prepareScenario of the document with the value written in and parsed
 * again. (run-points.test.ts checks the resulting tallies against separate runs.)
 */
const base = {
  seed: 'draw-free',
  systems: 1000,
  primaries: { imf: { law: 'salpeter1955' }, massRangeMsun: [1, 6], history: { kind: 'constant', ageGyr: 10 }, ifmr: { relation: 'kalirai2008' } },
  companions: {
    multiplier: 1,
    rows: [
      { class: 'planet', massMJup: [0.3, 40], periodDays: [2, 20000], occurrence: 0.3, shape: { kind: 'powerlaw', massSlope: -0.31, periodSlope: 0.26 } },
      { class: 'star', massRatio: [0.05, 0.6], periodDays: [0.5, 1e10], occurrence: 0.4, hostMassSlope: 0.3, shape: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 } },
    ],
  },
  giant: { kind: 'fixedReach', reachAU: 3 },
  envelope: { alpha: 1, lambda: 0.5 },
  disruption: { eta: 2.44, dissolution: { kind: 'belowMass', massMJup: 2 } },
  field: {
    disruption: { kind: 'companionScaled', referenceMG: 100, referenceMassMJup: 100, slope: 0.6, widthDex: 0.5 },
    closeSurvivor: { kind: 'lognormal', medianMG: 30, widthDex: 0.5, maxPeriodDays: 5 },
    emergenceDelayGyr: 0.5,
    thresholdMG: 1,
  },
  channels: { disruption: true, closeSurvivor: true, fossil: { enabled: true, fraction: 0.2, massRangeMsun: [1.5, 4], msField: { medianKG: 1, widthDex: 0.5 } } },
  selection: { kind: 'magnitudeLimited', coolingAgeFloorGyr: 0.1, wavelengthNm: 550 },
};
const variants: Record<string, Record<string, unknown>> = {
  'companion-scaled field, fixed reach': base,
  'log-normal field': { ...base, field: { ...base.field, disruption: { kind: 'lognormal', medianMG: 50, widthDex: 0.5 } } },
  'accretion field': { ...base, field: { ...base.field, disruption: { kind: 'accretion', alpha: 0.1, aspectRatio: 0.1, discMassFraction: 1, widthDex: 0.3 } } },
  'track giant': { ...base, giant: { kind: 'track' } },
};

/** The document with `value` at `path`, parsed; null where the path does not apply or the value is refused. */
function withValue(doc: Record<string, unknown>, path: string, value: number): Scenario | null {
  const copy = structuredClone(doc) as Record<string, any>;
  const keys = path.split('.');
  const parent = keys.slice(0, -1).reduce<Record<string, any> | undefined>((node, key) => node?.[key], copy);
  if (!parent || typeof parent[keys[keys.length - 1]] !== 'number') return null;
  parent[keys[keys.length - 1]] = value;
  try {
    return parseScenario(copy);
  } catch (error) {
    if (error instanceof ScenarioValidationError) return null;
    throw error;
  }
}

describe('withDrawFreeValues', () => {
  it('equals the full preparation for every draw-free path', () => {
    const covered = new Set<string>();
    for (const [name, doc] of Object.entries(variants)) {
      const prepared = prepareScenario(parseScenario(doc));
      const engulfmentGrid = prepared.giant.kind === 'track' ? prepared.giant.grid : undefined;
      for (const path of DRAW_FREE_PATHS) {
        const current = path.split('.').reduce<any>((node, key) => node?.[key], parseScenario(doc));
        if (typeof current !== 'number') continue;
        // A value well away from the scenario's own (0.7 × it, or 0.25 where it is 0).
        const scenario = withValue(doc, path, current > 0 ? current * 0.7 : 0.25);
        if (!scenario) continue;
        expect(withDrawFreeValues(prepared, scenario), `${name}: ${path}`).toEqual(prepareScenario(scenario, { engulfmentGrid }));
        covered.add(path);
      }
    }
    expect([...covered].sort()).toEqual([...DRAW_FREE_PATHS].sort());
  }, 120_000);
});
