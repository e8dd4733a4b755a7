import { byOption } from '../../contracts/method-option.ts';
import type { DisruptionFieldOptions } from '../../contracts/scenario.ts';
import { GAUSS_K, RSUN_PER_AU } from '../constants.ts';
import { normalQuantile } from '../numerics/normal-quantile.ts';
import { postCommonEnvelopeSeparationAU } from '../physics/common-envelope-webbink1984.ts';
import { companionRadiusRsun } from '../physics/companion-radius.ts';
import { commonEnvelopeOnset } from '../physics/engulfment-grid.ts';
import { accretionFieldMG } from '../physics/field-accretion.ts';
import { companionScaledLog10ZeroPoint } from '../physics/field-companion-scaled.ts';
import { lognormalFieldMG, lognormalLog10FieldMG } from '../physics/field-lognormal.ts';
import { fossilFieldMG } from '../physics/fossil-field.ts';
import { finalMassMsun } from '../physics/ifmr-piecewise.ts';
import { periodDays as keplerPeriodDays, semiMajorAxisCubedAU3 } from '../physics/kepler.ts';
import { mainSequenceRadiusRsun } from '../physics/main-sequence-radius-demircan1991.ts';
import { widenedSeparationAU } from '../physics/orbit-mass-loss.ts';
import { rgbTipCoreMassMsun } from '../physics/rgb-tip-core-mass.ts';
import { rocheLobeFraction } from '../physics/roche-lobe-eggleton1983.ts';
import { magnitudeLimitedAcceptance } from '../physics/selection-magnitude-limited.ts';
import { tidalRadiusRsun } from '../physics/tidal-disruption.ts';
import { whiteDwarfRadiusRsun } from '../physics/white-dwarf-radius-nauenberg1972.ts';
import { ChunkStream } from '../random.ts';
import { CHUNK_SYSTEMS } from '../version.ts';
import { BINS, binIndex } from './bins.ts';
import { LOG_BIN_LOOKUPS, logBinIndex } from './log-bins.ts';
import { companionLog10MassDraw, companionLog10PeriodDraw, companionMassDraw, companionPeriodDaysDraw } from './companion-draws.ts';
import { PRIMARY_STRIDE, whiteDwarfPosition } from './primary-table.ts';
import { binomialQuantile } from '../stats/binomial-quantile.ts';
import type { PreparedTrack } from './engulfment.ts';
import type { PreparedFossil, PreparedRow, PreparedScenario } from './prepare.ts';
import { addCountsInto, clearTally, copyTally, emptyTallyFor, type ChunkTally } from './tally.ts';

// Fate codes (index into FATES).
const WIDE = 0;
const POST_CE = 1;
const DISRUPTED = 2;
const DISSOLVED = 3;
// Channel codes (index into CHANNELS); -1 = no field.
const DISRUPTION = 0;
const CLOSE_SURVIVOR = 1;
const FOSSIL = 2;
// Setting codes (index into SETTINGS).
const SINGLE = 0;
const WIDE_SETTING = 1;
const POST_CE_SETTING = 2;

/** Half the spacing of the generator's 2^-32 grid: u + this lies strictly inside (0, 1). */
const HALF_STEP = 2 ** -33;
/** Most companion rows a scenario may have (contracts/scenario.ts). */
const MAX_ROWS = 32;
/** An onset core mass this close above the red-giant tip still counts as a red-giant-branch ejection (the tables' interpolation smears the tip). */
const HELIUM_CORE_MARGIN_MSUN = 0.005;
/** log10 of a field (MG) that does not exist. */
const NO_FIELD = -Infinity;
/** 2 log10(k / 2π), k Gauss's constant: log10 a³ (AU³) = log10 M (Msun) + this + 2 log10 P (days), Kepler's third law (kepler.ts). */
const LOG10_KEPLER = 2 * Math.log10(GAUSS_K / (2 * Math.PI));
/**
 * A lower bound of log10 a0³ this far (dex) above 3 log10 reach puts the orbit outside the reach
 * without computing a0: far above the ~1e-15 rounding of the logarithms and of a0³ itself, so the
 * test agrees exactly with a0 < reach.
 */
const OUTSIDE_REACH_MARGIN_DEX = 1e-9;

/**
 * What the kernel needs of one parameter point: the values of the draw-free parameters (see
 * run-points.ts) as the scenario's own preparation computed them, and group numbers that let
 * points with equal values share a computation. A single run is one point, preparedPoint(prepared).
 */
export interface PreparedPoint {
  scenarioHash: string;
  multiplier: number;
  /** Each row's presentThreshold (prepare.ts) at this point's multiplier. */
  presentThresholds: number[];
  /** fixedReach: the reach, AU; track: NaN (the engulfment grid decides). */
  reachAU: number;
  envelope: PreparedScenario['envelope'];
  disruption: PreparedScenario['disruption'];
  field: PreparedScenario['field'];
  fossil: Pick<PreparedFossil, 'fraction' | 'msField'>;
  /** Index of the first point with the same α_CE and λ (the same post-common-envelope orbits). */
  envelopeGroup: number;
  /** Index of the first point with the same η and field.disruption (the same disruption fields). */
  disruptionFieldGroup: number;
  /** Index of the first point with the same field.closeSurvivor (the same close-survivor fields). */
  closeFieldGroup: number;
}

/** The one point of a prepared scenario (a single run). */
export function preparedPoint(prepared: PreparedScenario, groups: Pick<PreparedPoint, 'envelopeGroup' | 'disruptionFieldGroup' | 'closeFieldGroup'> = { envelopeGroup: 0, disruptionFieldGroup: 0, closeFieldGroup: 0 }): PreparedPoint {
  return {
    scenarioHash: prepared.scenarioHash,
    multiplier: prepared.multiplier,
    presentThresholds: prepared.rows.map((row) => row.presentThreshold),
    reachAU: prepared.giant.kind === 'fixedReach' ? prepared.giant.reachAU : NaN,
    envelope: prepared.envelope,
    disruption: prepared.disruption,
    field: prepared.field,
    fossil: { fraction: prepared.channels.fossil.fraction, msField: prepared.channels.fossil.msField },
    ...groups,
  };
}

