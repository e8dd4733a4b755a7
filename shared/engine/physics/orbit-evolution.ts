import { byOption } from '../../contracts/method-option.ts';
import type { GiantTrackOptions } from '../../contracts/scenario.ts';
import { EngineError, requireInRange } from '../errors.ts';
import { tideDecayRateUnchecked } from './equilibrium-tide.ts';
import type { GiantTrack } from './giant-track.ts';
import { periodDays } from './kepler.ts';
import { rocheLobeFraction } from './roche-lobe-eggleton1983.ts';

/** Outcome of one orbit followed along a giant track. */
export interface OrbitOutcome {
  /** True if the giant filled its Roche lobe towards the companion at some time on the track (the onset of the common envelope). */
  engulfed: boolean;
  /** Track time of the onset, or of the track's end if the companion survives, yr. */
  timeYr: number;
  /** Separation at that time, AU. */
  separationAU: number;
  /** The giant's core mass, total mass (Msun) and radius (AU) at that time. */
  coreMassMsun: number;
  starMassMsun: number;
  radiusAU: number;
}

/** Orbital period at 1 AU around 1 Msun in Julian years (kepler.ts, Gaussian constant). */
const UNIT_PERIOD_YR = periodDays(1, 1) / 365.25;
/**
 * Largest change of ln a in one RK4 substep: 0.02, so the (R/a)^8 factor changes by ≤ 16%.
 * Tightening it 8-fold (and NEGLIGIBLE_DLN_A to 10⁻¹⁰) moved a_crit by < 10⁻⁶ (measured on the
 * 1, 2 and 5 Msun tracks), far below the bisection tolerance.
 */
const MAX_DLN_A_PER_STEP = 0.16 / 8;
/** A track interval whose tidal change of ln a is below this is done with one trapezoid step. */
const NEGLIGIBLE_DLN_A = 1e-6;
/** Below this ln a step, a trial point inside the star counts as engulfment. */
const MIN_DLN_A_RETRY = 1e-7;
/** Guard against a runaway step count (it would mean the step control failed). */
const MAX_SUBSTEPS = 2_000_000;

/** Whether the chosen tide drags the orbit in (one entry per option of TIDE_CHOICE). */
export const tideActs = byOption<GiantTrackOptions['tide'], 'kind', boolean>('kind', { zahn1977: () => true, none: () => false });

/**
 * Follows a companion's circular orbit along a giant track: isotropic wind mass loss conserves
 * a · M_total (Jeans 1924; orbit-mass-loss.ts) and the equilibrium tide of Zahn 1977 shrinks it
 * (equilibrium-tide.ts, the Villaver & Livio 2009 / Mustill & Villaver 2012 form):
 *   d ln(a M_total)/dt = −(f/τ)(M_env/M) q(1+q)(R/a)^8.
 * The variable u = ln(a M_total) is integrated, so with the tide off a · M_total is conserved
 * exactly. Stellar quantities are interpolated linearly in time between track nodes; RK4
 * substeps keep |Δ ln a| ≤ 0.02 per substep; intervals where the tide changes ln a by < 10⁻⁶
 * take one trapezoid step. Onset of the common envelope: the giant fills its Roche lobe towards
 * the companion, R ≥ r_L(M_star/M2) · a (Eggleton 1983, roche-lobe-eggleton1983.ts), at a node or
 * substep; r_L is evaluated at the nodes and interpolated linearly in time. The outcome carries
 * the giant's state there (core mass, total mass, radius) for the common-envelope budget.
 * The star's spin, the companion's own tide and wind accretion are neglected.
 *
 * Units: companion mass in Msun (10⁻⁶–10), initial separation in AU (10⁻⁴–10^5).
 * Example: a 1 MJup planet at 5 AU around a 1 Msun star (default options, track ending at
 * Mc = 0.569 with M ≈ 0.603) survives, its orbit widened to ≈ 5 × 1.001/0.604 ≈ 8.3 AU.
 */
