import { EngineError } from '../errors.ts';

/** The zero point as Paczyński's relation is usually quoted, Msun (from memory). */
export const PACZYNSKI_ZERO_POINT_MSUN = 0.522;

/**
 * Core-mass–luminosity relation of the asymptotic giant branch, Lsun:
 *   L = 59250 (Mc − Mc0)
 * Source: Paczyński 1970, Acta Astronomica 20, 47. The zero point Mc0 is an option
 * (`giant.agbZeroPointMsun`): 0.522 Msun as the relation is usually quoted, 0.495 Msun in a later
 * recalibration (both from memory; the 0.027 Msun between them is ≈ 1600 Lsun at every core mass).
 *
 * Units: hydrogen-exhausted core mass and zero point in Msun; valid Mc0 < Mc ≤ 1.44 Msun (the
 * relation describes the thermally pulsing AGB; close to its zero point it is an extrapolation).
 * Example: Mc = 0.6, Mc0 = 0.522 → 4621.5 Lsun; Mc0 = 0.495 → 6221.25 Lsun.
 */
export function agbLuminosityLsun(coreMassMsun: number, zeroPointMsun: number = PACZYNSKI_ZERO_POINT_MSUN): number {
  if (!(coreMassMsun > zeroPointMsun && coreMassMsun <= 1.44)) {
    throw new EngineError('coreMassMsun', coreMassMsun, `(${zeroPointMsun}, 1.44] Msun`);
  }
  return 59250 * (coreMassMsun - zeroPointMsun);
}
