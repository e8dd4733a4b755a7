import { requireInRange } from '../errors.ts';

/**
 * Separation after a common envelope, energy formalism (Webbink 1984, ApJ 277, 355,
 * with the envelope structure parameter λ of de Kool 1990, ApJ 358, 189):
 *   α_CE [G M_core M2/(2 a_f) − G M_giant M2/(2 a_i)] = G M_giant M_env/(λ R),
 * solved for a_f:  a_f = M_core M2 / [2 M_giant M_env/(α_CE λ R) + M_giant M2/a_i].
 * a_i is the separation when the envelope engulfs the companion and R the giant's radius then
 * (in the fixedReach approximation both equal the initial separation). Units: Msun and AU.
 * Valid for any positive masses with M_core < M_giant.
 * Example: a_i = R = 1 AU, M_giant = 2, M_core = 0.6, M2 = 0.3, α λ = 0.5 gives
 *   a_f = 0.18 / (2·2·1.4/0.5 + 0.6) = 0.0153 AU ≈ 3.3 Rsun.
 */
export function postCommonEnvelopeSeparationAU(
  initialSeparationAU: number,
  giantRadiusAU: number,
  giantMassMsun: number,
  coreMassMsun: number,
  companionMassMsun: number,
  alphaCE: number,
  lambda: number,
): number {
  requireInRange('coreMassMsun', coreMassMsun, 0, giantMassMsun, 'Msun');
  const envelopeMsun = giantMassMsun - coreMassMsun;
  return (
    (coreMassMsun * companionMassMsun) /
    ((2 * giantMassMsun * envelopeMsun) / (alphaCE * lambda * giantRadiusAU) + (giantMassMsun * companionMassMsun) / initialSeparationAU)
  );
}