export function evolveOrbitAlongTrack(
  track: GiantTrack,
  companionMassMsun: number,
  initialSeparationAU: number,
  tide: GiantTrackOptions['tide'],
): OrbitOutcome {
  const tidal = tideActs(tide);
  requireInRange('companionMassMsun', companionMassMsun, 1e-6, 10, 'Msun');
  requireInRange('initialSeparationAU', initialSeparationAU, 1e-4, 1e5, 'AU');
  if (tide.kind !== 'zahn1977' && tide.kind !== 'none') {
    throw new EngineError('tide.kind', (tide as { kind: unknown }).kind, '"zahn1977" | "none"');
  }
  const { timeYr, massMsun, coreMassMsun, radiusAU, eddyTimeYr } = track;
  const n = timeYr.length;
  const m2 = companionMassMsun;
  let u = Math.log(initialSeparationAU * (massMsun[0] + m2));
  // Roche-lobe fraction of the giant at the ends of the current interval.
  let roche0 = rocheLobeFraction(massMsun[0] / m2);
  let roche1 = roche0;

  // Tidal decay rate −du/dt at fraction s of interval k, star interpolated linearly in time;
  // Infinity once the giant fills its Roche lobe.
  const rate = (k: number, s: number, uNow: number) => {
    const mass = massMsun[k] + s * (massMsun[k + 1] - massMsun[k]);
    const envelope = mass - (coreMassMsun[k] + s * (coreMassMsun[k + 1] - coreMassMsun[k]));
    const radius = radiusAU[k] + s * (radiusAU[k + 1] - radiusAU[k]);
    const eddy = eddyTimeYr[k] + s * (eddyTimeYr[k + 1] - eddyTimeYr[k]);
    const total = mass + m2;
    const a = Math.exp(uNow) / total;
    if (a * (roche0 + s * (roche1 - roche0)) <= radius) return Infinity;
    // Kepler's third law as P = P(1 AU, 1 Msun) · a^(3/2) / √M without a pow() in the loop.
    const periodYr = UNIT_PERIOD_YR * a * Math.sqrt(a / total);
    return tideDecayRateUnchecked(eddy, envelope, mass, m2, radius, a, periodYr);
  };
  const outcome = (engulfed: boolean, k: number, s: number, uNow: number): OrbitOutcome => {
    const k1 = k < n - 1 ? k + 1 : k;
    const at = (x: number[]) => x[k] + s * (x[k1] - x[k]);
    const mass = at(massMsun);
    return {
      engulfed,
      timeYr: at(timeYr),
      separationAU: Math.exp(uNow) / (mass + m2),
      coreMassMsun: at(coreMassMsun),
      starMassMsun: mass,
      radiusAU: at(radiusAU),
    };
  };

  let substeps = 0;
  // Rate at the start of the current interval when the previous one was a trapezoid step: u
  // moved by < 10⁻⁶ there, so the previous end rate serves (relative error < 10⁻⁵ of a
  // negligible term) and each quiet interval costs one tide evaluation instead of two.
  let carried = -1;
  for (let k = 0; k < n - 1; k++) {
    roche0 = k === 0 ? roche0 : roche1;
    roche1 = rocheLobeFraction(massMsun[k + 1] / m2);
    if ((Math.exp(u) / (massMsun[k] + m2)) * roche0 <= radiusAU[k]) return outcome(true, k, 0, u);
    const dt = timeYr[k + 1] - timeYr[k];
    if (!tidal || dt <= 0) {
      carried = -1;
      continue;
    }
    const r0 = carried >= 0 ? carried : rate(k, 0, u);
    const r1 = rate(k, 1, u);
    carried = -1;
    if (r0 * dt < NEGLIGIBLE_DLN_A && r1 * dt < NEGLIGIBLE_DLN_A) {
      u -= 0.5 * (r0 + r1) * dt;
      carried = r1;
      continue;
    }
    let s = 0;
    while (s < 1) {
      const k1 = rate(k, s, u);
      if (k1 === Infinity) return outcome(true, k, s, u);
      let hs = Math.min(1 - s, MAX_DLN_A_PER_STEP / (k1 * dt));
      let k2 = 0;
      let k3 = 0;
      let k4 = 0;
      for (;;) {
        k2 = rate(k, s + hs / 2, u - (hs / 2) * dt * k1);
        k3 = rate(k, s + hs / 2, u - (hs / 2) * dt * k2);
        k4 = rate(k, s + hs, u - hs * dt * k3);
        if (k2 !== Infinity && k3 !== Infinity && k4 !== Infinity) break;
        // A trial point reached the Roche lobe: retry with a shorter step until the step is
        // too small to matter, then count the orbit as at the onset.
        if (hs * dt * k1 < MIN_DLN_A_RETRY) return outcome(true, k, s, u);
        hs /= 4;
      }
      u -= ((hs * dt) / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
      s = hs === 1 - s ? 1 : s + hs;
      if (++substeps > MAX_SUBSTEPS) {
        throw new EngineError('orbit substeps', substeps, `[0, ${MAX_SUBSTEPS}] (step control failed)`);
      }
    }
  }
  const last = n - 1;
  const engulfed = (Math.exp(u) / (massMsun[last] + m2)) * rocheLobeFraction(massMsun[last] / m2) <= radiusAU[last];
  return outcome(engulfed, last, 0, u);
}
