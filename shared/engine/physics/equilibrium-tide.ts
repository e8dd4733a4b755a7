import { LSUN_ERG_S, MSUN_G, RSUN_CM, YEAR_S } from '../constants.ts';
import { requireInRange } from '../errors.ts';

/** Msun Rsun² / (3 Lsun) in s³: the eddy turnover time is the cube root of this times Menv R²/L. */
const EDDY_TIME_CUBED_S3 = (MSUN_G * RSUN_CM * RSUN_CM) / (3 * LSUN_ERG_S);

/**
 * Zahn's (1977) normalisation factor f = (9/2) min[1, (P/2τ)²], in the form used for
 * engulfment by Villaver & Livio 2009 (ApJ 705, L81) and Mustill & Villaver 2012 (ApJ 761,
 * 121). The 9/2 is the factor DESIGN prints (and, from memory, not checked against the papers,
 * the one they print). Dropping it makes the tide 4.5 times weaker; because the rate goes as
 * a^−8, that moves a_crit inward by 4.5^(1/8) ≈ 1.21 (measured on the 1, 2 and 5 Msun tracks
 * for 10⁻⁴–0.5 Msun companions: a factor 1.20–1.21). Tidefield adopts 9/2.
 */
const ZAHN_F_SATURATED = 4.5;

/**
 * Convective eddy turnover time of a giant's envelope, yr: τ = [M_env R² / (3 L)]^(1/3).
 * This is the mixing-length estimate of Rasio et al. 1996 (ApJ 470, 1187),
 * τ = [M_env R_env (R − R_env)/(3L)]^(1/3), written by DESIGN with R² for the deep envelope of a
 * giant; the analytic track knows no R_env, the radius of the base of the convective zone.
 * (Assumption, from memory: with R_env taken literally as the ~1 Rsun base of the envelope of a
 * 100 Rsun giant, τ would be ~4.6 times shorter and the saturated tide ~4.6 times stronger.)
 *
 * Units: envelope mass in Msun (> 0, ≤ 10), radius in Rsun (0.1–10^4), L in Lsun (0.1–10^6).
 * Example: M_env = 0.5 Msun, R = 150 Rsun, L = 2500 Lsun → τ ≈ 1.56×10^7 s ≈ 0.49 yr.
 */
export function eddyTurnoverTimeYr(envelopeMassMsun: number, radiusRsun: number, luminosityLsun: number): number {
  requireInRange('envelopeMassMsun', envelopeMassMsun, 0, 10, 'Msun');
  requireInRange('radiusRsun', radiusRsun, 0.1, 1e4, 'Rsun');
  requireInRange('luminosityLsun', luminosityLsun, 0.1, 1e6, 'Lsun');
  return Math.cbrt((EDDY_TIME_CUBED_S3 * envelopeMassMsun * radiusRsun * radiusRsun) / luminosityLsun) / YEAR_S;
}

/**
 * Orbital decay rate under the equilibrium tide raised on a giant with a convective envelope,
 * 1/yr (the positive number −(1/a) da/dt):
 *   −(1/a) da/dt = (f/τ) (M_env/M) q (1 + q) (R/a)^8,   q = M2/M,   f = (9/2) min[1, (P/2τ)²]
 * Source: Zahn 1977 (A&A 57, 383) equilibrium tide for a non-rotating star, in the form used
 * by Villaver & Livio 2009 (ApJ 705, L81) and Mustill & Villaver 2012 (ApJ 761, 121), quoted
 * from DESIGN and memory (equation numbers not checked); τ from eddyTurnoverTimeYr. The min[…]
 * reduces the turbulent viscosity when the tidal period is shorter than the eddy time.
 *
 * Units: τ in yr (10⁻⁹–10⁹), envelope, star (0.05–10) and companion (0–10) masses in Msun,
 * star radius and orbital separation in AU (radius at most the separation), orbital period in
 * yr. Valid for circular orbits outside the star (a ≥ R).
 * Example: τ = 0.5 yr, M_env = 0.5, M = 1, M2 = 0.001 Msun, R/a = 0.5, P = 2 yr →
 * f = 4.5, rate = 9 × 0.5 × 0.001 × 1.001 × 2^−8 ≈ 1.76×10⁻⁵ per yr.
 */
export function equilibriumTideDecayRatePerYr(
  eddyTimeYr: number,
  envelopeMassMsun: number,
  starMassMsun: number,
  companionMassMsun: number,
  starRadiusAU: number,
  separationAU: number,
  orbitalPeriodYr: number,
): number {
  requireInRange('eddyTimeYr', eddyTimeYr, 1e-9, 1e9, 'yr');
  requireInRange('starMassMsun', starMassMsun, 0.05, 10, 'Msun');
  requireInRange('envelopeMassMsun', envelopeMassMsun, 0, starMassMsun, 'Msun (at most the star mass)');
  requireInRange('companionMassMsun', companionMassMsun, 0, 10, 'Msun');
  requireInRange('separationAU', separationAU, 1e-6, 1e7, 'AU');
  requireInRange('starRadiusAU', starRadiusAU, 0, separationAU, 'AU (at most the separation)');
  requireInRange('orbitalPeriodYr', orbitalPeriodYr, 1e-9, 1e12, 'yr');
  return tideDecayRateUnchecked(eddyTimeYr, envelopeMassMsun, starMassMsun, companionMassMsun, starRadiusAU, separationAU, orbitalPeriodYr);
}

/**
 * equilibriumTideDecayRatePerYr without its range checks, for the orbit integrator
 * (orbit-evolution.ts), whose inputs come from a validated track and stay in range by
 * construction; the checks were most of the cost of a rate evaluation there.
 */
export function tideDecayRateUnchecked(
  eddyTimeYr: number,
  envelopeMassMsun: number,
  starMassMsun: number,
  companionMassMsun: number,
  starRadiusAU: number,
  separationAU: number,
  orbitalPeriodYr: number,
): number {
  const q = companionMassMsun / starMassMsun;
  const x = orbitalPeriodYr / (2 * eddyTimeYr);
  const f = ZAHN_F_SATURATED * Math.min(1, x * x);
  const r2 = (starRadiusAU / separationAU) ** 2;
  const r8 = r2 * r2 * r2 * r2;
  return (f / eddyTimeYr) * (envelopeMassMsun / starMassMsun) * q * (1 + q) * r8;
}