/**
 * Scratch written by companionFate (one companion at a time), allocated once per module:
 * the kernel never allocates per system. Index: 0 fate, 1 log10 field (MG; NO_FIELD = none), 2 channel,
 * 3 final separation (AU, survivors), 4 white-dwarf mass if this companion ends the giant's
 * evolution (post-CE survivor; else 0), 5 final period (days, post-CE survivors), 6 helium core (1/0).
 */
const fateOut = new Float64Array(7);
/** The generator, reset for each chunk: one object whose step V8 can inline (random.ts). */
const stream = new ChunkStream();
const onsetOut = new Float64Array(4);

// The current system's companions as drawn: the same at every point. NaN / -1 = not computed yet.
const rowDrawn = new Uint8Array(MAX_ROWS);
/** Presence uniform u, occurrence (host-mass scaled), and the threshold below which the row was drawn. */
const rowU = new Float64Array(MAX_ROWS);
const rowOccurrence = new Float64Array(MAX_ROWS);
const rowDrawThreshold = new Float64Array(MAX_ROWS);
/** Mass (Msun) and initial period (days), and their log10: the draw sets one of each pair, the other is derived on first use. */
const rowMass = new Float64Array(MAX_ROWS);
const rowLog10Mass = new Float64Array(MAX_ROWS);
const rowPeriod = new Float64Array(MAX_ROWS);
const rowLog10Period = new Float64Array(MAX_ROWS);
/** A lower bound of log10 a0³ (AU³) from log10 P and the primary's table node (no logarithm, no power). */
const rowLog10A3Floor = new Float64Array(MAX_ROWS);
/** Fate-map bins of mass and initial period (computed on first use). */
const rowMassBin = new Int32Array(MAX_ROWS);
const rowPeriodBin = new Int32Array(MAX_ROWS);
/** Initial semi-major axis (AU, NaN until needed) and the widened one of a wide survivor. */
const rowA0 = new Float64Array(MAX_ROWS);
const rowWideAU = new Float64Array(MAX_ROWS);
/** track: 1 iff the giant engulfs the companion (then the onset state below is set at the draw). */
const rowEngulfed = new Uint8Array(MAX_ROWS);
/** The giant at the onset of the common envelope: core mass, total mass (Msun), radius, separation (AU). */
const rowCoreMass = new Float64Array(MAX_ROWS);
const rowGiantMass = new Float64Array(MAX_ROWS);
const rowRadiusAU = new Float64Array(MAX_ROWS);
const rowOnsetAU = new Float64Array(MAX_ROWS);
/** Derived once per companion on its first common envelope: helium core (1/0), core radius, companion radius (Rsun), Roche-lobe fraction. */
const rowEnvelopeReady = new Uint8Array(MAX_ROWS);
const rowHelium = new Uint8Array(MAX_ROWS);
const rowCoreRadius = new Float64Array(MAX_ROWS);
const rowCompanionRadius = new Float64Array(MAX_ROWS);
const rowRocheFraction = new Float64Array(MAX_ROWS);
/** Post-common-envelope orbit (AU) and period (d) for the point group rowEnvelopeGroup. */
const rowEnvelopeGroup = new Int32Array(MAX_ROWS);
const rowFinalAU = new Float64Array(MAX_ROWS);
const rowFinalPeriod = new Float64Array(MAX_ROWS);
/** log10 fields (MG) of a destroyed / close surviving companion, for the point group in the group array. */
const rowDisruptionGroup = new Int32Array(MAX_ROWS);
const rowDisruptionField = new Float64Array(MAX_ROWS);
const rowCloseGroup = new Int32Array(MAX_ROWS);
const rowCloseField = new Float64Array(MAX_ROWS);

/**
 * The current system's scalars (and a few of the chunk's), in a typed array rather than module
 * variables or function arguments: a double stored in a module variable or passed to a call that
 * is not inlined becomes a new heap object each time, which was a large part of the kernel's cost.
 * The field uniform's normal deviate is NaN until a field needs it (a quantile only where a field
 * is made).
 */
const systemNow = new Float64Array(12);
const PRIMARY_MASS = 0;
const PRIMARY_LOG10_MASS_FLOOR = 1;
const FIELD_UNIFORM = 2;
const FIELD_DEVIATE = 3;
/** fixedReach: radius (Rsun) of the white dwarf of the IFMR mass, the core in every common envelope of the system (NaN until needed). */
const FINAL_CORE_RADIUS = 4;
/** The white-dwarf mass of the IFMR (Msun) and the cooling age (Gyr). */
const IFMR_MASS = 5;
const COOLING = 6;
/** The fossil channel's uniform and normal deviate (1 and 0 when the channel is off). */
const FOSSIL_UNIFORM = 7;
const FOSSIL_DEVIATE = 8;
/** The chunk's constants: multiplier-tally bins per unit multiplier; track: log10 a0³ above which nothing is engulfed. */
const MULTIPLIER_SCALE = 9;
const TRACK_OUTSIDE = 10;
/** Scratch for the white dwarf's position in the primary table (primary-table.ts). */
const POSITION = 11;

/** One system's outcome at one point: what the tallies count. */
class Outcome {
  accepted = false;
  setting = SINGLE;
  mwd = 0;
  helium = false;
  bestField = 0;
  bestChannel = -1;
  smallestMultiplier = Infinity;
  closestPostCEPeriod = Infinity;
  /** bestField ≥ the point's threshold. */
  magnetic = false;
  /** Per row: present at this point's multiplier (1/0), fate, final separation (AU). */
  readonly present = new Uint8Array(MAX_ROWS);
  readonly fate = new Int8Array(MAX_ROWS);
  readonly separation = new Float64Array(MAX_ROWS);
}
/** The first point's outcome (the reference), and two more that the later points take in turn. */
const reference = new Outcome();
const outcomeA = new Outcome();
const outcomeB = new Outcome();
/**
 * Point 0's counts while a chunk runs: one tally that every chunk clears and reuses, and a copy
 * returned at the end. A tally that lives through a whole chunk outlasts the young generation, and
 * a new one per chunk made the old generation (and the resident memory) grow by ≈ 50 MB over 10^8
 * systems before a full collection; the returned copy dies young.
 */
let referenceTally: ChunkTally | null = null;

