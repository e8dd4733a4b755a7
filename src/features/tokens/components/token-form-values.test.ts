import { describe, expect, it } from 'vitest';
import { tokenFormSchema } from './token-form-values.ts';

describe('tokenFormSchema', () => {
  it('reads the days as a number and leaves an empty expiry out', () => {
    expect(tokenFormSchema.parse({ name: ' laptop ', expiresInDays: '30' })).toEqual({ name: 'laptop', scope: 'read', expiresInDays: 30 });
    expect(tokenFormSchema.parse({ name: 'laptop', scope: 'run', expiresInDays: '' })).toEqual({ name: 'laptop', scope: 'run' });
  });

  it('names the allowed range of the expiry, whatever is wrong with it', () => {
    // Range from shared/contracts/tokens.ts: 1 to 3650 days.
    for (const typed of ['5000', '0', '2.5', 'soon']) {
      const issue = tokenFormSchema.safeParse({ name: 'x', expiresInDays: typed }).error!.issues[0];
      expect(issue.path).toEqual(['expiresInDays']);
      expect(issue.message).toBe(`the expiry must be a whole number of days from 1 to 3650, or empty for never (got ${typed})`);
    }
  });

  it('asks for a name', () => {
    expect(tokenFormSchema.safeParse({ name: '  ', expiresInDays: '' }).error!.issues[0]).toMatchObject({ path: ['name'], message: 'the name must not be empty' });
  });
});
