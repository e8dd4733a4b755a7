import { byOption } from '../../contracts/method-option.ts';
import type { GiantTrackOptions } from '../../contracts/scenario.ts';
import { RSUN_PER_AU } from '../constants.ts';
import { EngineError, requireInRange } from '../errors.ts';
import { agbLuminosityLsun, PACZYNSKI_ZERO_POINT_MSUN } from './agb-luminosity.ts';
import { bloeckerMassLossMsunPerYr } from './bloecker-superwind.ts';
import { coreGrowthRateMsunPerYr } from './core-growth.ts';
import { eddyTurnoverTimeYr } from './equilibrium-tide.ts';
import { giantBranchLuminosityLsun } from './giant-branch-luminosity.ts';
import { giantRadiusRsun } from './giant-radius.ts';
import { reimersMassLossMsunPerYr } from './reimers-mass-loss.ts';
import { RGB_BASE_CORE_MASS_MSUN, rgbTipCoreMassMsun } from './rgb-tip-core-mass.ts';

/**
 * The primary's giant phases sampled at nodes, plain data (structured-clone friendly).
 * Between nodes every quantity is meant to be interpolated linearly in time. Two consecutive
 * nodes may share a time: the skipped horizontal branch is a jump from the tip of the red giant
 * branch to the start of the AGB.
 */
export interface GiantTrack {
  initialMassMsun: number;
  finalCoreMassMsun: number;
  /** Index of the first AGB node; equals the node count when the track has no AGB. */
  agbStartIndex: number;
  /** Why the track stops: the core reached the IFMR mass, or the wind took the envelope first. */
  endReason: 'final-core-mass' | 'envelope-exhausted';
  /**
   * Factor on the AGB wind that times the superwind so that the envelope lasts until the core
   * reaches the IFMR mass: 1 when the scenario's wind already lets it, below 1 otherwise.
   */
  agbWindScale: number;
  /** Time since the start of the red giant branch (or of the AGB when there is none), yr. */
  timeYr: number[];
  coreMassMsun: number[];
  /** Current total mass of the primary, Msun. */
  massMsun: number[];
  luminosityLsun: number[];
  radiusAU: number[];
  /** Convective eddy turnover time of the envelope (equilibrium-tide.ts), yr. */
  eddyTimeYr: number[];
}

/**
 * Core mass at which the AGB starts, above Paczyński's zero point, Msun: the relation gives
 * 59250 × 0.005 ≈ 300 Lsun there, an early-AGB luminosity (assumption; the core growth on the
 * skipped horizontal branch is not followed).
 */
const AGB_START_ABOVE_ZERO_POINT_MSUN = 0.005;
/** The superwind timing is searched until the AGB wind scale is known to this relative precision. */
const WIND_SCALE_TOLERANCE = 1e-3;
/** Envelope mass below which the star leaves the AGB (or RGB) and the track ends, Msun (assumption, common practice: post-AGB departure at 10⁻³–10⁻² Msun). */
const ENVELOPE_EXHAUSTED_MSUN = 1e-3;
/** Step control: at most this relative change in luminosity per step (R ∝ L^0.76 then changes by ≲ 1%). */
const MAX_DLN_L = 0.0125;
/** Step control: at most this fraction of the envelope lost per step. */
const MAX_ENVELOPE_FRACTION = 0.02;
/** Step control: largest core-mass step, Msun. */
const MAX_CORE_STEP_MSUN = 0.002;

interface Phase {
  luminosityLsun: (coreMassMsun: number) => number;
  massLossMsunPerYr: (luminosityLsun: number, radiusRsun: number, massMsun: number) => number;
}

/** Blöcker's efficiency η_B of the chosen superwind; 0 = none (one entry per option of SUPERWIND_CHOICE). */
const superwindEta = byOption<GiantTrackOptions['superwind'], 'kind', number>('kind', { bloecker1995: (wind) => wind.eta, none: () => 0 });

