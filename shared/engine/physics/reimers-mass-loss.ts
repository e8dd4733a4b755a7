import { requireInRange } from '../errors.ts';

/**
 * Wind mass-loss rate of a red giant, Msun/yr:
 *   Ṁ = 4×10⁻¹³ η L R / M      (L, R, M in solar units)
 * Source: Reimers 1975, Mém. Soc. R. Sci. Liège 8, 369; η ≈ 0.48 ± 0.07 from globular-cluster
 * horizontal branches (McDonald & Zijlstra 2015, MNRAS 448, 502).
 *
 * Units: η dimensionless (0 ≤ η ≤ 5), L in Lsun (0–10^6), R in Rsun (0.1–10^4), M in Msun
 * (0.05–10). Example: η = 0.5, L = 1000, R = 100, M = 1 → 2×10⁻⁸ Msun/yr.
 */
export function reimersMassLossMsunPerYr(eta: number, luminosityLsun: number, radiusRsun: number, massMsun: number): number {
  requireInRange('reimersEta', eta, 0, 5);
  requireInRange('luminosityLsun', luminosityLsun, 0, 1e6, 'Lsun');
  requireInRange('radiusRsun', radiusRsun, 0.1, 1e4, 'Rsun');
  requireInRange('massMsun', massMsun, 0.05, 10, 'Msun');
  return (4e-13 * eta * luminosityLsun * radiusRsun) / massMsun;
}
