import { describe, expect, it } from 'vitest';
import { parseEnv } from './env.ts';

describe('client environment', () => {
  it('reads what Vite provides', () => {
    expect(parseEnv({ MODE: 'production', DEV: false, BASE_URL: '/' })).toEqual({ mode: 'production', isDev: false, baseUrl: '/' });
  });

  it('fails once with every problem listed', () => {
    expect(() => parseEnv({ MODE: 'x', BASE_URL: 'relative' })).toThrow(/DEV: .*\n- BASE_URL: /s);
  });
});