/**
 * The analytic giant track of one primary: red giant branch (Hurley, Pols & Tout 2000
 * core-mass–luminosity relation and giant radius, Reimers 1975 wind) up to the helium flash,
 * then (horizontal branch skipped, as DESIGN allows) the AGB (Paczyński 1970 luminosity,
 * Reimers wind and the Blöcker 1995 superwind, whichever is larger) until the core reaches the
 * IFMR's final mass (if that mass lies between the red-giant tip core and the AGB start at
 * Mc0 + 0.005 Msun the track ends at the tip; if below the tip, on the red giant branch). The
 * superwind is timed so that the core reaches the IFMR mass: if the AGB wind would empty the
 * envelope first, it is scaled down (agbWindScale, by bisection) until it just lets the core get
 * there. The core grows
 * as dMc/dt = A L (core-growth.ts); the total mass as dM/dt = −Ṁ_wind. Core mass is the
 * independent variable (RK4 with steps that keep ΔL/L ≤ 1.25%, the envelope lost per step
 * ≤ 2% and ΔMc ≤ 0.002 Msun); time follows from dt = dMc/(A L). The red giant branch ends at
 * the helium-ignition core mass of rgb-tip-core-mass.ts (none for M ≥ 2.5 Msun; the track then
 * starts on the AGB). The track stops early if the envelope falls below 10⁻³ Msun; whatever
 * envelope is left when the core reaches the final mass is taken to be blown off at once by the
 * superwind (no further nodes).
 *
 * Units: initial mass 0.8–8 Msun; final core mass 0.3–1.44 Msun and below the initial mass.
 * Example: buildGiantTrack(1, 0.569, defaults) reaches L ≈ 2530 Lsun, R ≈ 0.96 AU (207 Rsun) at
 * the RGB tip (Mc = 0.47) after losing ≈ 0.27 Msun, and ends on the AGB at Mc = 0.569 with
 * M ≈ 0.603 Msun (Mc0 = 0.522; the superwind needs no timing there, agbWindScale = 1).
 */
export function buildGiantTrack(initialMassMsun: number, finalCoreMassMsun: number, options: GiantTrackOptions): GiantTrack {
  requireInRange('initialMassMsun', initialMassMsun, 0.8, 8, 'Msun');
  requireInRange('finalCoreMassMsun', finalCoreMassMsun, 0.3, Math.min(1.44, initialMassMsun), 'Msun (and below the initial mass)');
  if (finalCoreMassMsun >= initialMassMsun) {
    throw new EngineError('finalCoreMassMsun', finalCoreMassMsun, `[0.3, ${initialMassMsun}) Msun (below the initial mass)`);
  }
  const eta = requireInRange('reimersEta', options.reimersEta, 0.05, 3);
  const superwind = options.superwind;
  if (superwind.kind !== 'bloecker1995' && superwind.kind !== 'none') {
    throw new EngineError('superwind.kind', (superwind as { kind: unknown }).kind, '"bloecker1995" | "none"');
  }

  const track: GiantTrack = {
    initialMassMsun,
    finalCoreMassMsun,
    agbStartIndex: 0,
    endReason: 'final-core-mass',
    agbWindScale: 1,
    timeYr: [],
    coreMassMsun: [],
    massMsun: [],
    luminosityLsun: [],
    radiusAU: [],
    eddyTimeYr: [],
  };
  const state = { coreMassMsun: 0, massMsun: initialMassMsun, timeYr: 0 };
  const reimers = (l: number, r: number, m: number) => reimersMassLossMsunPerYr(eta, l, r, m);

  const zeroPoint = requireInRange('agbZeroPointMsun', options.agbZeroPointMsun ?? PACZYNSKI_ZERO_POINT_MSUN, 0.45, 0.55, 'Msun');
  const agbStartCore = zeroPoint + AGB_START_ABOVE_ZERO_POINT_MSUN;
  const tip = rgbTipCoreMassMsun(initialMassMsun);
  state.coreMassMsun = RGB_BASE_CORE_MASS_MSUN;
  if (tip !== null) {
    const rgb: Phase = { luminosityLsun: (mc) => giantBranchLuminosityLsun(mc, initialMassMsun), massLossMsunPerYr: reimers };
    const exhausted = followPhase(track, state, rgb, Math.min(tip, finalCoreMassMsun));
    if (exhausted || finalCoreMassMsun <= Math.max(tip, agbStartCore)) {
      track.agbStartIndex = track.timeYr.length;
      if (exhausted) track.endReason = 'envelope-exhausted';
      return track;
    }
  }

  // Horizontal branch skipped: the core jumps to the AGB start at the same time and total mass.
  state.coreMassMsun = Math.max(state.coreMassMsun, agbStartCore);
  if (state.massMsun - state.coreMassMsun <= ENVELOPE_EXHAUSTED_MSUN) {
    track.agbStartIndex = track.timeYr.length;
    track.endReason = 'envelope-exhausted';
    return track;
  }
  track.agbStartIndex = track.timeYr.length;
  const etaB = superwindEta(superwind);
  const agbPhase = (scale: number): Phase => ({
    luminosityLsun: (mc) => agbLuminosityLsun(mc, zeroPoint),
    massLossMsunPerYr: (l, r, m) =>
      scale * (etaB > 0 ? Math.max(reimers(l, r, m), bloeckerMassLossMsunPerYr(etaB, l, r, m, initialMassMsun)) : reimers(l, r, m)),
  });
  const start = { ...state };
  const nodes = track.timeYr.length;
  const attempt = (scale: number): boolean => {
    truncateTrack(track, nodes);
    Object.assign(state, start);
    return followPhase(track, state, agbPhase(scale), finalCoreMassMsun);
  };
  if (!attempt(1)) return track;
  // The wind empties the envelope before the core reaches the IFMR mass: time the superwind by
  // the largest AGB wind scale that still lets the core get there (bisection; the envelope left
  // at the end is then small and blown off at once, as with a wind that does not exhaust it).
  let lo = 0;
  let hi = 1;
  while (hi - lo > WIND_SCALE_TOLERANCE * hi) {
    const mid = 0.5 * (lo + hi);
    if (attempt(mid)) hi = mid;
    else lo = mid;
  }
  if (lo === 0 || attempt(lo)) {
    // Even a vanishing AGB wind cannot keep the envelope (it was nearly gone at the AGB start).
    track.endReason = 'envelope-exhausted';
  }
  track.agbWindScale = lo;
  return track;
}

