import { describe, expect, it } from 'vitest';
import { formWords, sampleBodyFromEntries, sampleFormDefaults, sampleFormSchema } from './sample-form-values.ts';

const entries = (over: Record<string, string> = {}) => ({ name: 'Pilot', magnetic: '9', total: '78', setting: 'all', fieldThresholdMG: '1', provenance: '', ...over });

describe('sampleBodyFromEntries', () => {
  it('reads numbers with digit grouping and leaves empty optional fields out', () => {
    expect(sampleBodyFromEntries(entries({ total: '1,253', fieldThresholdMG: '' }))).toEqual({ name: 'Pilot', magnetic: 9, total: 1253, setting: 'all', bins: [] });
  });

  it('groups the splits by their index, in order', () => {
    const body = sampleBodyFromEntries(
      entries({
        'bins.1.kind': 'massBin', 'bins.1.massMinMsun': '0.5', 'bins.1.massMaxMsun': '0.7', 'bins.1.magnetic': '4', 'bins.1.total': '52',
        'bins.0.kind': 'setting', 'bins.0.setting': 'single', 'bins.0.magnetic': '9', 'bins.0.total': '61',
      }),
    );
    expect(body.bins).toEqual([
      { kind: 'setting', setting: 'single', magnetic: 9, total: 61 },
      { kind: 'massBin', massMinMsun: 0.5, massMaxMsun: 0.7, magnetic: 4, total: 52 },
    ]);
  });
});

describe('sampleFormSchema', () => {
  it('passes a valid sample as the request body', () => {
    const parsed = sampleFormSchema.safeParse(entries());
    expect(parsed.success && parsed.data).toEqual({ name: 'Pilot', magnetic: 9, total: 78, setting: 'all', fieldThresholdMG: 1, bins: [] });
  });

  it('puts each problem at the input named by its path, in the form’s words', () => {
    const parsed = sampleFormSchema.safeParse(entries({ magnetic: '90', 'bins.0.kind': 'massBin', 'bins.0.massMinMsun': '2', 'bins.0.massMaxMsun': '0.9', 'bins.0.magnetic': '1', 'bins.0.total': '5' }));
    expect(parsed.success).toBe(false);
    const issues = parsed.error!.issues.map((i) => [i.path.join('.'), i.message]);
    // Ranges from the shared schema (shared/contracts/samples.ts): masses 0.1–1.44 Msun.
    expect(issues).toContainEqual(['bins.0.massMinMsun', 'the lower mass must be between 0.1 and 1.44 (got 2)']);
    expect(issues).toContainEqual(['magnetic', 'magnetic must not exceed total = 78 (got 90)']);
  });

  it('says what a word in a count box should be', () => {
    const parsed = sampleFormSchema.safeParse(entries({ total: 'many' }));
    expect(parsed.error!.issues[0]).toMatchObject({ path: ['total'], message: 'total must be an integer between 0 and 1e8 (got NaN)' });
  });
});

describe('formWords and defaults', () => {
  it('drops the split index, which the input already shows', () => {
    expect(formWords('bins[2].magnetic must not exceed bins[2].total = 5 (got 7)')).toBe('magnetic must not exceed total = 5 (got 7)');
  });

  it('starts a new sample at a 1 MG threshold and keeps a saved one’s numbers', () => {
    expect(sampleFormDefaults().fieldThresholdMG).toBe('1');
    expect(sampleFormDefaults({ fieldThresholdMG: null } as never).fieldThresholdMG).toBe('');
  });
});
