import { describe, expect, it } from 'vitest';
import { postCommonEnvelopeSeparationAU } from './common-envelope-webbink1984.ts';

describe('common-envelope energy formalism (Webbink 1984; λ of de Kool 1990)', () => {
  it('returns the separation at which α ΔE_orb equals the envelope binding energy', () => {
    // Check by substitution into the published balance (G = 1 units: AU, Msun).
    const [ai, r, m, mc, m2, alpha, lambda] = [1.3, 1.1, 2.2, 0.62, 0.25, 0.7, 0.4];
    const af = postCommonEnvelopeSeparationAU(ai, r, m, mc, m2, alpha, lambda);
    const deltaOrbit = (mc * m2) / (2 * af) - (m * m2) / (2 * ai);
    const binding = (m * (m - mc)) / (lambda * r);
    expect(alpha * deltaOrbit).toBeCloseTo(binding, 10);
  });
  it('reproduces the worked example in the module (a_f ≈ 0.0153 AU)', () => {
    expect(postCommonEnvelopeSeparationAU(1, 1, 2, 0.6, 0.3, 1, 0.5)).toBeCloseTo(0.18 / 11.8, 12);
  });
  it('shrinks a planet-mass companion to a tiny orbit and a stellar one much less', () => {
    const planet = postCommonEnvelopeSeparationAU(1, 1, 2, 0.6, 1e-3, 1, 0.5);
    const star = postCommonEnvelopeSeparationAU(1, 1, 2, 0.6, 0.3, 1, 0.5);
    expect(planet / star).toBeLessThan(0.01);
  });
  it('rejects a core heavier than the giant', () => {
    expect(() => postCommonEnvelopeSeparationAU(1, 1, 1, 1.2, 0.1, 1, 0.5)).toThrow(/coreMassMsun = 1.2/);
  });
});
