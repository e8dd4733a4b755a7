import { requireInRange } from '../errors.ts';
import { HELIUM_FLASH_MAX_MASS_MSUN } from './rgb-tip-core-mass.ts';

/**
 * Core-mass–luminosity relation of the first giant branch, Lsun:
 *   L = min(B Mc^q, D Mc^p)                                   HPT2000 eq. (37)
 * with, at Z = 0.02 (ζ = 0),
 *   p = 6, q = 3 for M ≤ M_HeF;  p = 5, q = 2 for M ≥ 2.5;  linear in M between,
 *   B = max(3×10^4, 500 + 1.75×10^4 M^0.6),
 *   log10 D = D0 = 5.37 + 0.135 ζ for M ≤ M_HeF,
 *   log10 D = max(−1.0, 0.975 D0 − 0.18 M, 0.5 D0 − 0.06 M) for M ≥ 2.5, linear in M between
 *                                                              HPT2000 eq. (38)
 * Source: Hurley, Pols & Tout 2000, MNRAS 315, 543, §5.2 (equation numbers and the
 * coefficients of B and of D for M ≥ 2.5 are from memory of the paper; D0 = 10^5.37 is also
 * the value DESIGN quotes). M is the initial mass (the relation's mass dependence is a fit
 * parameter, not the current mass).
 *
 * Units: core and initial mass in Msun. Valid 0.02 ≤ Mc ≤ 2 Msun, 0.5 ≤ M ≤ 10 Msun.
 * Example: Mc = 0.47, M = 1 → D Mc^6 = 10^5.37 × 0.47^6 ≈ 2524 Lsun (the D branch; B Mc^3 ≈ 3115).
 */
export function giantBranchLuminosityLsun(coreMassMsun: number, initialMassMsun: number): number {
  requireInRange('coreMassMsun', coreMassMsun, 0.02, 2, 'Msun');
  requireInRange('initialMassMsun', initialMassMsun, 0.5, 10, 'Msun');
  const m = initialMassMsun;
  // Weight of the high-mass (M ≥ 2.5) coefficients; HPT2000 interpolate linearly in M.
  const w = Math.min(1, Math.max(0, (m - HELIUM_FLASH_MAX_MASS_MSUN) / (2.5 - HELIUM_FLASH_MAX_MASS_MSUN)));
  const p = 6 - w;
  const q = 3 - w;
  const b = Math.max(3e4, 500 + 1.75e4 * m ** 0.6);
  const logD0 = 5.37;
  const logDHigh = Math.max(-1.0, 0.975 * logD0 - 0.18 * m, 0.5 * logD0 - 0.06 * m);
  const logD = logD0 + w * (logDHigh - logD0);
  return Math.min(b * coreMassMsun ** q, 10 ** logD * coreMassMsun ** p);
}
