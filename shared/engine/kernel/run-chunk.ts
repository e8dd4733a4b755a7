import { RSUN_PER_AU } from '../constants.ts';
import { normalQuantile } from '../numerics/normal-quantile.ts';
import { postCommonEnvelopeSeparationAU } from '../physics/common-envelope-webbink1984.ts';
import { companionRadiusRsun } from '../physics/companion-radius.ts';
import { commonEnvelopeOnset } from '../physics/engulfment-grid.ts';
import { accretionFieldMG } from '../physics/field-accretion.ts';
import { companionScaledMedianMG } from '../physics/field-companion-scaled.ts';
import { lognormalFieldMG } from '../physics/field-lognormal.ts';
import { fossilFieldMG } from '../physics/fossil-field.ts';
import { finalMassMsun } from '../physics/ifmr-piecewise.ts';
import { sampleImfLog10Msun } from '../physics/imf-sampler.ts';
import { periodDays as keplerPeriodDays, semiMajorAxisAU } from '../physics/kepler.ts';
import { mainSequenceRadiusRsun } from '../physics/main-sequence-radius-demircan1991.ts';
import { widenedSeparationAU } from '../physics/orbit-mass-loss.ts';
import { rgbTipCoreMassMsun } from '../physics/rgb-tip-core-mass.ts';
import { rocheLobeFraction } from '../physics/roche-lobe-eggleton1983.ts';
import { magnitudeLimitedAcceptance } from '../physics/selection-magnitude-limited.ts';
import { tidalRadiusRsun } from '../physics/tidal-disruption.ts';
import { whiteDwarfRadiusRsun } from '../physics/white-dwarf-radius-nauenberg1972.ts';
import { chunkUniform } from '../random.ts';
import { CHUNK_SYSTEMS } from '../version.ts';
import { BINS, binIndex } from './bins.ts';
import { companionMassDraw, companionPeriodDaysDraw } from './companion-draws.ts';
import { surelyNotWhiteDwarf } from './formation-screen.ts';
import type { PreparedScenario } from './prepare.ts';
import { lifetimeAtLog10MassGyr } from './scenario-physics.ts';
import { emptyTallyFor, type ChunkTally } from './tally.ts';

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

/**
 * Scratch written by companionFate (one companion at a time), allocated once per module:
 * the kernel never allocates per system. Index: 0 fate, 1 field (MG, 0 = none), 2 channel,
 * 3 final separation (AU, survivors), 4 white-dwarf mass if this companion ends the giant's
 * evolution (post-CE survivor; else 0), 5 final period (days, post-CE survivors), 6 helium core (1/0).
 */
const fateOut = new Float64Array(7);
const onsetOut = new Float64Array(4);
/** Per-row record of the current system's companions: fate, present (1/0), log10 M2, log10 P0, separation AU, final period d. */
const rowFate = new Float64Array(MAX_ROWS);
const rowPresent = new Uint8Array(MAX_ROWS);
const rowLogMass = new Float64Array(MAX_ROWS);
const rowLogPeriod = new Float64Array(MAX_ROWS);
const rowSeparation = new Float64Array(MAX_ROWS);

/**
 * Runs chunk `chunkIndex` of the prepared scenario: draws its systems from the generator
 * seeded with (seed, chunkIndex) and returns integer counts. The uniforms drawn per system are,
 * in order: primary mass; birth time (constant star formation only); and, for white dwarfs only:
 * the selection uniform (magnitude-limited only); the field deviate; two fossil uniforms (fossil
 * channel enabled only); and per companion row a presence uniform u followed, iff
 * u < min(1, occurrence · (M1)^hostMassSlope · m_max), by the companion's mass and period. None of
 * these depends on the multiplier, α_CE, λ, η, the field options or threshold or the reach, so
 * sweeps over those share random numbers.
 *
 * Engine 2: each companion's fate is decided alone; the white dwarf's mass is the IFMR's unless
 * a post-common-envelope survivor ended the giant's evolution early (then the smallest onset core
 * of those); the fossil field and the magnitude-limited selection use that final mass. A field
 * made by a companion counts only from the cooling age field.emergenceDelayGyr on.
 */
