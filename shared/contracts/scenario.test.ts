import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { parseScenario, scenarioSchema, ScenarioValidationError, SWEEPABLE_PARAMETERS, withParameter } from './scenario.ts';

const checkOne = () => JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8'));

/** The issues of a rejected document (fails the test if it was accepted). */
function issuesOf(input: unknown) {
  try {
    parseScenario(input);
  } catch (error) {
    expect(error).toBeInstanceOf(ScenarioValidationError);
    return (error as ScenarioValidationError).issues;
  }
  throw new Error('the scenario was accepted');
}

describe('scenario schema', () => {
  it('accepts the issue example unchanged and fills the defaults it leaves out', () => {
    const s = parseScenario(checkOne());
    expect(s.systems).toBe(1_000_000);
    expect(s.primaries.imf).toEqual({ law: 'powerlaw', slope: 2.35 });
    expect(s.channels.fossil.enabled).toBe(false);
    expect(s.channels.fossil.fraction).toBe(0.05);
    expect(s.companions.rows?.[0].shape).toEqual({ kind: 'powerlaw', massSlope: 0, periodSlope: 0 });
  });

  it('fills a whole scenario from just a seed', () => {
    const s = parseScenario({ seed: 'x' });
    expect(s.systems).toBe(1e6);
    expect(s.giant).toEqual({ kind: 'fixedReach', reachAU: 2 });
    expect(s.primaries.ifmr).toEqual({ relation: 'cummings2018', calibration: 'mist' });
  });

  it('accepts every offered law and option', () => {
    const base = checkOne();
    const variants = [
      { primaries: { ...base.primaries, imf: { law: 'kroupa2001' } } },
      { primaries: { ...base.primaries, imf: { law: 'salpeter1955' } } },
      { primaries: { ...base.primaries, imf: { law: 'chabrier2003' } } },
      { primaries: { ...base.primaries, imf: { law: 'brokenPowerlaw', breaksMsun: [0.5, 2], slopes: [1.3, 2.3, 2.7] } } },
      { primaries: { ...base.primaries, history: { kind: 'constant', ageGyr: 10 } } },
      { primaries: { ...base.primaries, lifetime: { kind: 'table', points: [{ massMsun: 1, lifetimeGyr: 10 }, { massMsun: 8, lifetimeGyr: 0.05 }] } } },
      { primaries: { ...base.primaries, ifmr: { relation: 'cummings2018', calibration: 'parsec' } } },
      { primaries: { ...base.primaries, ifmr: { relation: 'table', points: [{ initialMsun: 1, finalMsun: 0.55 }, { initialMsun: 8, finalMsun: 1.3 }] } } },
      { giant: { kind: 'track' } },
      { field: { ...base.field, disruption: { kind: 'accretion' } } },
      { channels: { ...base.channels, fossil: { enabled: true, fraction: 0.1, massRangeMsun: [1.5, 4], msField: { medianKG: 2, widthDex: 0.3 } } } },
      { selection: { kind: 'magnitudeLimited', coolingAgeFloorGyr: 0.2 } },
      { companions: { multiplier: 1, tableId: 'baseline-occurrence' } },
      { companions: { multiplier: 2, rows: [{ class: 'star', massRatio: [0.1, 1], periodDays: [1, 1e8], occurrence: 0.4, shape: { kind: 'lognormalPeriod' } }] } },
      { observed: { magnetic: 3, total: 40 } },
    ];
    for (const v of variants) expect(() => parseScenario({ ...base, ...v })).not.toThrow();
  });

  it('names the field, the value and the allowed range', () => {
    const issues = issuesOf({ ...checkOne(), envelope: { alpha: 20, lambda: 0.5 } });
    expect(issues).toEqual([{ field: 'envelope.alpha', message: 'envelope.alpha must be between 0.01 and 10 (got 20)' }]);
  });

  it.each([
    ['NaN', (s: any) => ({ ...s, envelope: { alpha: 0.1, lambda: NaN } }), 'envelope.lambda', /a number between 0.05 and 5 \(got NaN\)/],
    ['a negative mass', (s: any) => ({ ...s, companions: { ...s.companions, rows: [{ ...s.companions.rows[0], massMJup: [-1, 3] }] } }), 'companions.rows[0].massMJup[0]', /between 0.001 and 1000 \(got -1\)/],
    ['an empty range', (s: any) => ({ ...s, primaries: { ...s.primaries, massRangeMsun: [3, 3] } }), 'primaries.massRangeMsun', /low below high \(got \[3, 3\]\)/],
    ['an inverted range', (s: any) => ({ ...s, companions: { ...s.companions, rows: [{ ...s.companions.rows[0], periodDays: [100, 10] }] } }), 'companions.rows[0].periodDays', /low below high/],
    ['occurrence × multiplier > 1', (s: any) => ({ ...s, companions: { ...s.companions, multiplier: 4 } }), 'companions.rows[0].occurrence', /0.3 × 4 = 1.2/],
    ['an unknown law', (s: any) => ({ ...s, primaries: { ...s.primaries, imf: { law: 'miller1979' } } }), 'primaries.imf.law', /one of powerlaw, brokenPowerlaw, salpeter1955, kroupa2001, chabrier2003 \(got "miller1979"\)/],
    ['more than 1e10 systems', (s: any) => ({ ...s, systems: 1e12 }), 'systems', /between 1000 and 1e10 \(got 1e12\)/],
    ['a fractional system count', (s: any) => ({ ...s, systems: 1500.5 }), 'systems', /an integer between 1000 and 1e10/],
    ['an unknown key', (s: any) => ({ ...s, envelope: { alpha: 0.1, lambda: 0.5, gamma: 1 } }), 'envelope.gamma', /not a field here \(allowed: alpha, lambda\)/],
    ['two mass units in one row', (s: any) => ({ ...s, companions: { ...s.companions, rows: [{ ...s.companions.rows[0], massMsun: [0.1, 0.2] }] } }), 'companions.rows[0].massMsun', /exactly one mass range/],
    ['an out-of-range track option (colleague schema, bounds read from it)', (s: any) => ({ ...s, giant: { kind: 'track', reimersEta: 9 } }), 'giant.reimersEta', /between 0.05 and 3 \(got 9\)/],
    ['a field threshold beyond 1000 MG', (s: any) => ({ ...s, field: { ...s.field, thresholdMG: 2000 } }), 'field.thresholdMG', /between 0.01 and 1000/],
    ['more magnetic than observed in total', (s: any) => ({ ...s, observed: { magnetic: 5, total: 4 } }), 'observed.magnetic', /must not exceed observed.total/],
  ])('rejects %s, naming the field', (_label, mutate, field, message) => {
    const issues = issuesOf(mutate(checkOne()));
    const issue = issues.find((i) => i.field === field);
    expect(issue, JSON.stringify(issues)).toBeDefined();
    expect(issue!.message.startsWith(field)).toBe(true);
    expect(issue!.message).toMatch(message);
  });

  it('accepts the documented ranges at both ends', () => {
    const base = checkOne();
    for (const alpha of [0.01, 10]) expect(() => parseScenario({ ...base, envelope: { alpha, lambda: 0.5 } })).not.toThrow();
    for (const lambda of [0.05, 5]) expect(() => parseScenario({ ...base, envelope: { alpha: 1, lambda } })).not.toThrow();
    for (const thresholdMG of [0.01, 1000]) expect(() => parseScenario({ ...base, field: { ...base.field, thresholdMG } })).not.toThrow();
    for (const systems of [1e3, 1e10]) expect(() => parseScenario({ ...base, systems })).not.toThrow();
  });

  it('converts to JSON Schema with zod 4', () => {
    const schema = z.toJSONSchema(scenarioSchema, { io: 'input' }) as { properties: Record<string, unknown> };
    expect(Object.keys(schema.properties)).toEqual(expect.arrayContaining(['seed', 'systems', 'primaries', 'companions', 'giant']));
    expect(JSON.stringify(schema)).toContain('"maximum":10000000000');
  });
});

