import { describe, expect, it } from 'vitest';
import { curlExample, tokenState } from './token-text.ts';

const now = new Date('2026-03-10T12:00:00Z');

describe('tokenState', () => {
  it('is active without an expiry or before it', () => {
    expect(tokenState({ revokedAt: null, expiresAt: null }, now)).toBe('active');
    expect(tokenState({ revokedAt: null, expiresAt: '2026-03-11T00:00:00Z' }, now)).toBe('active');
  });

  it('is expired from the expiry on', () => {
    expect(tokenState({ revokedAt: null, expiresAt: '2026-03-10T12:00:00Z' }, now)).toBe('expired');
  });

  it('says revoked even when the token has also expired', () => {
    expect(tokenState({ revokedAt: '2026-03-01T00:00:00Z', expiresAt: '2026-03-02T00:00:00Z' }, now)).toBe('revoked');
  });
});

describe('curlExample', () => {
  it('sends the token as a bearer header to the runs list', () => {
    expect(curlExample('http://127.0.0.1:3000', 'tfk_abc')).toBe('curl -H "Authorization: Bearer tfk_abc" http://127.0.0.1:3000/api/runs');
  });
});
