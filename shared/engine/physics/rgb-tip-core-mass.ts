import { requireInRange } from '../errors.ts';

/**
 * Largest initial mass whose helium core ignites degenerately (in a flash at the tip of the red
 * giant branch): Hurley, Pols & Tout 2000 (MNRAS 315, 543), eq. (2),
 * M_HeF = 1.995 + 0.25 ζ + 0.087 ζ², ζ = log10(Z/0.02); Tidefield's track is for Z = 0.02 (ζ = 0).
 * Coefficients from memory of the paper.
 */
export const HELIUM_FLASH_MAX_MASS_MSUN = 1.995;
/** Core mass at which the track's red giant branch starts, Msun (assumption: near the base of the branch, R ≈ 2–3 Rsun at 1 Msun; far too small a radius to matter for engulfment). */
export const RGB_BASE_CORE_MASS_MSUN = 0.15;
/** Core mass at the helium flash of low-mass stars, Msun (see rgbTipCoreMassMsun). */
const HELIUM_FLASH_CORE_MASS_MSUN = 0.47;
/** Initial mass from which the track has no red giant branch at all, Msun (where HPT2000's giant-branch coefficients reach their high-mass values). */
const NO_RGB_MASS_MSUN = 2.5;

/**
 * Core mass at which the red giant branch ends with helium ignition, Msun, or null when the
 * track has no red giant branch.
 *
 * M ≤ M_HeF (degenerate ignition): the flash occurs at ≈ 0.47 Msun almost independently of the
 * initial mass (the value DESIGN quotes; common practice, from memory: detailed solar-metallicity
 * models give 0.45–0.49 Msun). Above M_HeF helium ignites before the core is degenerate, earlier
 * on the branch the more massive the star. Tidefield ramps the tip core mass linearly in M from
 * 0.47 at M_HeF down to the base-of-branch value 0.15 at 2.5 Msun, and gives heavier stars no red
 * giant branch (their radius at ignition, tens of Rsun, is far below their AGB radius, which sets
 * the engulfment boundary). The ramp is an assumption standing in for HPT2000's helium-ignition
 * luminosity fit, whose coefficients are not reproduced here; it keeps the track, and so a_crit,
 * continuous in M, and it passes near the known minimum ignition core mass of ≈ 0.33 Msun at
 * ≈ 2.2 Msun (common practice, from memory).
 *
 * Units: initial mass in Msun; valid 0.5–10 Msun.
 * Example: rgbTipCoreMassMsun(1) = 0.47; rgbTipCoreMassMsun(2.2) ≈ 0.34; rgbTipCoreMassMsun(3) = null.
 */
export function rgbTipCoreMassMsun(initialMassMsun: number): number | null {
  requireInRange('initialMassMsun', initialMassMsun, 0.5, 10, 'Msun');
  if (initialMassMsun <= HELIUM_FLASH_MAX_MASS_MSUN) return HELIUM_FLASH_CORE_MASS_MSUN;
  if (initialMassMsun >= NO_RGB_MASS_MSUN) return null;
  const w = (initialMassMsun - HELIUM_FLASH_MAX_MASS_MSUN) / (NO_RGB_MASS_MSUN - HELIUM_FLASH_MAX_MASS_MSUN);
  return HELIUM_FLASH_CORE_MASS_MSUN + w * (RGB_BASE_CORE_MASS_MSUN - HELIUM_FLASH_CORE_MASS_MSUN);
}