/**
 * Runs chunk `chunkIndex` of the prepared scenario: draws its systems from the generator
 * seeded with (seed, chunkIndex) and returns integer counts. The uniforms drawn per system are,
 * in order: primary mass; birth time (constant star formation only); and, for white dwarfs only:
 * the selection uniform (magnitude-limited only); the field deviate; two fossil uniforms (fossil
 * channel enabled only); and per companion row a presence uniform u followed, iff
 * u < min(1, occurrence · (M1)^hostMassSlope · m_max), by the companion's mass and period. None of
 * these depends on the multiplier, α_CE, λ, η, the dissolution mass, the field options or
 * threshold, the fossil fraction and main-sequence field, or the reach, so runChunkForPoints
 * evaluates many values of those on one set of draws.
 *
 * Engine 2: each companion's fate is decided alone; the white dwarf's mass is the IFMR's unless
 * a post-common-envelope survivor ended the giant's evolution early (then the smallest onset core
 * of those); the fossil field and the magnitude-limited selection use that final mass. A field
 * made by a companion counts only from the cooling age field.emergenceDelayGyr on.
 */
export function runChunk(prepared: PreparedScenario, chunkIndex: number): ChunkTally {
  return runChunkForPoints(prepared, [preparedPoint(prepared)], chunkIndex)[0];
}

/**
 * The kernel: runs chunk `chunkIndex` once and returns one tally per point, tally p equal to
 * runChunk of the scenario with point p's values. The draws and everything that follows from
 * them alone (lifetime, IFMR, Kepler, the engulfment onset, radii) are computed once per system;
 * each point decides the companions' fates, fields and the selection. Point 0 is tallied as is;
 * point p > 0 keeps only the change from point p − 1, where the two outcomes differ (p's counts
 * added, p − 1's taken away), and the counts are summed along the points at the end: exact, since
 * every count is an integer. Along a grid most systems change at a few points only, so a system
 * touches a few tallies, not every point's. `prepared` must be the preparation of any of the points (their draws agree).
 */
export function runChunkForPoints(prepared: PreparedScenario, points: readonly PreparedPoint[], chunkIndex: number): ChunkTally[] {
  const first = chunkIndex * CHUNK_SYSTEMS;
  const n = Math.min(CHUNK_SYSTEMS, prepared.systems - first);
  if (!(Number.isInteger(chunkIndex) && chunkIndex >= 0 && n > 0)) {
    throw new RangeError(`chunkIndex = ${chunkIndex} is outside the allowed range [0, ${prepared.chunkCount - 1}]`);
  }
  if (points.length === 0) throw new RangeError('points must hold at least one parameter point');
  // Point 0 counts into the reused tally (see referenceTally); the others into their own.
  referenceTally = clearTally(referenceTally ?? emptyTallyFor(points[0].scenarioHash), points[0].scenarioHash);
  const tallies = points.map((point, p) => (p === 0 ? referenceTally! : emptyTallyFor(point.scenarioHash)));
  const logs = points.map(pointLogs);
  const rng = stream.reset(prepared.seed, chunkIndex); // = chunkUniform(prepared.seed, chunkIndex)
  const { ifmr, rows } = prepared;
  const { cells, nodes } = prepared.primary;
  const fossil = prepared.channels.fossil;
  const [fossilLoMsun, fossilHiMsun] = fossil.massRangeMsun;
  const constantHistory = prepared.constantHistory;
  const ageGyr = prepared.ageGyr;
  const rowCount = rows.length;
  const magnitudeLimited = prepared.selection.kind === 'magnitudeLimited';
  const track = prepared.giant.kind === 'track' ? prepared.giant : null;
  systemNow[TRACK_OUTSIDE] = track ? outsideReachLog10A3(Math.exp(Math.max(...track.grid.logCriticalSeparationAU))) : NaN;
  const pointCount = points.length;
  systemNow[MULTIPLIER_SCALE] = BINS.multiplierBins / prepared.multiplierMax;
  const spread = pointSpread(points, logs, rowCount);

  // The chunk's white dwarfs, drawn directly (primary-table.ts): their number, then each one's
  // mass uniform (its position in the primary table) and, for constant star formation, birth time.
  const whiteDwarfs = prepared.whiteDwarfs;
  const whiteDwarfsFormed = binomialQuantile(rng.uniform(), n, whiteDwarfs.probability);
  for (let s = 0; s < whiteDwarfsFormed; s++) {
    if (constantHistory) whiteDwarfPosition(whiteDwarfs, prepared.primary, rng, systemNow, POSITION);
    else systemNow[POSITION] = (whiteDwarfs.uLowest + (1 - whiteDwarfs.uLowest) * rng.uniform()) * cells;
    const position = systemNow[POSITION];
    const k = Math.min(position | 0, cells - 1);
    const at = PRIMARY_STRIDE * k;
    const w = position - k;
    const tms = nodes[at + 1] + w * (nodes[at + PRIMARY_STRIDE + 1] - nodes[at + 1]);
    const m1 = nodes[at] + w * (nodes[at + PRIMARY_STRIDE] - nodes[at]);
    systemNow[PRIMARY_MASS] = m1;
    systemNow[PRIMARY_LOG10_MASS_FLOOR] = nodes[at + 2];
    const ifmrMass = finalMassMsun(ifmr, m1);
    // Rounding can put t̃ a hair above the age at the edge of the white-dwarf region: cooling age 0 there.
    const youngest = ageGyr - tms > 0 ? ageGyr - tms : 0;
    const cooling = constantHistory ? youngest * rng.uniform() : youngest;
    systemNow[IFMR_MASS] = ifmrMass;
    systemNow[COOLING] = cooling;
    const uSelect = magnitudeLimited ? rng.uniform() : 0;
    systemNow[FIELD_UNIFORM] = rng.uniform();
    systemNow[FIELD_DEVIATE] = NaN;
    systemNow[FINAL_CORE_RADIUS] = NaN;

    let uFossil = 1;
    systemNow[FOSSIL_DEVIATE] = 0;
    if (fossil.enabled) {
      uFossil = rng.uniform();
      systemNow[FOSSIL_DEVIATE] = normalQuantile(rng.uniform() + HALF_STEP);
    }
    systemNow[FOSSIL_UNIFORM] = uFossil;
    // Whether this system's fates or fields can differ between the points, and whether which
    // companions are present can (neither: point 0's counts hold for all).
    let fatesVary = spread.fossilVaries && uFossil < spread.maxFossilFraction && m1 >= fossilLoMsun && m1 <= fossilHiMsun;
    let presenceVaries = false;

    for (let r = 0; r < rowCount; r++) {
      const row = rows[r];
      const u = rng.uniform();
      rowDrawn[r] = 0;
      // Host-mass scaling of the occurrence, capped at 1 per star (a pow only when the row asks).
      const occurrence = row.hostMassSlope === 0 ? row.occurrence : row.occurrence * Math.pow(m1, row.hostMassSlope);
      const drawThreshold = row.hostMassSlope === 0 ? row.drawThreshold : Math.min(1, occurrence * prepared.multiplierMax);
      if (!(u < drawThreshold)) continue;
      rowU[r] = u;
      rowOccurrence[r] = occurrence;
      rowDrawThreshold[r] = drawThreshold;
      drawnCompanion(r, row, track);
      if (spread.fateVaries && (track ? rowEngulfed[r] === 1 : insideReach(r, spread.maxReachAU, spread.maxReachOutsideLog10A3)) && !destroyedAtEveryPoint(prepared, points, logs, spread, r)) fatesVary = true;
      if (spread.multiplierVaries && (row.hostMassSlope !== 0 || (u >= spread.minPresent[r] && u < spread.maxPresent[r]))) presenceVaries = true;
    }
    const pointsToEvaluate = fatesVary || presenceVaries ? pointCount : 1;
    // If only presence varies, a point with the same companions present as the point before has
    // that point's outcome: it is not evaluated (and adds no change).
    let presence = pointsToEvaluate > 1 && !fatesVary ? presenceMask(points[0], rows, rowCount) : 0;
    let before = reference;

    // Magnitude-limited acceptance at the IFMR mass, computed once if a point needs it.
    let acceptanceAtIfmr = NaN;
    for (let p = 0; p < pointsToEvaluate; p++) {
      if (p > 0 && !fatesVary) {
        const mask = presenceMask(points[p], rows, rowCount);
        if (mask === presence) continue;
        presence = mask;
      }
      const out = p === 0 ? reference : before === outcomeA ? outcomeB : outcomeA;
      evaluatePoint(prepared, points[p], logs[p], out);
      if (out.accepted && magnitudeLimited) {
        const selection = prepared.selection as Extract<PreparedScenario['selection'], { kind: 'magnitudeLimited' }>;
        let accept: number;
        if (out.mwd === ifmrMass) {
          if (Number.isNaN(acceptanceAtIfmr)) acceptanceAtIfmr = magnitudeLimitedAcceptance(ifmrMass, cooling, selection.coolingAgeFloorGyr, selection.wavelengthNm, selection.referenceFlux);
          accept = acceptanceAtIfmr;
        } else accept = magnitudeLimitedAcceptance(out.mwd, cooling, selection.coolingAgeFloorGyr, selection.wavelengthNm, selection.referenceFlux);
        out.accepted = uSelect < accept;
      }
      if (p === 0) tallyOutcome(tallies[0], reference, 1, rowCount);
      else {
        if (!sameOutcome(before, out, rowCount)) {
          tallyOutcome(tallies[p], out, 1, rowCount);
          tallyOutcome(tallies[p], before, -1, rowCount);
        }
        before = out;
      }
    }
  }

  // Point p's counts: point 0's plus the changes of points 1 … p (the chunk's scalars are set after).
  for (let p = 1; p < pointCount; p++) addCountsInto(tallies[p], tallies[p - 1]);
  for (let p = 0; p < pointCount; p++) {
    const tally = tallies[p];
    tally.chunks = 1;
    tally.systems = n;
    tally.whiteDwarfsFormed = whiteDwarfsFormed;
  }
  tallies[0] = copyTally(referenceTally);
  return tallies;
}