describe('sweeps', () => {
  it('lists the required parameters with bounds taken from the schema', () => {
    const byPath = Object.fromEntries(SWEEPABLE_PARAMETERS.map((p) => [p.path, p]));
    for (const path of ['companions.multiplier', 'envelope.alpha', 'envelope.lambda', 'disruption.eta', 'field.thresholdMG', 'giant.reachAU']) {
      expect(byPath[path], path).toBeDefined();
    }
    expect([byPath['envelope.alpha'].min, byPath['envelope.alpha'].max]).toEqual([0.01, 10]);
    expect([byPath['field.thresholdMG'].min, byPath['field.thresholdMG'].max]).toEqual([0.01, 1000]);
    expect(byPath['giant.reachAU'].unit).toBe('AU');
  });

  it('withParameter returns a new validated scenario and leaves the input alone', () => {
    const s = parseScenario(checkOne());
    const t = withParameter(s, 'envelope.alpha', 2);
    expect(t.envelope.alpha).toBe(2);
    expect(s.envelope.alpha).toBe(0.1);
    expect(() => withParameter(s, 'envelope.alpha', 50)).toThrow(/envelope.alpha must be between 0.01 and 10 \(got 50\)/);
    expect(() => withParameter(s, 'companions.multiplier', 3.5)).toThrow(/× companions.multiplier must be at most 1/);
    expect(() => withParameter(parseScenario({ ...checkOne(), giant: { kind: 'track' } }), 'giant.reachAU', 3)).toThrow(/does not apply/);
    expect(() => withParameter(s, 'seed', 3)).toThrow(/not a sweepable parameter/);
  });
});
