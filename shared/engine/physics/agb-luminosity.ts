import { EngineError } from '../errors.ts';

/** Core mass at which Paczyński's relation reaches zero luminosity, Msun. */
const PACZYNSKI_ZERO_CORE_MASS_MSUN = 0.495;

/**
 * Core-mass–luminosity relation of the asymptotic giant branch, Lsun:
 *   L = 59250 (Mc − 0.495)
 * Source: Paczyński 1970, Acta Astronomica 20, 47, in the form DESIGN quotes. Caution (from
 * memory): the relation is also widely quoted with a zero point of 0.522 Msun instead of 0.495;
 * that version is 59250 × 0.027 ≈ 1600 Lsun fainter at every core mass. Tidefield adopts 0.495.
 *
 * Units: hydrogen-exhausted core mass in Msun; valid 0.495 < Mc ≤ 1.44 Msun (the relation
 * describes the thermally pulsing AGB; close to its zero point it is an extrapolation).
 * Example: Mc = 0.6 → 6221.25 Lsun; Mc = 0.8 → 18071.25 Lsun.
 */
export function agbLuminosityLsun(coreMassMsun: number): number {
  if (!(coreMassMsun > PACZYNSKI_ZERO_CORE_MASS_MSUN && coreMassMsun <= 1.44)) {
    throw new EngineError('coreMassMsun', coreMassMsun, '(0.495, 1.44] Msun');
  }
  return 59250 * (coreMassMsun - PACZYNSKI_ZERO_CORE_MASS_MSUN);
}
