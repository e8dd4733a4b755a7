/**
 * Luminosity of a cooling white dwarf relative to a reference, from Mestel's (1952, MNRAS
 * 112, 583) cooling law L ∝ M t_cool^(-7/5) (ideal-gas ions, radiative envelope; e.g. Shapiro &
 * Teukolsky 1983, ch. 4). Only ratios are used, so the composition-dependent constant cancels.
 * Units: Msun, Gyr. Valid for cooling ages beyond ~0.1 Gyr (before that neutrino losses
 * dominate and the law overestimates the age at given luminosity).
 * Example: twice the mass at 10× the cooling age gives L/L_ref = 2 · 10^-1.4 ≈ 0.080.
 */
export function mestelLuminosityRatio(massMsun: number, coolingAgeGyr: number, referenceMassMsun: number, referenceCoolingAgeGyr: number): number {
  return (massMsun / referenceMassMsun) * Math.pow(coolingAgeGyr / referenceCoolingAgeGyr, -1.4);
}
