import { describe, expect, it } from 'vitest';
import { sameFractionTest } from './two-sample.ts';

describe('sameFractionTest on the single vs detached-companion example', () => {
  it('gives p = 5.687e-40 (13.23σ) for 149 of 1500 against 0 of 1200', () => {
    // scipy 1.17.1, computed once: fisher_exact([[149, 1351], [0, 1200]]).pvalue = 5.686980030186101e-40,
    // norm.isf(p/2) = 13.232620027402737. The engine's Fisher test is exact to ~1e-11 relative.
    const r = sameFractionTest(149, 1500, 0, 1200);
    expect(Math.abs(r.pValue - 5.686980030186101e-40) / 5.686980030186101e-40).toBeLessThan(1e-9);
    expect(r.sigma).toBeCloseTo(13.232620027402737, 8);
  });
});
