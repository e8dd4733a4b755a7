import type { HistoryOptions } from '../../contracts/scenario.ts';

/**
 * Present-day age of a star (Gyr) under the scenario's star-formation history:
 * `burst` — every star formed at once, age = ageGyr; `constant` — a constant star-formation
 * rate over [0, ageGyr], so birth times and hence ages are uniform on [0, ageGyr] (the
 * textbook constant-SFR disc, e.g. Binney & Merrifield 1998, Galactic Astronomy). Needs one uniform for
 * `constant` (drawn by the caller so the draw count is visible) and none for `burst`.
 * Example: constant over 10 Gyr with u = 0.25 gives 2.5 Gyr.
 */
export function stellarAgeGyr(history: HistoryOptions, u: number): number {
  return history.kind === 'burst' ? history.ageGyr : u * history.ageGyr;
}
