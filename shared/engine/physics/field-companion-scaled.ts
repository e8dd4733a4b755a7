import { MJUP_MSUN } from '../constants.ts';

/**
 * Median field of a white dwarf whose debris disc comes from a shredded companion of mass M2,
 * growing with the shredded mass as in the disc-dynamo estimates of Nordhaus et al. 2011
 * (PNAS 108, 3135, arXiv 1010.1529; more massive companions give stronger fields, a few MG to
 * about 1000 MG from planets to low-mass stars, read from memory as a trend, not a formula):
 *   B_median = referenceMG · (M2 / referenceMassMJup)^slope
 * A power law in M2 is Tidefield's parametrisation of that trend; its numbers are the user's
 * (the defaults 100 MG, 100 MJup, 0.6 are illustrative). The log-normal scatter is applied by
 * the caller (field-lognormal.ts).
 * Units: companion mass in Msun, reference mass in MJup, result in MG.
 * Example: M2 = 1 MJup, 100 MG at 100 MJup, slope 0.6 → 100 × 0.01^0.6 ≈ 6.31 MG.
 */
export function companionScaledMedianMG(companionMassMsun: number, referenceMG: number, referenceMassMJup: number, slope: number): number {
  return referenceMG * Math.pow(companionMassMsun / (referenceMassMJup * MJUP_MSUN), slope);
}