function truncateTrack(track: GiantTrack, nodes: number): void {
  track.timeYr.length = nodes;
  track.coreMassMsun.length = nodes;
  track.massMsun.length = nodes;
  track.luminosityLsun.length = nodes;
  track.radiusAU.length = nodes;
  track.eddyTimeYr.length = nodes;
}

/**
 * Integrates one phase from state.coreMassMsun to coreEndMsun, appending nodes (the first node
 * is the starting state). Returns true if the envelope was exhausted before the end.
 */
function followPhase(
  track: GiantTrack,
  state: { coreMassMsun: number; massMsun: number; timeYr: number },
  phase: Phase,
  coreEndMsun: number,
): boolean {
  // dM/dMc and dt/dMc at (Mc, M): the wind rate over the core growth rate.
  const slopes = (mc: number, m: number, out: [number, number]) => {
    const l = phase.luminosityLsun(mc);
    const growth = coreGrowthRateMsunPerYr(l);
    out[0] = -phase.massLossMsunPerYr(l, giantRadiusRsun(l, m), m) / growth;
    out[1] = 1 / growth;
  };
  const k1: [number, number] = [0, 0];
  const k2: [number, number] = [0, 0];
  const k3: [number, number] = [0, 0];
  const k4: [number, number] = [0, 0];
  pushNode(track, state, phase);
  while (state.coreMassMsun < coreEndMsun) {
    const mc = state.coreMassMsun;
    const m = state.massMsun;
    const envelope = m - mc;
    slopes(mc, m, k1);
    const envelopeSlope = 1 - k1[0]; // −dM_env/dMc = 1 − dM/dMc > 0
    const dlnL = (Math.log(phase.luminosityLsun(mc + 1e-6)) - Math.log(phase.luminosityLsun(mc))) / 1e-6;
    let h = Math.min(MAX_CORE_STEP_MSUN, MAX_DLN_L / dlnL, (MAX_ENVELOPE_FRACTION * envelope) / envelopeSlope, coreEndMsun - mc);
    let last = h === coreEndMsun - mc;
    // Close to exhaustion: aim the step at the threshold instead of creeping towards it.
    const toExhaustion = (envelope - ENVELOPE_EXHAUSTED_MSUN) / envelopeSlope;
    const exhausting = toExhaustion <= h / (1 - MAX_ENVELOPE_FRACTION);
    if (exhausting) {
      h = Math.max(toExhaustion, 0);
      last = true;
    }
    slopes(mc + h / 2, m + (h / 2) * k1[0], k2);
    slopes(mc + h / 2, m + (h / 2) * k2[0], k3);
    slopes(mc + h, m + h * k3[0], k4);
    state.coreMassMsun = last && !exhausting ? coreEndMsun : mc + h;
    state.massMsun = m + (h / 6) * (k1[0] + 2 * k2[0] + 2 * k3[0] + k4[0]);
    state.timeYr += (h / 6) * (k1[1] + 2 * k2[1] + 2 * k3[1] + k4[1]);
    const exhausted = state.massMsun - state.coreMassMsun <= ENVELOPE_EXHAUSTED_MSUN * (1 + 1e-6);
    if (exhausted) state.massMsun = Math.max(state.massMsun, state.coreMassMsun + ENVELOPE_EXHAUSTED_MSUN);
    pushNode(track, state, phase);
    if (exhausted || exhausting) return true;
    if (last) return false;
  }
  return false;
}

function pushNode(track: GiantTrack, state: { coreMassMsun: number; massMsun: number; timeYr: number }, phase: Phase): void {
  const l = phase.luminosityLsun(state.coreMassMsun);
  const radiusRsun = giantRadiusRsun(l, state.massMsun);
  track.timeYr.push(state.timeYr);
  track.coreMassMsun.push(state.coreMassMsun);
  track.massMsun.push(state.massMsun);
  track.luminosityLsun.push(l);
  track.radiusAU.push(radiusRsun / RSUN_PER_AU);
  track.eddyTimeYr.push(eddyTurnoverTimeYr(state.massMsun - state.coreMassMsun, radiusRsun, l));
}
