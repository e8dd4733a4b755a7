import { requireInRange } from '../errors.ts';

/**
 * Superwind mass-loss rate on the asymptotic giant branch, Msun/yr:
 *   Ṁ_B = η_B · 4.83×10⁻⁹ M_ZAMS^−2.1 L^2.7 · (4×10⁻¹³ L R / M)
 *       = 1.932×10⁻²¹ η_B M_ZAMS^−2.1 L^3.7 R / M              (solar units)
 * i.e. Blöcker's fit to the pulsating-atmosphere models of Bowen (1988) times the Reimers rate
 * with η = 1, scaled by the efficiency η_B. Source: Blöcker 1995, A&A 297, 727, eq. (16)
 * (equation number and coefficients from memory of the paper). M_ZAMS is the initial mass,
 * M the current mass. The steep L^3.7 makes it negligible on the early AGB and dominant near
 * the AGB tip, where it strips what is left of the envelope.
 *
 * Units: η_B dimensionless (0–1), L in Lsun (0–10^6), R in Rsun (0.1–10^4), M and M_ZAMS in
 * Msun (0.05–10 and 0.5–10). Example: η_B = 0.05, L = 10^4, R = 300, M = M_ZAMS = 1 →
 * 1.932×10⁻²¹ × 0.05 × 10^14.8 × 300 ≈ 1.83×10⁻⁵ Msun/yr.
 */
export function bloeckerMassLossMsunPerYr(
  etaB: number,
  luminosityLsun: number,
  radiusRsun: number,
  massMsun: number,
  initialMassMsun: number,
): number {
  requireInRange('superwind.eta', etaB, 0, 1);
  requireInRange('luminosityLsun', luminosityLsun, 0, 1e6, 'Lsun');
  requireInRange('radiusRsun', radiusRsun, 0.1, 1e4, 'Rsun');
  requireInRange('massMsun', massMsun, 0.05, 10, 'Msun');
  requireInRange('initialMassMsun', initialMassMsun, 0.5, 10, 'Msun');
  const reimersEtaOne = (4e-13 * luminosityLsun * radiusRsun) / massMsun;
  return etaB * 4.83e-9 * initialMassMsun ** -2.1 * luminosityLsun ** 2.7 * reimersEtaOne;
}
