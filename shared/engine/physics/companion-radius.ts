import { RJUP_RSUN } from '../constants.ts';
import { mainSequenceRadiusRsun } from './main-sequence-radius-demircan1991.ts';

/** Hydrogen-burning limit (Msun) that separates the two radius relations below. */
export const HYDROGEN_BURNING_LIMIT_MSUN = 0.08;

/**
 * Radius of a companion (Rsun) from its mass alone. Below the hydrogen-burning limit
 * (0.08 Msun; planets and brown dwarfs) the radius is one Jupiter radius: evolved, Gyr-old
 * objects from ~0.3 MJup to ~80 MJup all have R ≈ 0.8–1.2 RJup because electron degeneracy
 * balances Coulomb pressure (Chabrier & Baraffe 2000, ARA&A 38, 337, Fig. 6; Burrows et al.
 * 2001, Rev. Mod. Phys. 73, 719). Above it, the main-sequence power law of Demircan &
 * Kahraman (1991), which gives 0.097 Rsun ≈ 0.95 RJup at the limit, so the two meet.
 * The row's class is not used: a heavy "planet" row gets a star's radius.
 * Example: 1 MJup gives 0.1028 Rsun; 0.3 Msun gives 0.34 Rsun.
 */
export function companionRadiusRsun(massMsun: number): number {
  return massMsun < HYDROGEN_BURNING_LIMIT_MSUN ? RJUP_RSUN : mainSequenceRadiusRsun(massMsun);
}