/** A point's numbers in the kernel's log10 form, derived once per chunk. */
interface PointLogs {
  /** log10 of the field threshold (MG). */
  threshold: number;
  /** fixedReach: log10 a0³ above which an orbit is surely outside the reach; NaN for track. */
  reachOutsideLog10A3: number;
  /** log10 of the disruption field's median (MG) for lognormal; the zero point at 1 Msun for companionScaled; unused for accretion. */
  disruptionMedian: number;
  /** log10 of the close survivors' median field (MG). */
  closeMedian: number;
}

function pointLogs(point: PreparedPoint): PointLogs {
  return {
    threshold: Math.log10(point.field.thresholdMG),
    reachOutsideLog10A3: outsideReachLog10A3(point.reachAU),
    disruptionMedian: disruptionLog10MedianOf(point.field.disruption),
    closeMedian: Math.log10(point.field.closeSurvivor.medianMG),
  };
}

/** The bound above which log10 a0³ is surely outside a reach of reachAU (NaN stays NaN: nothing is surely outside). */
function outsideReachLog10A3(reachAU: number): number {
  return 3 * Math.log10(reachAU) + OUTSIDE_REACH_MARGIN_DEX;
}

/**
 * What differs between the points, for the kernel's test of whether a system's outcome can
 * differ: presence (the multiplier; per row the lowest and highest presence threshold), the
 * fates and fields of engulfed companions (reach, α_CE, λ, η, dissolution, field options,
 * threshold, emergence delay; up to the largest reach), and fossil fields (fossil options or
 * threshold; up to the largest fossil fraction). A system without a companion or fossil field
 * that any of these can touch has point 0's outcome at every point.
 */
