import { requireInRange } from '../errors.ts';

/**
 * Main-sequence mass–radius relation of Demircan & Kahraman (1991, Ap&SS 181, 313), a power-law
 * fit to detached eclipsing binaries: R = 1.06 M^0.945 Rsun for M < 1.66 Msun and
 * R = 1.33 M^0.555 Rsun above. Units: Msun in, Rsun out; valid about 0.1–20 Msun.
 * Example: M = 0.3 Msun gives 0.34 Rsun; M = 2 gives 1.95 Rsun.
 */
export function mainSequenceRadiusRsun(massMsun: number): number {
  requireInRange('massMsun', massMsun, 1e-3, 150, 'Msun');
  return massMsun < 1.66 ? 1.06 * Math.pow(massMsun, 0.945) : 1.33 * Math.pow(massMsun, 0.555);
}
