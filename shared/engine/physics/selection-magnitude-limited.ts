import { whiteDwarfRadiusRsun } from './white-dwarf-radius-nauenberg1972.ts';

/** Nominal solar effective temperature, K (IAU 2015 Resolution B3). */
const TEFF_SUN_K = 5772;
/** Second radiation constant hc/k, nm K (CODATA 2018: 1.438777×10⁻² m K). */
const C2_NM_K = 1.438777e7;
/**
 * Mestel's cooling-time constant, yr: t_cool = C (M/Msun)^(5/7) (L/Lsun)^(−5/7) with
 * C = 6.3×10⁶ yr for a carbon core (A = 12) and μ = 2 (Mestel 1952, MNRAS 112, 583, in the form of
 * Shapiro & Teukolsky 1983, §4.2; the constant from memory). Only the temperature scale of the
 * Planck factor depends on it.
 */
const MESTEL_CONSTANT_YR = 6.3e6;

/**
 * Luminosity of a cooling white dwarf, Lsun, from Mestel's law inverted:
 * L = (M/Msun) (t_cool / C)^(−7/5). Units: Msun, Gyr (> 0).
 * Example: 0.6 Msun at 1 Gyr → 0.6 × (1e9/6.3e6)^−1.4 ≈ 5.1×10⁻⁴ Lsun.
 */
export function mestelLuminosityLsun(massMsun: number, coolingAgeGyr: number): number {
  return massMsun * Math.pow((coolingAgeGyr * 1e9) / MESTEL_CONSTANT_YR, -1.4);
}

/**
 * Optical flux of a white dwarf at a fixed distance, up to a constant: a blackbody at wavelength
 * λ, F_λ ∝ R² / (exp(hc/λkT) − 1), with R from Nauenberg 1972 and the effective temperature from
 * L = 4πR²σT⁴ (T = 5772 K (L/Lsun)^(1/4) (R/Rsun)^(−1/2)) and Mestel's luminosity.
 * Units: Msun, Gyr, nm; the result is in arbitrary units (only ratios are used).
 * Example: at 550 nm and 0.2 Gyr, a 1.0 Msun white dwarf (R ≈ 0.0079 Rsun) gives ≈ 0.82 of the
 * flux of a 0.6 Msun one (R ≈ 0.0124 Rsun): it is hotter but smaller. At 1 Gyr the ratio is ≈ 1.17
 * (under Mestel cooling the temperature wins on the Wien side of the band).
 */
export function opticalFlux(massMsun: number, coolingAgeGyr: number, wavelengthNm: number): number {
  const radius = whiteDwarfRadiusRsun(massMsun);
  const temperature = TEFF_SUN_K * Math.sqrt(Math.sqrt(mestelLuminosityLsun(massMsun, coolingAgeGyr))) / Math.sqrt(radius);
  // expm1: the Rayleigh–Jeans end (hc/λkT ≪ 1) keeps its precision.
  return (radius * radius) / Math.expm1(C2_NM_K / (wavelengthNm * temperature));
}

/**
 * Acceptance probability of a white dwarf in a magnitude-limited sample: the volume in which a
 * source of flux F (at unit distance) is above the limit grows as d_max³ ∝ F^(3/2) (the V_max of
 * Schmidt 1968, ApJ 151, 393, inverted), so a white dwarf is kept with probability
 * (F/F_ref)^(3/2), F = opticalFlux at the cooling age raised to at least the floor. F_ref is the
 * largest flux any white dwarf of the run can have (prepare.ts), so the probability is at most 1.
 * Massive white dwarfs are smaller and so fainter in the optical: a magnitude-limited sample
 * under-represents them. Assumes a homogeneous, dust-free volume. Units: Msun, Gyr, nm.
 * Example: 0.6 Msun at 1 Gyr with F_ref its own flux at 0.1 Gyr: (F(1)/F(0.1))^(3/2) < 1.
 */
export function magnitudeLimitedAcceptance(massMsun: number, coolingAgeGyr: number, floorGyr: number, wavelengthNm: number, referenceFlux: number): number {
  const age = coolingAgeGyr > floorGyr ? coolingAgeGyr : floorGyr;
  const ratio = opticalFlux(massMsun, age, wavelengthNm) / referenceFlux;
  return ratio * Math.sqrt(ratio);
}