function pointSpread(points: readonly PreparedPoint[], logs: readonly PointLogs[], rowCount: number) {
  const first = points[0];
  const minPresent = first.presentThresholds.slice(0, rowCount);
  const maxPresent = first.presentThresholds.slice(0, rowCount);
  let maxReach = 0;
  let maxFossilFraction = first.fossil.fraction;
  let multiplierVaries = false;
  let fateVaries = false;
  let fossilVaries = false;
  const fieldKey = (p: PreparedPoint) => JSON.stringify([p.disruption, p.field.disruption, p.field.closeSurvivor, p.field.emergenceDelayGyr]);
  const firstFieldKey = fieldKey(first);
  points.forEach((p, i) => {
    for (let r = 0; r < rowCount; r++) {
      minPresent[r] = Math.min(minPresent[r], p.presentThresholds[r]);
      maxPresent[r] = Math.max(maxPresent[r], p.presentThresholds[r]);
    }
    if (p.multiplier !== first.multiplier) multiplierVaries = true;
    const thresholdVaries = p.field.thresholdMG !== first.field.thresholdMG;
    if (thresholdVaries || !Object.is(p.reachAU, first.reachAU) || p.envelope.alpha !== first.envelope.alpha || p.envelope.lambda !== first.envelope.lambda || fieldKey(p) !== firstFieldKey) fateVaries = true;
    if (thresholdVaries || p.fossil.fraction !== first.fossil.fraction || p.fossil.msField.medianKG !== first.fossil.msField.medianKG || p.fossil.msField.widthDex !== first.fossil.msField.widthDex) fossilVaries = true;
    if (p.reachAU > points[maxReach].reachAU) maxReach = i;
    if (p.fossil.fraction > maxFossilFraction) maxFossilFraction = p.fossil.fraction;
  });
  const maxReachAU = points[maxReach].reachAU;
  const maxReachOutsideLog10A3 = logs[maxReach].reachOutsideLog10A3;
  return { minPresent, maxPresent, maxReachAU, maxReachOutsideLog10A3, maxFossilFraction, multiplierVaries, fateVaries, fossilVaries, widestEnvelope: widestEnvelopePoint(points, firstFieldKey, fieldKey) };
}

/**
 * The point with the largest α_CE λ if the points' fates differ only through α_CE and λ (same
 * reach, threshold, dissolution and field options); else -1. The Webbink (1984) orbit after the
 * common envelope grows with α_CE λ, and each IEEE operation in it is monotone, so a companion
 * destroyed at that point is destroyed, with the same field, at every point.
 */
function widestEnvelopePoint(points: readonly PreparedPoint[], firstFieldKey: string, fieldKey: (p: PreparedPoint) => string): number {
  const first = points[0];
  let widest = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    if (p.field.thresholdMG !== first.field.thresholdMG || !Object.is(p.reachAU, first.reachAU) || fieldKey(p) !== firstFieldKey) return -1;
    if (p.envelope.alpha * p.envelope.lambda > points[widest].envelope.alpha * points[widest].envelope.lambda) widest = i;
  }
  return widest;
}

/** true iff engulfed companion r is destroyed at every point (see widestEnvelopePoint): its part of the outcome is then the same at every point. */
function destroyedAtEveryPoint(prepared: PreparedScenario, points: readonly PreparedPoint[], logs: readonly PointLogs[], spread: ReturnType<typeof pointSpread>, r: number): boolean {
  const p = spread.widestEnvelope;
  if (p < 0) return false;
  companionFate(prepared, points[p], logs[p], r, true);
  return fateOut[0] === DISRUPTED || fateOut[0] === DISSOLVED;
}

/**
 * Draws companion r's mass and period (the next two uniforms; its presence uniform, occurrence and
 * draw threshold are already in the row arrays) and records what follows from the draws alone: a
 * lower bound of log10 a0³, and for track whether the giant engulfs it (with the onset state). A
 * quantity the row draws in log10 form stays in that form until the value is needed.
 */
function drawnCompanion(r: number, row: PreparedRow, track: PreparedTrack | null): void {
  rowDrawn[r] = 1;
  const uMass = stream.uniform();
  const uPeriod = stream.uniform();
  if (row.log10MassTable && !row.massIsRatio) {
    rowLog10Mass[r] = companionLog10MassDraw(row, uMass);
    rowMass[r] = NaN;
  } else {
    const drawn = row.log10MassTable ? Math.exp(companionLog10MassDraw(row, uMass) * Math.LN10) : companionMassDraw(row, uMass);
    rowMass[r] = row.massIsRatio ? drawn * systemNow[PRIMARY_MASS] : drawn;
    rowLog10Mass[r] = NaN;
  }
  if (row.log10PeriodTable) {
    rowLog10Period[r] = companionLog10PeriodDraw(row, uPeriod);
    rowPeriod[r] = NaN;
  } else {
    rowPeriod[r] = companionPeriodDaysDraw(row, uPeriod);
    rowLog10Period[r] = Math.log10(rowPeriod[r]);
  }
  // a0³ = (M1 + m2) (k P / 2π)² ≥ M1 (k P / 2π)², and M1 is at least its table node's mass.
  rowLog10A3Floor[r] = systemNow[PRIMARY_LOG10_MASS_FLOOR] + LOG10_KEPLER + 2 * rowLog10Period[r];
  rowMassBin[r] = -1;
  rowA0[r] = NaN;
  rowWideAU[r] = NaN;
  rowEnvelopeReady[r] = 0;
  rowEnvelopeGroup[r] = -1;
  rowDisruptionGroup[r] = -1;
  rowCloseGroup[r] = -1;
  if (track) {
    // Beyond the largest critical separation of the whole grid no interpolation engulfs it.
    let engulfed = false;
    if (rowLog10A3Floor[r] < systemNow[TRACK_OUTSIDE]) {
      fillOrbit(r);
      engulfed = commonEnvelopeOnset(track.grid, systemNow[PRIMARY_MASS], rowMass[r], rowA0[r], onsetOut);
    }
    rowEngulfed[r] = engulfed ? 1 : 0;
    if (engulfed) {
      rowCoreMass[r] = onsetOut[0];
      rowGiantMass[r] = onsetOut[1];
      rowRadiusAU[r] = onsetOut[2];
      rowOnsetAU[r] = onsetOut[3];
    }
  }
}

// The helpers below fill the row arrays (or systemNow) on first use and return nothing: a double
// returned from, or passed to, a call that V8 does not inline becomes a new heap object.

/** Fills rowMass[r], companion r's mass (Msun): 10^log10 taken on first use. */
function fillMass(r: number): void {
  if (Number.isNaN(rowMass[r])) rowMass[r] = Math.exp(rowLog10Mass[r] * Math.LN10);
}

/** Fills rowLog10Mass[r], log10 of companion r's mass (Msun): the logarithm taken on first use. */
function fillLog10Mass(r: number): void {
  if (Number.isNaN(rowLog10Mass[r])) rowLog10Mass[r] = Math.log10(rowMass[r]);
}

