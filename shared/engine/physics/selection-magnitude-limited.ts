import { mestelLuminosityRatio } from './cooling-mestel1952.ts';

/**
 * Acceptance probability of a white dwarf in a magnitude-limited sample: the volume within
 * which a source of luminosity L is brighter than a flux limit grows as d_max³ ∝ L^(3/2)
 * (the 1/V_max weighting of Schmidt 1968, ApJ 151, 393, inverted), so a white dwarf is kept
 * with probability (L/L_ref)^(3/2), L from Mestel cooling. The reference (heaviest white dwarf,
 * youngest floored cooling age) makes the probability at most 1. Cooling ages below the floor
 * are raised to it. Assumes a homogeneous, dust-free volume (no disc scale height) and
 * bolometric fluxes. Units: Msun, Gyr.
 * Example: mass 0.6 with reference 1.2, cooling age 1 Gyr with reference 0.1 Gyr:
 * L/L_ref = 0.5 · 10^-1.4 = 0.0199, probability 0.0199^1.5 ≈ 2.8e-3.
 */
export function magnitudeLimitedAcceptance(
  massMsun: number,
  coolingAgeGyr: number,
  floorGyr: number,
  referenceMassMsun: number,
  referenceCoolingAgeGyr: number,
): number {
  const age = coolingAgeGyr > floorGyr ? coolingAgeGyr : floorGyr;
  const ratio = mestelLuminosityRatio(massMsun, age, referenceMassMsun, referenceCoolingAgeGyr);
  return ratio * Math.sqrt(ratio);
}
