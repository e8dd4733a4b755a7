import { requireInRange } from '../errors.ts';

/**
 * Radius of a giant with a degenerate core, Rsun:
 *   R = A (L^0.4 + 0.383 L^0.76),  A ≈ 1.1 M^−0.3
 * Source: Hurley, Pols & Tout 2000, MNRAS 315, 543, §5.2, eq. (46), the giant-branch radius,
 * with its exponents and A evaluated at Z = 0.02 (the low-mass branch of A; the values are the
 * ones DESIGN quotes, from memory of the paper). M is the current total mass, so the radius
 * grows as the wind strips the envelope. Tidefield uses the same relation on the AGB, where
 * HPT2000 give a formula of the same form (eq. (74) there) with nearly the same coefficients.
 *
 * Units: luminosity in Lsun, mass in Msun. Valid 0.1 ≤ L ≤ 10^6 Lsun, 0.1 ≤ M ≤ 10 Msun.
 * Example: L = 2500 Lsun, M = 1 Msun → 1.1 × (22.88 + 0.383 × 381.9) ≈ 186 Rsun.
 */
export function giantRadiusRsun(luminosityLsun: number, massMsun: number): number {
  requireInRange('luminosityLsun', luminosityLsun, 0.1, 1e6, 'Lsun');
  requireInRange('massMsun', massMsun, 0.1, 10, 'Msun');
  return 1.1 * massMsun ** -0.3 * (luminosityLsun ** 0.4 + 0.383 * luminosityLsun ** 0.76);
}