/** Fills rowA0[r], companion r's initial semi-major axis (AU, Kepler's third law), with the mass and period (days) it needs. */
function fillOrbit(r: number): void {
  if (!Number.isNaN(rowA0[r])) return;
  fillMass(r);
  if (Number.isNaN(rowPeriod[r])) rowPeriod[r] = Math.exp(rowLog10Period[r] * Math.LN10);
  rowA0[r] = Math.cbrt(semiMajorAxisCubedAU3(rowPeriod[r], systemNow[PRIMARY_MASS] + rowMass[r])); // = semiMajorAxisAU (kepler.ts)
}

/** Fills rowCompanionRadius[r], companion r's radius (Rsun). */
function fillRadius(r: number): void {
  if (!Number.isNaN(rowCompanionRadius[r])) return;
  fillMass(r);
  rowCompanionRadius[r] = companionRadiusRsun(rowMass[r]);
}

/** fixedReach: fills systemNow[FINAL_CORE_RADIUS], the radius (Rsun) of the white dwarf of the IFMR mass, once per system. */
function fillFinalCoreRadius(): void {
  if (Number.isNaN(systemNow[FINAL_CORE_RADIUS])) systemNow[FINAL_CORE_RADIUS] = whiteDwarfRadiusRsun(systemNow[IFMR_MASS]);
}

/** Fills systemNow[FIELD_DEVIATE], the current system's field deviate (a standard normal): its quantile taken on first use. */
function fillFieldDeviate(): void {
  if (Number.isNaN(systemNow[FIELD_DEVIATE])) systemNow[FIELD_DEVIATE] = normalQuantile(systemNow[FIELD_UNIFORM] + HALF_STEP);
}

/** The rows whose drawn companion is present at the point, as bits (row r: bit r). */
function presenceMask(point: PreparedPoint, rows: readonly PreparedRow[], rowCount: number): number {
  let mask = 0;
  for (let r = 0; r < rowCount; r++) {
    if (rowDrawn[r] === 1 && presentAt(point, rows[r], r)) mask |= 1 << r;
  }
  return mask;
}

/** true iff drawn companion r is present at the point's multiplier (its presence uniform below the point's threshold). */
function presentAt(point: PreparedPoint, row: PreparedRow, r: number): boolean {
  return rowU[r] < (row.hostMassSlope === 0 ? point.presentThresholds[r] : Math.min(rowDrawThreshold[r], rowOccurrence[r] * point.multiplier));
}

/** a0 < reachAU for companion r; an orbit whose lower bound of log10 a0³ is above outsideLog10A3 is outside without computing a0. */
function insideReach(r: number, reachAU: number, outsideLog10A3: number): boolean {
  if (rowLog10A3Floor[r] > outsideLog10A3) return false;
  fillOrbit(r);
  return rowA0[r] < reachAU;
}

/**
 * The current system's outcome at one point, before the magnitude-limited selection (`accepted`
 * is true here; the caller applies the selection with out.mwd).
 */
function evaluatePoint(prepared: PreparedScenario, point: PreparedPoint, logs: PointLogs, out: Outcome): void {
  const m1 = systemNow[PRIMARY_MASS];
  const ifmrMass = systemNow[IFMR_MASS];
  const cooling = systemNow[COOLING];
  const rows = prepared.rows;
  const track = prepared.giant.kind === 'track';
  const threshold = logs.threshold;
  const fieldsEmerged = cooling >= point.field.emergenceDelayGyr;
  let mwd = ifmrMass;
  let helium = false;
  let setting = SINGLE;
  let bestField = NO_FIELD;
  let bestChannel = -1;
  let smallestMultiplier = Infinity;
  let closestPostCEPeriod = Infinity;
  for (let r = 0; r < rows.length; r++) {
    out.present[r] = 0;
    if (rowDrawn[r] === 0) continue;
    const u = rowU[r];
    const occurrence = rowOccurrence[r];
    const present = presentAt(point, rows[r], r);
    // An absent companion outside the giant's reach neither counts nor makes a field.
    if (!present && (track ? rowEngulfed[r] === 0 : rowLog10A3Floor[r] > logs.reachOutsideLog10A3)) continue;
    companionFate(prepared, point, logs, r, present);
    const fate = fateOut[0];
    const companionField = fieldsEmerged ? fateOut[1] : NO_FIELD;
    if (companionField >= threshold) {
      const m = u / occurrence;
      if (m < smallestMultiplier) smallestMultiplier = m;
    }
    if (!present) continue;
    out.present[r] = 1;
    out.fate[r] = fate;
    out.separation[r] = fateOut[3];
    if (fate === POST_CE) {
      setting = POST_CE_SETTING;
      if (fateOut[5] < closestPostCEPeriod) closestPostCEPeriod = fateOut[5];
      if (fateOut[4] < mwd) {
        mwd = fateOut[4];
        helium = fateOut[6] === 1;
      }
    } else if (fate === WIDE && setting === SINGLE) setting = WIDE_SETTING;
    if (companionField > bestField) {
      bestField = companionField;
      bestChannel = fateOut[2];
    }
  }

  const fossil = prepared.channels.fossil;
  if (fossil.enabled && systemNow[FOSSIL_UNIFORM] < point.fossil.fraction && m1 >= fossil.massRangeMsun[0] && m1 <= fossil.massRangeMsun[1]) {
    const fossilField = Math.log10(fossilFieldMG(lognormalFieldMG(point.fossil.msField.medianKG, point.fossil.msField.widthDex, systemNow[FOSSIL_DEVIATE]), mainSequenceRadiusRsun(m1), whiteDwarfRadiusRsun(mwd)));
    if (fossilField >= threshold) smallestMultiplier = 0;
    if (fossilField > bestField) {
      bestField = fossilField;
      bestChannel = FOSSIL;
    }
  }

  out.accepted = true;
  out.setting = setting;
  out.mwd = mwd;
  out.helium = helium;
  out.bestField = bestField;
  out.bestChannel = bestChannel;
  out.smallestMultiplier = smallestMultiplier;
  out.closestPostCEPeriod = closestPostCEPeriod;
  // The magnetic verdict depends on the point's threshold: keep it with the outcome.
  out.magnetic = bestField >= threshold;
}

