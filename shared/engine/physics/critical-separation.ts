import type { GiantTrackOptions } from '../../contracts/scenario.ts';
import { EngineError, requireInRange } from '../errors.ts';
import type { GiantTrack } from './giant-track.ts';
import { evolveOrbitAlongTrack, tideActs } from './orbit-evolution.ts';
import { rocheLobeFraction } from './roche-lobe-eggleton1983.ts';

/** Bisection stops when the bracket [lo, hi] satisfies ln(hi/lo) below this (0.05 per cent). */
const LOG_TOLERANCE = 5e-4;
/** Factor by which the upper end of the bracket is pushed out while it is still engulfed. */
const BRACKET_GROWTH = 1.25;
/** Growth factor of the bracket when it starts from a confirmed hint. */
const HINTED_GROWTH = 1.1;
/** Widest a_crit sought: this many times the no-tide boundary. */
const MAX_TIDAL_REACH = 1e3;

/**
 * Critical initial separation a_crit for the onset of a common envelope, AU: every orbit
 * starting inside a_crit meets a giant that fills its Roche lobe towards the companion at some
 * time on the track (orbit-evolution.ts), every one outside survives.
 *
 * Method: bisection in ln a0. Monotonicity assumption: if a0 is engulfed, every a0' < a0 is too.
 * It holds for the exact ODE: d ln a/dt = F(t, ln a) is a scalar ODE with a Lipschitz right
 * side, so two solutions can never cross; the orbit from a0' stays inside the one from a0, which
 * reaches R_star. (Checked numerically in critical-separation.test.ts.) The bracket starts at the
 * no-tide boundary a_wind = max_t [R(t)/r_L(t)] M_total(t) / M_total(0) — the tide only shrinks orbits, so
 * everything inside it is engulfed — and grows by factors 1.25 until an orbit survives; with the
 * tide off a_crit is a_wind itself.
 *
 * engulfedHintAU, optional, is a separation believed to be engulfed (a_crit of a lighter
 * companion on the same track, by the same comparison argument: a heavier companion widens
 * less and feels a stronger tide, q(1+q)·min[1,(P/2τ)²] growing with M2); it is checked
 * before use.
 *
 * Units: companion mass in Msun (10⁻⁶–10), hint in AU. Result in AU, relative precision 5×10⁻⁴.
 * Example: 1 MJup around the 1 Msun track (IFMR mass 0.569, default options): ≈ 2.51 AU.
 */
export function criticalSeparationOnTrackAU(
  track: GiantTrack,
  companionMassMsun: number,
  tide: GiantTrackOptions['tide'],
  engulfedHintAU = 0,
): number {
  requireInRange('companionMassMsun', companionMassMsun, 1e-6, 10, 'Msun');
  requireInRange('engulfedHintAU', engulfedHintAU, 0, 1e5, 'AU');
  const { radiusAU, massMsun } = track;
  let windBoundary = 0;
  for (let k = 0; k < radiusAU.length; k++) {
    const onsetSeparation = radiusAU[k] / rocheLobeFraction(massMsun[k] / companionMassMsun);
    windBoundary = Math.max(windBoundary, (onsetSeparation * (massMsun[k] + companionMassMsun)) / (massMsun[0] + companionMassMsun));
  }
  if (!tideActs(tide)) return windBoundary;
  const engulfed = (a0: number) => evolveOrbitAlongTrack(track, companionMassMsun, a0, tide).engulfed;

  // A hint (e.g. a_crit of a lighter companion, which is engulfed here too) narrows the bracket
  // only after it is confirmed, so a wrong hint costs one integration and never the answer.
  const hinted = engulfedHintAU > windBoundary && engulfed(engulfedHintAU);
  let lo = hinted ? engulfedHintAU : windBoundary;
  let hi = lo * (hinted ? HINTED_GROWTH : BRACKET_GROWTH);
  while (engulfed(hi)) {
    lo = hi;
    hi *= hinted ? HINTED_GROWTH : BRACKET_GROWTH;
    if (hi > MAX_TIDAL_REACH * windBoundary) {
      throw new EngineError('criticalSeparation', hi, `[0, ${MAX_TIDAL_REACH} × the no-tide boundary ${windBoundary} AU]`);
    }
  }
  while (Math.log(hi / lo) > LOG_TOLERANCE) {
    const mid = Math.sqrt(lo * hi);
    if (engulfed(mid)) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(lo * hi);
}
