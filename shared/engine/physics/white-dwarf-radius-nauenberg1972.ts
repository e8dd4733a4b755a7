import { requireInRange } from '../errors.ts';

/** Chandrasekhar mass adopted with Nauenberg's fit (the customary 1.44 Msun; 5.816/μe² = 1.454 for μe = 2). */
export const NAUENBERG_CHANDRASEKHAR_MSUN = 1.44;

/**
 * Zero-temperature white-dwarf radius (Nauenberg 1972, ApJ 175, 417; the fit as usually quoted, equation number not checked):
 * R = 0.0112 Rsun [(M/M_Ch)^(-2/3) − (M/M_Ch)^(2/3)]^(1/2), with M_Ch = 1.44 Msun.
 * Units: Msun in, Rsun out. Valid for 0 < M < M_Ch (cold carbon–oxygen or helium interiors).
 * Example: M = 0.6 Msun gives 0.01244 Rsun (≈ 8660 km).
 */
export function whiteDwarfRadiusRsun(massMsun: number): number {
  requireInRange('massMsun', massMsun, 1e-3, NAUENBERG_CHANDRASEKHAR_MSUN * (1 - 1e-9), 'Msun');
  const x = Math.cbrt(massMsun / NAUENBERG_CHANDRASEKHAR_MSUN);
  const x2 = x * x;
  return 0.0112 * Math.sqrt(1 / x2 - x2);
}