/** true iff both outcomes add the same counts to a tally. */
function sameOutcome(a: Outcome, b: Outcome, rowCount: number): boolean {
  if (a.accepted !== b.accepted) return false;
  if (!a.accepted) return true;
  if (
    a.setting !== b.setting ||
    a.mwd !== b.mwd ||
    a.helium !== b.helium ||
    a.bestField !== b.bestField ||
    a.bestChannel !== b.bestChannel ||
    a.magnetic !== b.magnetic ||
    a.smallestMultiplier !== b.smallestMultiplier ||
    a.closestPostCEPeriod !== b.closestPostCEPeriod
  ) {
    return false;
  }
  for (let r = 0; r < rowCount; r++) {
    if (a.present[r] !== b.present[r]) return false;
    if (a.present[r] === 1 && (a.fate[r] !== b.fate[r] || a.separation[r] !== b.separation[r])) return false;
  }
  return true;
}

/** Adds (sign = 1) or takes away (sign = -1) one system's outcome to the tally's counts. */
function tallyOutcome(tally: ChunkTally, out: Outcome, sign: number, rowCount: number): void {
  if (!out.accepted) return;
  const cooling = systemNow[COOLING];
  const massBins = BINS.log10CompanionMsun.count;
  const periodBins = BINS.log10PeriodDays.count;
  const separationBins = BINS.log10SeparationAU.count;
  const wdMassBins = BINS.wdMassMsun.count;
  const fieldBins = BINS.log10FieldMG.count;
  const coolingBins = BINS.log10CoolingAgeGyr.count;
  const postCEPeriodBins = BINS.log10PostCEPeriodDays.count;
  tally.whiteDwarfs += sign;
  if (out.helium) tally.heliumWhiteDwarfs += sign;
  for (let r = 0; r < rowCount; r++) {
    if (out.present[r] === 0) continue;
    const fate = out.fate[r];
    if (rowMassBin[r] < 0) {
      fillLog10Mass(r);
      rowMassBin[r] = binIndex(BINS.log10CompanionMsun, rowLog10Mass[r]);
      rowPeriodBin[r] = binIndex(BINS.log10PeriodDays, rowLog10Period[r]);
    }
    tally.companionFates[fate] += sign;
    tally.fateMap[(fate * massBins + rowMassBin[r]) * periodBins + rowPeriodBin[r]] += sign;
    if (fate === WIDE || fate === POST_CE) tally.survivorSeparation[fate * separationBins + logBinIndex(LOG_BIN_LOOKUPS.log10SeparationAU, out.separation[r])] += sign;
  }

  const setting = out.setting;
  const bestChannel = out.bestChannel;
  tally.settingWhiteDwarfs[setting] += sign;
  const massBin = binIndex(BINS.wdMassMsun, out.mwd);
  const coolingBin = logBinIndex(LOG_BIN_LOOKUPS.log10CoolingAgeGyr, cooling);
  if (out.bestField > NO_FIELD) {
    const fieldBin = binIndex(BINS.log10FieldMG, out.bestField);
    tally.logField[fieldBin] += sign;
    tally.logFieldByChannel[bestChannel * fieldBins + fieldBin] += sign;
  }
  const split = out.magnetic ? 0 : 1;
  if (out.magnetic) {
    tally.magnetic += sign;
    tally.byChannel[bestChannel] += sign;
    tally.settingMagnetic[setting] += sign;
    tally.channelBySetting[bestChannel * 3 + setting] += sign;
    tally.wdMassMagnetic[massBin] += sign;
  } else {
    tally.wdMassNonMagnetic[massBin] += sign;
  }
  tally.wdMassBySetting[(setting * 2 + split) * wdMassBins + massBin] += sign;
  tally.coolingAge[split * coolingBins + coolingBin] += sign;
  if (setting === POST_CE_SETTING) tally.postCEPeriod[split * postCEPeriodBins + logBinIndex(LOG_BIN_LOOKUPS.log10PostCEPeriodDays, out.closestPostCEPeriod)] += sign;
  const smallestMultiplier = out.smallestMultiplier;
  if (smallestMultiplier === 0) tally.multiplierFossil += sign;
  else if (smallestMultiplier < Infinity) {
    const bin = Math.floor(smallestMultiplier * systemNow[MULTIPLIER_SCALE]);
    tally.multiplierBins[bin < BINS.multiplierBins ? bin : BINS.multiplierBins - 1] += sign;
  }
}

/**
 * Decides companion r's fate at one point and writes fateOut (see above). Order: no common
 * envelope → a wide survivor on an orbit widened by the mass loss; else the Webbink budget with
 * the giant's state at the onset: a survivor if the post-CE orbit keeps the companion inside its
 * Roche lobe and outside the core (white-dwarf mass = core at onset for `track`, helium if the
 * onset was on the red giant branch; the IFMR mass for `fixedReach`), else destroyed in the
 * envelope: dissolved if lighter than the dissolution mass, otherwise shredded near the core
 * (channel disruption). A close survivor (final period below field.closeSurvivor.maxPeriodDays)
 * gets a field iff that channel is on. What does not depend on the point is computed once per
 * companion and kept in the row arrays.
 */