export function runChunk(prepared: PreparedScenario, chunkIndex: number): ChunkTally {
  const tally = emptyTallyFor(prepared.scenarioHash);
  const first = chunkIndex * CHUNK_SYSTEMS;
  const n = Math.min(CHUNK_SYSTEMS, prepared.systems - first);
  if (!(Number.isInteger(chunkIndex) && chunkIndex >= 0 && n > 0)) {
    throw new RangeError(`chunkIndex = ${chunkIndex} is outside the allowed range [0, ${prepared.chunkCount - 1}]`);
  }
  const rng = chunkUniform(prepared.seed, chunkIndex);
  const { imf, lifetime, ifmr, rows, field, selection, fossil, formationScreen } = prepared;
  const constantHistory = prepared.constantHistory;
  const ageGyr = prepared.ageGyr;
  const threshold = field.thresholdMG;
  const emergenceDelayGyr = field.emergenceDelayGyr;
  const rowCount = rows.length;
  const multiplierScale = BINS.multiplierBins / prepared.multiplierMax;
  const magnitudeLimited = selection.kind === 'magnitudeLimited';
  const massBins = BINS.log10CompanionMsun.count;
  const periodBins = BINS.log10PeriodDays.count;
  const separationBins = BINS.log10SeparationAU.count;
  const wdMassBins = BINS.wdMassMsun.count;
  const fieldBins = BINS.log10FieldMG.count;
  const coolingBins = BINS.log10CoolingAgeGyr.count;
  const postCEPeriodBins = BINS.log10PostCEPeriodDays.count;

  let whiteDwarfsFormed = 0;
  let whiteDwarfs = 0;
  let magnetic = 0;
  let heliumWhiteDwarfs = 0;
  let multiplierFossil = 0;
  const byChannel = tally.byChannel;
  const settingWhiteDwarfs = tally.settingWhiteDwarfs;
  const settingMagnetic = tally.settingMagnetic;
  const channelBySetting = tally.channelBySetting;
  const companionFates = tally.companionFates;
  const wdMassMagnetic = tally.wdMassMagnetic;
  const wdMassNonMagnetic = tally.wdMassNonMagnetic;
  const wdMassBySetting = tally.wdMassBySetting;
  const logField = tally.logField;
  const logFieldByChannel = tally.logFieldByChannel;
  const coolingAge = tally.coolingAge;
  const postCEPeriod = tally.postCEPeriod;
  const fateMap = tally.fateMap;
  const survivorSeparation = tally.survivorSeparation;
  const multiplierBins = tally.multiplierBins;

  for (let s = 0; s < n; s++) {
    const uPrimary = rng();
    const age = constantHistory ? ageGyr * rng() : ageGyr;
    if (surelyNotWhiteDwarf(formationScreen, uPrimary, age)) continue; // exact: t_MS ≥ its cell's floor ≥ age
    const log10M1 = sampleImfLog10Msun(imf, uPrimary);
    const m1 = Math.exp(log10M1 * Math.LN10);
    const tms = lifetimeAtLog10MassGyr(lifetime, log10M1);
    if (!(tms < age)) continue;
    whiteDwarfsFormed++;
    const ifmrMass = finalMassMsun(ifmr, m1);
    const cooling = age - tms;
    const uSelect = magnitudeLimited ? rng() : 0;
    // The field deviate's uniform; its normal quantile is taken only where a field is made.
    const uField = rng() + HALF_STEP;
    const fieldsEmerged = cooling >= emergenceDelayGyr;

    let fossilCarries = false;
    let uFossil = 0.5;
    if (fossil.enabled) {
      fossilCarries = rng() < fossil.fraction && m1 >= fossil.loMsun && m1 <= fossil.hiMsun;
      uFossil = rng() + HALF_STEP;
    }

    let mwd = ifmrMass;
    let helium = false;
    let setting = SINGLE;
    let bestField = 0;
    let bestChannel = -1;
    let smallestMultiplier = Infinity;
    let closestPostCEPeriod = Infinity;
    for (let r = 0; r < rowCount; r++) {
      const row = rows[r];
      const u = rng();
      rowPresent[r] = 0;
      // Host-mass scaling of the occurrence, capped at 1 per star (a pow only when the row asks).
      const occurrence = row.hostMassSlope === 0 ? row.occurrence : row.occurrence * Math.pow(m1, row.hostMassSlope);
      const drawThreshold = row.hostMassSlope === 0 ? row.drawThreshold : Math.min(1, occurrence * prepared.multiplierMax);
      if (!(u < drawThreshold)) continue;
      const uMass = rng();
      const uPeriod = rng();
      let m2 = companionMassDraw(row, uMass);
      if (row.massIsRatio) m2 *= m1;
      const periodDays = companionPeriodDaysDraw(row, uPeriod);
      companionFate(prepared, m1, ifmrMass, m2, periodDays, uField);
      const fate = fateOut[0];
      const present = u < (row.hostMassSlope === 0 ? row.presentThreshold : Math.min(drawThreshold, occurrence * prepared.multiplier));
      const companionField = fieldsEmerged ? fateOut[1] : 0;
      if (companionField >= threshold) {
        const m = u / occurrence;
        if (m < smallestMultiplier) smallestMultiplier = m;
      }
      if (!present) continue;
      rowPresent[r] = 1;
      rowFate[r] = fate;
      rowLogMass[r] = Math.log10(m2);
      rowLogPeriod[r] = Math.log10(periodDays);
      rowSeparation[r] = fateOut[3];
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

    if (fossilCarries) {
      const fossilField = fossilFieldMG(lognormalFieldMG(fossil.medianKG, fossil.widthDex, normalQuantile(uFossil)), mainSequenceRadiusRsun(m1), whiteDwarfRadiusRsun(mwd));
      if (fossilField >= threshold) smallestMultiplier = 0;
      if (fossilField > bestField) {
        bestField = fossilField;
        bestChannel = FOSSIL;
      }
    }

    if (magnitudeLimited) {
      const accept = magnitudeLimitedAcceptance(mwd, cooling, selection.floorGyr, selection.wavelengthNm, selection.referenceFlux);
      if (!(uSelect < accept)) continue;
    }
    whiteDwarfs++;
    if (helium) heliumWhiteDwarfs++;
    for (let r = 0; r < rowCount; r++) {
      if (rowPresent[r] === 0) continue;
      const fate = rowFate[r];
      companionFates[fate]++;
      fateMap[(fate * massBins + binIndex(BINS.log10CompanionMsun, rowLogMass[r])) * periodBins + binIndex(BINS.log10PeriodDays, rowLogPeriod[r])]++;
      if (fate === WIDE || fate === POST_CE) survivorSeparation[fate * separationBins + binIndex(BINS.log10SeparationAU, Math.log10(rowSeparation[r]))]++;
    }

    settingWhiteDwarfs[setting]++;
    const massBin = binIndex(BINS.wdMassMsun, mwd);
    const coolingBin = binIndex(BINS.log10CoolingAgeGyr, Math.log10(cooling));
    if (bestField > 0) {
      const fieldBin = binIndex(BINS.log10FieldMG, Math.log10(bestField));
      logField[fieldBin]++;
      logFieldByChannel[bestChannel * fieldBins + fieldBin]++;
    }
    const isMagnetic = bestField >= threshold;
    const split = isMagnetic ? 0 : 1;
    if (isMagnetic) {
      magnetic++;
      byChannel[bestChannel]++;
      settingMagnetic[setting]++;
      channelBySetting[bestChannel * 3 + setting]++;
      wdMassMagnetic[massBin]++;
    } else {
      wdMassNonMagnetic[massBin]++;
    }
    wdMassBySetting[(setting * 2 + split) * wdMassBins + massBin]++;
    coolingAge[split * coolingBins + coolingBin]++;
    if (setting === POST_CE_SETTING) postCEPeriod[split * postCEPeriodBins + binIndex(BINS.log10PostCEPeriodDays, Math.log10(closestPostCEPeriod))]++;
    if (smallestMultiplier === 0) multiplierFossil++;
    else if (smallestMultiplier < Infinity) {
      const bin = Math.floor(smallestMultiplier * multiplierScale);
      multiplierBins[bin < BINS.multiplierBins ? bin : BINS.multiplierBins - 1]++;
    }
  }

  tally.chunks = 1;
  tally.systems = n;
  tally.whiteDwarfsFormed = whiteDwarfsFormed;
  tally.whiteDwarfs = whiteDwarfs;
  tally.magnetic = magnetic;
  tally.heliumWhiteDwarfs = heliumWhiteDwarfs;
  tally.multiplierFossil = multiplierFossil;
  return tally;
}

/**
 * Decides one companion's fate and writes fateOut (see above). Order: no common envelope → a
 * wide survivor on an orbit widened by the mass loss; else the Webbink budget with the giant's
 * state at the onset: a survivor if the post-CE orbit keeps the companion inside its Roche lobe
 * and outside the core (white-dwarf mass = core at onset for `track`, helium if the onset was on
 * the red giant branch; the IFMR mass for `fixedReach`), else destroyed in the envelope: dissolved
 * if lighter than the dissolution mass, otherwise shredded near the core (channel disruption).
 * A close survivor (final period below field.closeSurvivor.maxPeriodDays) gets a field iff that
 * channel is on.
 */
function companionFate(prepared: PreparedScenario, m1: number, ifmrMass: number, m2: number, periodDays: number, uField: number): void {
  const a0 = semiMajorAxisAU(periodDays, m1 + m2);
  const giant = prepared.giant;
  let giantMass: number;
  let coreMass: number;
  let radiusAU: number;
  let onsetAU: number;
  let helium = false;
  if (giant.kind === 'fixedReach') {
    if (!(a0 < giant.reachAU)) return survivor(WIDE, widenedSeparationAU(a0, m1 + m2, ifmrMass + m2));
    // fixedReach: the envelope engulfs the companion at R = a0, with the final core and the full envelope.
    giantMass = m1;
    coreMass = ifmrMass;
    radiusAU = a0;
    onsetAU = a0;
  } else {
    if (!commonEnvelopeOnset(giant.grid, m1, m2, a0, onsetOut)) return survivor(WIDE, widenedSeparationAU(a0, m1 + m2, ifmrMass + m2));
    coreMass = onsetOut[0];
    giantMass = onsetOut[1];
    radiusAU = onsetOut[2];
    onsetAU = onsetOut[3];
    const tip = rgbTipCoreMassMsun(m1);
    helium = tip !== null && coreMass < tip + HELIUM_CORE_MARGIN_MSUN;
  }
  const coreRadius = whiteDwarfRadiusRsun(coreMass);
  const finalAU = postCommonEnvelopeSeparationAU(onsetAU, radiusAU, giantMass, coreMass, m2, prepared.alphaCE, prepared.lambda);
  const finalRsun = finalAU * RSUN_PER_AU;
  const r2 = companionRadiusRsun(m2);
  if (finalRsun > coreRadius && r2 < rocheLobeFraction(m2 / coreMass) * finalRsun) {
    const finalPeriod = keplerPeriodDays(finalAU, coreMass + m2);
    survivor(POST_CE, finalAU);
    fateOut[4] = coreMass;
    fateOut[5] = finalPeriod;
    fateOut[6] = helium ? 1 : 0;
    const close = prepared.field.closeSurvivor;
    if (prepared.closeSurvivorMakesField && finalPeriod < close.maxPeriodDays) {
      fateOut[1] = lognormalFieldMG(close.medianMG, close.widthDex, normalQuantile(uField));
      fateOut[2] = CLOSE_SURVIVOR;
    }
    return;
  }
  fateOut[3] = 0;
  fateOut[4] = 0;
  fateOut[5] = 0;
  fateOut[6] = 0;
  if (m2 < prepared.dissolutionBelowMsun) {
    fateOut[0] = DISSOLVED;
    fateOut[1] = 0;
    fateOut[2] = -1;
    return;
  }
  fateOut[0] = DISRUPTED;
  fateOut[2] = DISRUPTION;
  const f = prepared.field.disruption;
  if (!prepared.disruptionMakesField) fateOut[1] = 0;
  else if (f.kind === 'lognormal') fateOut[1] = lognormalFieldMG(f.medianMG, f.widthDex, normalQuantile(uField));
  else if (f.kind === 'companionScaled') fateOut[1] = lognormalFieldMG(companionScaledMedianMG(m2, f.referenceMG, f.referenceMassMJup, f.slope), f.widthDex, normalQuantile(uField));
  else {
    // The debris disc forms at the companion's tidal radius around the core (η sets it).
    const tidalRadius = tidalRadiusRsun(prepared.eta, r2, coreMass, m2);
    fateOut[1] = lognormalFieldMG(accretionFieldMG(coreMass, coreRadius, f.discMassFraction * m2, tidalRadius, f.alpha, f.aspectRatio), f.widthDex, normalQuantile(uField));
  }
}

function survivor(fate: number, separationAU: number): void {
  fateOut[0] = fate;
  fateOut[1] = 0;
  fateOut[2] = -1;
  fateOut[3] = separationAU;
  fateOut[4] = 0;
  fateOut[5] = 0;
  fateOut[6] = 0;
}

