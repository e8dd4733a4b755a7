/**
 * Orbital widening under slow, isotropic mass loss from the binary (the "Jeans mode"):
 * the specific orbital angular momentum is conserved, so a · M_total stays constant
 * (Jeans 1924, MNRAS 85, 2; e.g. Hadjidemetriou 1963, Icarus 2, 440, eq. for the adiabatic
 * regime). Valid when the mass-loss time-scale is much longer than the orbital period, which
 * holds for giant winds and any companion with P ≲ 10^4 yr.
 * Example: a = 2 AU around a 2 Msun star that ends as a 0.6 Msun white dwarf, with a
 * 1 MJup planet, widens to 2 · (2.000955 / 0.600955) ≈ 6.66 AU.
 */
export function widenedSeparationAU(initialAU: number, initialTotalMsun: number, finalTotalMsun: number): number {
  return (initialAU * initialTotalMsun) / finalTotalMsun;
}
