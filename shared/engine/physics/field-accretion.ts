import { G_CGS, MSUN_G, RSUN_CM, YEAR_S } from '../constants.ts';

/**
 * Field of a white dwarf that accretes a disrupted companion's debris, taken as the field
 * whose magnetospheric (Alfvén) radius sits at the stellar surface:
 *   r_A = (μ⁴ / (2 G M Ṁ²))^(1/7), μ = B R³ (Frank, King & Raine 2002, Accretion Power in
 *   Astrophysics, 3rd ed., ch. 6 (numbers from memory): r_M = 5.1e8 Ṁ16^(-2/7) m1^(-1/7) μ30^(4/7) cm),
 * so that r_A = R gives B = (2 G M)^(1/4) Ṁ^(1/2) R^(-5/4).
 * Ṁ is the disc mass over its viscous time at the disc radius r_d: t_visc = r_d²/ν with the
 * Shakura & Sunyaev (1973, A&A 24, 337) viscosity ν = α c_s H = α (H/R)² r_d² Ω_K, hence
 * t_visc = 1 / (α (H/R)² Ω_K(r_d)), Ω_K = (G M / r_d³)^(1/2) (Frank, King & Raine ch. 5).
 * Units: masses in Msun, radii in Rsun, result in MG. Valid while r_d > R.
 * Worked example: M = 0.6 Msun, R = 0.01244 Rsun, disc of 1 MJup at r_d = 2.15 Rsun, α = 0.1,
 * H/R = 0.1: Ω_K = 1.54e-4 s⁻¹, t_visc = 6.5e6 s (0.21 yr), Ṁ = 2.9e23 g/s (4.6e-3 Msun/yr),
 * B ≈ 13 MG.
 */
export function accretionFieldMG(
  whiteDwarfMassMsun: number,
  whiteDwarfRadiusRsun: number,
  discMassMsun: number,
  discRadiusRsun: number,
  alpha: number,
  aspectRatio: number,
): number {
  const m = whiteDwarfMassMsun * MSUN_G;
  const rd = Math.max(discRadiusRsun, whiteDwarfRadiusRsun) * RSUN_CM;
  const omega = Math.sqrt((G_CGS * m) / (rd * rd * rd));
  const viscousTimeS = 1 / (alpha * aspectRatio * aspectRatio * omega);
  const mdot = (discMassMsun * MSUN_G) / viscousTimeS;
  const r = whiteDwarfRadiusRsun * RSUN_CM;
  return (Math.pow(2 * G_CGS * m, 0.25) * Math.sqrt(mdot) * Math.pow(r, -1.25)) / 1e6;
}

/** The accretion rate (Msun/yr) behind accretionFieldMG, for reports and tests. */
export function debrisAccretionRateMsunPerYr(whiteDwarfMassMsun: number, discMassMsun: number, discRadiusRsun: number, alpha: number, aspectRatio: number): number {
  const rd = discRadiusRsun * RSUN_CM;
  const omega = Math.sqrt((G_CGS * whiteDwarfMassMsun * MSUN_G) / (rd * rd * rd));
  return discMassMsun * alpha * aspectRatio * aspectRatio * omega * YEAR_S;
}
