import { describe, expect, it } from 'vitest';
import { constraintSchemaFor, libraryReferenceSchema, observedConstraintSchema, twoSampleBodySchema } from './constraints.ts';

const issues = (input: Record<string, unknown>) => {
  const r = observedConstraintSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
};

describe('constraint contract', () => {
  it('accepts the documented forms with their defaults', () => {
    expect(observedConstraintSchema.parse({ kind: 'fraction', setting: 'postCE', magnetic: 0, total: 1253 })).toMatchObject({ setting: 'postCE' });
    expect(observedConstraintSchema.parse({ kind: 'fraction', value: 0.1, error: 0.02 })).toMatchObject({ setting: 'all' });
    expect(observedConstraintSchema.parse({ kind: 'meanMass', massesMsun: [0.8] })).toMatchObject({ population: 'magnetic', setting: 'all' });
    expect(observedConstraintSchema.parse({ kind: 'fieldDistribution', fieldsMG: [3, 40] })).toMatchObject({ thresholdMG: 1 });
    expect(constraintSchemaFor({ libraryId: 'x' })).toBe(libraryReferenceSchema);
  });

  it('names what is missing or contradictory', () => {
    expect(issues({ kind: 'fraction', value: 0.1 })).toEqual(['error: error is required with value (or mark the value as bound: "lower")']);
    expect(issues({ kind: 'fraction', magnetic: 3, total: 2 })).toEqual(['magnetic: magnetic must not exceed total = 2 (got 3)']);
    expect(issues({ kind: 'fraction', magnetic: 1, total: 10, value: 0.1, error: 0.01 })[0]).toMatch(/either magnetic and total or value/);
    expect(issues({ kind: 'meanMass', meanMsun: 0.8 })).toEqual(['errorMsun: errorMsun is required with meanMsun']);
    expect(issues({ kind: 'coolingAgeIncidence', bins: [{ ageMinGyr: 2, ageMaxGyr: 1, magnetic: 0, total: 5 }] })[0]).toMatch(/bins\[0\]\.ageMaxGyr must be above ageMinGyr = 2/);
    expect(issues({ kind: 'postCommonEnvelopePeriods', periodsDays: [-1] })[0]).toMatch(/periodsDays\[\] must be above 0/);
    expect(twoSampleBodySchema.safeParse({ a: { magnetic: 1, total: 0 }, b: { magnetic: 0, total: 1 } }).success).toBe(false);
  });
});
