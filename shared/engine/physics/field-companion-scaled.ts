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

/**
 * The same law in log10 form, split so that the kernel adds instead of calling a power: the
 * zero point log10 B_median at M2 = 1 Msun, log10 referenceMG − slope · log10(referenceMassMJup in
 * Msun); then log10 B_median = zeroPoint + slope · log10(M2 / Msun).
 * Example: 100 MG at 100 MJup (0.0955 Msun), slope 0.6 → zero point 2 − 0.6 · log10(0.0955) ≈ 2.612;
 * at M2 = 1 MJup (log10 M2 ≈ −3.020) 2.612 − 0.6 · 3.020 = 0.800, i.e. 10^0.8 ≈ 6.31 MG as above.
 */
export function companionScaledLog10ZeroPoint(referenceMG: number, referenceMassMJup: number, slope: number): number {
  return Math.log10(referenceMG) - slope * Math.log10(referenceMassMJup * MJUP_MSUN);
}
