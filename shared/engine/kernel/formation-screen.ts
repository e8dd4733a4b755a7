import { sampleImfLog10Msun, type ImfSampler } from '../physics/imf-sampler.ts';
import { lifetimeAtLog10MassGyr, type PreparedLifetime } from './scenario-physics.ts';

/** Cells of the screen over the primary-mass uniform (a power of two: u · CELLS and k / CELLS are exact). */
const CELLS = 4096;
/** Relative margin below each cell's least lifetime: far above the ~1e-15 rounding of M(u) and t_MS(M). */
const MARGIN = 1e-9;

/**
 * A lower bound of the main-sequence lifetime over each cell of the primary-mass uniform, so that
 * the kernel can reject a primary that is not yet a white dwarf (t_MS(M(u)) ≥ age) without
 * computing its mass or lifetime: the squeeze principle of rejection sampling (Marsaglia 1977,
 * Computers & Mathematics with Applications 3, 321: a cheap bound decides most cases, the exact
 * function only the rest). It changes no outcome: a primary is skipped only when age ≤ the bound
 * of its cell ≤ its exact t_MS, and every other primary takes the exact test as before.
 *
 * t_MS(M(u)) falls with u (the IMF quantile rises with u; both lifetime relations fall with mass,
 * which the scenario contract enforces for tables and its exponent range ≥ 0.5 for the scaling),
 * so its least value over cell k = [k/n, (k+1)/n) is at the right end; the bound is that value
 * lowered by a relative 1e-9, which covers the rounding of the mass and lifetime evaluations.
 * Units: Gyr. Example: Kroupa (2001) on [0.8, 8] Msun with t_MS = 10 Gyr (M/Msun)^-2.5 and a
 * 10 Gyr burst: primaries with u below ≈ 0.265 (M < 1 Msun) are rejected without any pow.
 */
export interface FormationScreen {
  /** Cells per unit of the uniform. */
  cells: number;
  /** lifetimeFloorGyr[k] ≤ t_MS(M(u)) for every u in [k/cells, (k+1)/cells). */
  lifetimeFloorGyr: Float64Array;
}

export function buildFormationScreen(imf: ImfSampler, lifetime: PreparedLifetime): FormationScreen {
  const atNode = new Float64Array(CELLS + 1);
  for (let k = 0; k <= CELLS; k++) atNode[k] = lifetimeAtLog10MassGyr(lifetime, sampleImfLog10Msun(imf, k / CELLS)); // as the kernel computes it
  const lifetimeFloorGyr = new Float64Array(CELLS);
  for (let k = 0; k < CELLS; k++) lifetimeFloorGyr[k] = Math.min(atNode[k], atNode[k + 1]) * (1 - MARGIN);
  return { cells: CELLS, lifetimeFloorGyr };
}

/** True when the bound alone shows t_MS(M(u)) ≥ ageGyr: the primary is not a white dwarf yet. */
export function surelyNotWhiteDwarf(screen: FormationScreen, u: number, ageGyr: number): boolean {
  return ageGyr <= screen.lifetimeFloorGyr[(u * screen.cells) | 0];
}
