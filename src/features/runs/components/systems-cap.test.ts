import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { prefilledSystems, systemsCapFor, withSystemsCap } from './systems-cap.ts';

describe('the observer cap on a run size', () => {
  it('pre-fills within the cap (regression: a 10^7 scenario pre-filled 10^7 for an observer, whose cap is 10^6)', () => {
    expect(prefilledSystems(10_000_000, systemsCapFor('observer'))).toBe('1000000');
    expect(prefilledSystems(300_000, systemsCapFor('observer'))).toBe('300000');
    expect(prefilledSystems(10_000_000, systemsCapFor('modeller'))).toBe('10000000');
  });

  it('refuses a size above the cap at the systems field, in the server’s words', () => {
    const schema = withSystemsCap(z.object({ systems: z.number().optional() }), systemsCapFor('observer'));
    const result = schema.safeParse({ systems: 5_000_000 });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].path).toEqual(['systems']);
    expect(result.error?.issues[0].message).toMatch(/Observers may start runs of at most 1,000,000 systems \(this one has 5,000,000\)/);
    expect(schema.safeParse({ systems: 1_000_000 }).success).toBe(true);
  });
});
