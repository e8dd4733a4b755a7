import { GAUSS_K } from '../constants.ts';

const TWO_PI = 2 * Math.PI;

/**
 * Semi-major axis from Kepler's third law in astronomical units:
 * a^3 = M (k P / 2π)^2, with k the Gaussian gravitational constant (IAU 1976),
 * a in AU, P in days, M the total mass in Msun.
 * Example: P = 365.25636 d, M = 1 + 3.0e-6 Msun (Sun + Earth) gives a ≈ 1.0000 AU.
 */
export function semiMajorAxisAU(periodDays: number, totalMassMsun: number): number {
  return Math.cbrt(semiMajorAxisCubedAU3(periodDays, totalMassMsun));
}

/** a^3 in AU^3 (the same law before the cube root), for comparing an orbit with a radius without taking the root. */
export function semiMajorAxisCubedAU3(periodDays: number, totalMassMsun: number): number {
  const x = (GAUSS_K * periodDays) / TWO_PI;
  return totalMassMsun * x * x;
}

/** Inverse of semiMajorAxisAU: the orbital period in days for a in AU and M in Msun. */
export function periodDays(semiMajorAxisAu: number, totalMassMsun: number): number {
  return (TWO_PI / GAUSS_K) * Math.sqrt((semiMajorAxisAu * semiMajorAxisAu * semiMajorAxisAu) / totalMassMsun);
}
