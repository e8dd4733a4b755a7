import { requireInRange } from '../errors.ts';

/**
 * Main-sequence lifetime from a user table of (mass, lifetime) points, interpolated linearly
 * in log M – log t (lifetimes are close to power laws in mass, so this is the natural
 * interpolant); beyond the table the end segments are extended in the same log-log form.
 * Units: Msun and Gyr; the masses must ascend and the lifetimes fall.
 * Example: points (1, 10) and (2, 1.77) give t(1.5) = 10 · 1.5^(log(0.177)/log 2) ≈ 3.59 Gyr.
 */
export function tabulatedLifetimeGyr(massMsun: number, log10Mass: ArrayLike<number>, log10Gyr: ArrayLike<number>): number {
  requireInRange('massMsun', massMsun, 1e-3, 1e3, 'Msun');
  return tabulatedLifetimeAtLog10MassGyr(Math.log10(massMsun), log10Mass, log10Gyr);
}

/**
 * The same interpolation with the mass given as log10(M/Msun) (the kernel's form: no logarithm
 * of the drawn mass). Example: as above with x = log10 1.5 gives ≈ 3.59 Gyr.
 */
export function tabulatedLifetimeAtLog10MassGyr(x: number, log10Mass: ArrayLike<number>, log10Gyr: ArrayLike<number>): number {
  const n = log10Mass.length;
  let i = 0;
  while (i < n - 2 && x > log10Mass[i + 1]) i++;
  const t = (x - log10Mass[i]) / (log10Mass[i + 1] - log10Mass[i]);
  return Math.exp((log10Gyr[i] + t * (log10Gyr[i + 1] - log10Gyr[i])) * Math.LN10); // 10^x without Math.pow's cost
}
