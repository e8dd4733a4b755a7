import { requireInRange } from '../errors.ts';

/**
 * Hydrogen-burning rate constant A: the hydrogen-exhausted core grows as dMc/dt = A L.
 * A = 1.44×10⁻⁵ Msun Lsun⁻¹ Myr⁻¹ (the value DESIGN quotes for Hurley, Pols & Tout 2000,
 * MNRAS 315, 543, §5.2, eq. (39) there, from memory); it is 1/(X Q) for envelope hydrogen
 * X ≈ 0.7 and the CN-cycle energy release Q ≈ 6.0×10^18 erg per gram of hydrogen burnt.
 * HPT2000 also give a mass-dependent fit of A for the giant branch; Tidefield keeps the single
 * physical constant on both branches so that the core growth is the energy budget of the shell.
 */
const HYDROGEN_RATE_MSUN_PER_LSUN_YR = 1.44e-5 / 1e6;

/**
 * Growth rate of the hydrogen-exhausted core of a shell-burning giant, Msun/yr: dMc/dt = A L
 * with A = 1.44×10⁻⁵ Msun Lsun⁻¹ Myr⁻¹ (Hurley, Pols & Tout 2000, MNRAS 315, 543, §5.2).
 * Units: luminosity in Lsun, valid 0 ≤ L ≤ 10^6 Lsun.
 * Example: L = 2500 Lsun → 3.6×10⁻⁸ Msun/yr.
 */
export function coreGrowthRateMsunPerYr(luminosityLsun: number): number {
  requireInRange('luminosityLsun', luminosityLsun, 0, 1e6, 'Lsun');
  return HYDROGEN_RATE_MSUN_PER_LSUN_YR * luminosityLsun;
}