function companionFate(prepared: PreparedScenario, point: PreparedPoint, logs: PointLogs, r: number, present: boolean): void {
  const m1 = systemNow[PRIMARY_MASS];
  const ifmrMass = systemNow[IFMR_MASS];
  const fixedReach = prepared.giant.kind === 'fixedReach';
  if (fixedReach ? !insideReach(r, point.reachAU, logs.reachOutsideLog10A3) : rowEngulfed[r] === 0) {
    // Only a present companion's separation is tallied.
    if (present && Number.isNaN(rowWideAU[r])) {
      fillOrbit(r);
      const m2 = rowMass[r];
      rowWideAU[r] = widenedSeparationAU(rowA0[r], m1 + m2, ifmrMass + m2);
    }
    survivor(WIDE);
    fateOut[3] = rowWideAU[r];
    return;
  }
  fillOrbit(r);
  const m2 = rowMass[r];
  const a0 = rowA0[r];
  if (rowEnvelopeReady[r] === 0) {
    if (fixedReach) {
      // fixedReach: the envelope engulfs the companion at R = a0, with the final core and the full envelope.
      rowGiantMass[r] = m1;
      rowCoreMass[r] = ifmrMass;
      rowRadiusAU[r] = a0;
      rowOnsetAU[r] = a0;
      rowHelium[r] = 0;
    } else {
      const tip = rgbTipCoreMassMsun(m1);
      rowHelium[r] = tip !== null && rowCoreMass[r] < tip + HELIUM_CORE_MARGIN_MSUN ? 1 : 0;
    }
    if (fixedReach) fillFinalCoreRadius();
    rowCoreRadius[r] = fixedReach ? systemNow[FINAL_CORE_RADIUS] : whiteDwarfRadiusRsun(rowCoreMass[r]);
    rowCompanionRadius[r] = NaN;
    rowRocheFraction[r] = NaN;
    rowEnvelopeReady[r] = 1;
  }
  const coreMass = rowCoreMass[r];
  const coreRadius = rowCoreRadius[r];
  if (rowEnvelopeGroup[r] !== point.envelopeGroup) {
    rowFinalAU[r] = postCommonEnvelopeSeparationAU(rowOnsetAU[r], rowRadiusAU[r], rowGiantMass[r], coreMass, m2, point.envelope.alpha, point.envelope.lambda);
    rowFinalPeriod[r] = NaN;
    rowEnvelopeGroup[r] = point.envelopeGroup;
  }
  const finalAU = rowFinalAU[r];
  const finalRsun = finalAU * RSUN_PER_AU;
  if (finalRsun > coreRadius) {
    if (Number.isNaN(rowRocheFraction[r])) rowRocheFraction[r] = rocheLobeFraction(m2 / coreMass);
    fillRadius(r);
    if (rowCompanionRadius[r] < rowRocheFraction[r] * finalRsun) {
      if (Number.isNaN(rowFinalPeriod[r])) rowFinalPeriod[r] = keplerPeriodDays(finalAU, coreMass + m2);
      const finalPeriod = rowFinalPeriod[r];
      survivor(POST_CE);
      fateOut[3] = finalAU;
      fateOut[4] = coreMass;
      fateOut[5] = finalPeriod;
      fateOut[6] = rowHelium[r];
      const close = point.field.closeSurvivor;
      if (prepared.channels.closeSurvivor && finalPeriod < close.maxPeriodDays) {
        if (rowCloseGroup[r] !== point.closeFieldGroup) {
          fillFieldDeviate();
          rowCloseField[r] = lognormalLog10FieldMG(logs.closeMedian, close.widthDex, systemNow[FIELD_DEVIATE]);
          rowCloseGroup[r] = point.closeFieldGroup;
        }
        fateOut[1] = rowCloseField[r];
        fateOut[2] = CLOSE_SURVIVOR;
      }
      return;
    }
  }
  fateOut[3] = 0;
  fateOut[4] = 0;
  fateOut[5] = 0;
  fateOut[6] = 0;
  if (m2 < point.disruption.dissolutionBelowMsun) {
    fateOut[0] = DISSOLVED;
    fateOut[1] = NO_FIELD;
    fateOut[2] = -1;
    return;
  }
  fateOut[0] = DISRUPTED;
  fateOut[2] = DISRUPTION;
  if (!prepared.channels.disruption) {
    fateOut[1] = NO_FIELD;
    return;
  }
  if (rowDisruptionGroup[r] !== point.disruptionFieldGroup) {
    fillFieldDeviate();
    rowDisruptionField[r] = disruptionLog10FieldMG(point, logs, coreMass, coreRadius, r, systemNow[FIELD_DEVIATE]);
    rowDisruptionGroup[r] = point.disruptionFieldGroup;
  }
  fateOut[1] = rowDisruptionField[r];
}

/**
 * log10 of the field (MG) of a white dwarf whose companion r was shredded near the
 * core, per option of DISRUPTION_FIELD_CHOICE: the log-normal of field-lognormal.ts around each
 * option's median, added in log10 form (no power, no exponential).
 */
const disruptionLog10FieldOf = byOption<DisruptionFieldOptions, 'kind', number, [PointLogs, PreparedPoint, number, number, number, number]>('kind', {
  lognormal: (f, logs, _point, _coreMass, _coreRadius, _r, z) => lognormalLog10FieldMG(logs.disruptionMedian, f.widthDex, z),
  companionScaled: (f, logs, _point, _coreMass, _coreRadius, r, z) => {
    fillLog10Mass(r);
    return lognormalLog10FieldMG(logs.disruptionMedian + f.slope * rowLog10Mass[r], f.widthDex, z);
  },
  accretion: (f, _logs, point, coreMass, coreRadius, r, z) => {
    // The debris disc forms at the companion's tidal radius around the core (η sets it).
    fillRadius(r);
    const m2 = rowMass[r];
    const tidalRadius = tidalRadiusRsun(point.disruption.eta, rowCompanionRadius[r], coreMass, m2);
    return lognormalLog10FieldMG(Math.log10(accretionFieldMG(coreMass, coreRadius, f.discMassFraction * m2, tidalRadius, f.alpha, f.aspectRatio)), f.widthDex, z);
  },
});

function disruptionLog10FieldMG(point: PreparedPoint, logs: PointLogs, coreMass: number, coreRadius: number, r: number, z: number): number {
  return disruptionLog10FieldOf(point.field.disruption, logs, point, coreMass, coreRadius, r, z);
}

/** log10 of the disruption field's median (lognormal) or its zero point at 1 Msun (companionScaled); accretion has neither. */
const disruptionLog10MedianOf = byOption<DisruptionFieldOptions, 'kind', number>('kind', {
  lognormal: (f) => Math.log10(f.medianMG),
  companionScaled: (f) => companionScaledLog10ZeroPoint(f.referenceMG, f.referenceMassMJup, f.slope),
  accretion: () => NaN,
});

/** Writes a surviving companion's fate without a field (the caller writes its separation, fateOut[3]). */
function survivor(fate: number): void {
  fateOut[0] = fate;
  fateOut[1] = NO_FIELD;
  fateOut[2] = -1;
  fateOut[4] = 0;
  fateOut[5] = 0;
  fateOut[6] = 0;
}
