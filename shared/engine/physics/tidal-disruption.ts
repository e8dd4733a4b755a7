/**
 * Tidal disruption radius of a companion of mass M2 and radius R2 by an enclosed mass M:
 * r_t = η R2 (M/M2)^(1/3) (Rees 1988, Nature 333, 523, with η of order unity; η = 2.44 is
 * the fluid Roche limit, Chandrasekhar 1969 / Roche 1849; Ryu et al. 2020, ApJ 904, 98 find
 * η ≈ 1 for main-sequence stars). Units: R in Rsun, masses in Msun.
 * Example: η = 2.44, R2 = 0.1028 Rsun (1 RJup), M = 0.6, M2 = 1 MJup gives ≈ 2.1 Rsun.
 */
export function tidalRadiusRsun(eta: number, companionRadiusRsun: number, enclosedMassMsun: number, companionMassMsun: number): number {
  return eta * companionRadiusRsun * Math.cbrt(enclosedMassMsun / companionMassMsun);
}
