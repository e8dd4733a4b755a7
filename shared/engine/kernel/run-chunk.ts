import { RSUN_PER_AU } from '../constants.ts';
import { normalQuantile } from '../numerics/normal-quantile.ts';
import { postCommonEnvelopeSeparationAU } from '../physics/common-envelope-webbink1984.ts';
import { companionRadiusRsun } from '../physics/companion-radius.ts';
import { flatSample, truncatedLognormalPeriodDays } from '../physics/companion-distribution.ts';
import { criticalSeparationAU, envelopeAtRadius } from '../physics/engulfment-grid.ts';
import { accretionFieldMG } from '../physics/field-accretion.ts';
import { lognormalFieldMG } from '../physics/field-lognormal.ts';
import { fossilFieldMG } from '../physics/fossil-field.ts';
import { finalMassMsun } from '../physics/ifmr-piecewise.ts';
import { powerLawQuantile } from '../physics/imf-power-law.ts';
import { sampleImfMsun } from '../physics/imf-sampler.ts';
import { semiMajorAxisAU } from '../physics/kepler.ts';
import { mainSequenceRadiusRsun } from '../physics/main-sequence-radius-demircan1991.ts';
import { widenedSeparationAU } from '../physics/orbit-mass-loss.ts';
import { rocheLobeFraction } from '../physics/roche-lobe-eggleton1983.ts';
import { magnitudeLimitedAcceptance } from '../physics/selection-magnitude-limited.ts';
import { tidalRadiusRsun } from '../physics/tidal-disruption.ts';
import { whiteDwarfRadiusRsun } from '../physics/white-dwarf-radius-nauenberg1972.ts';
import { chunkUniform } from '../random.ts';
import { CHUNK_SYSTEMS } from '../version.ts';
import { BINS, binIndex } from './bins.ts';
import type { PreparedScenario } from './prepare.ts';
import { lifetimeGyr } from './scenario-physics.ts';
import { emptyTallyFor, type ChunkTally } from './tally.ts';

// Fate codes (index into FATES) and the two "no fate" markers.
const WIDE = 0;
const POST_CE = 1;
const DISRUPTED = 2;
const MERGED = 3;
// Channel codes (index into CHANNELS); -1 = no field.
const DISRUPTION = 0;
const CORE_MERGER = 1;
const FOSSIL = 2;
// Setting codes (index into SETTINGS).
const SINGLE = 0;
const WIDE_SETTING = 1;
const POST_CE_SETTING = 2;

/** Half the spacing of the generator's 2^-32 grid: u + this lies strictly inside (0, 1). */
const HALF_STEP = 2 ** -33;

/**
 * Scratch written by companionFate (one companion at a time), allocated once per module:
 * the kernel never allocates per system. Index: 0 fate, 1 field (MG, 0 = none), 2 channel,
 * 3 final separation (AU, survivors).
 */
const fateOut = new Float64Array(4);
const envelopeOut = new Float64Array(3);
/** Per-system cache (a typed array, so storing a double does not box it): 0 the white dwarf's radius. */
const scratch = new Float64Array(1);

/**
 * Runs chunk `chunkIndex` of the prepared scenario: draws its systems from the generator
 * seeded with (seed, chunkIndex) and returns integer counts. The uniforms drawn per system are,
 * in order: primary mass; birth time (constant star formation only); and, for white dwarfs only:
 * the selection uniform (magnitude-limited only); the field deviate; two fossil uniforms (fossil
 * channel enabled only); and per companion row a presence uniform u followed, iff
 * u < occurrence · m_max, by the companion's mass and period. None of these depends on the
 * multiplier, α_CE, λ, η, the field threshold or the reach, so sweeps over those share random
 * numbers.
 */
export function runChunk(prepared: PreparedScenario, chunkIndex: number): ChunkTally {
  const tally = emptyTallyFor(prepared.scenarioHash);
  const first = chunkIndex * CHUNK_SYSTEMS;
  const n = Math.min(CHUNK_SYSTEMS, prepared.systems - first);
  if (!(Number.isInteger(chunkIndex) && chunkIndex >= 0 && n > 0)) {
    throw new RangeError(`chunkIndex = ${chunkIndex} is outside the allowed range [0, ${prepared.chunkCount - 1}]`);
  }
  const rng = chunkUniform(prepared.seed, chunkIndex);
  const { imf, lifetime, ifmr, rows, field, selection, fossil } = prepared;
  const constantHistory = prepared.constantHistory;
  const ageGyr = prepared.ageGyr;
  const threshold = field.thresholdMG;
  const rowCount = rows.length;
  const multiplierScale = BINS.multiplierBins / prepared.multiplierMax;
  const magnitudeLimited = selection.kind === 'magnitudeLimited';
  const massBins = BINS.log10CompanionMsun.count;
  const periodBins = BINS.log10PeriodDays.count;
  const separationBins = BINS.log10SeparationAU.count;

  let whiteDwarfsFormed = 0;
  let whiteDwarfs = 0;
  let magnetic = 0;
  let multiplierFossil = 0;
  const byChannel = tally.byChannel;
  const settingWhiteDwarfs = tally.settingWhiteDwarfs;
  const settingMagnetic = tally.settingMagnetic;
  const channelBySetting = tally.channelBySetting;
  const companionFates = tally.companionFates;
  const wdMassMagnetic = tally.wdMassMagnetic;
  const wdMassNonMagnetic = tally.wdMassNonMagnetic;
  const logField = tally.logField;
  const fateMap = tally.fateMap;
  const survivorSeparation = tally.survivorSeparation;
  const multiplierBins = tally.multiplierBins;

  for (let s = 0; s < n; s++) {
    const m1 = sampleImfMsun(imf, rng());
    const age = constantHistory ? ageGyr * rng() : ageGyr;
    const tms = lifetimeGyr(lifetime, m1);
    if (!(tms < age)) continue;
    whiteDwarfsFormed++;
    const mwd = finalMassMsun(ifmr, m1);
    if (magnitudeLimited) {
      const accept = magnitudeLimitedAcceptance(mwd, age - tms, selection.floorGyr, selection.referenceMassMsun, selection.referenceCoolingAgeGyr);
      if (!(rng() < accept)) continue;
    }
    whiteDwarfs++;
    const z = normalQuantile(rng() + HALF_STEP);
    // The white dwarf's radius is needed only for a fossil field or a common envelope: computed lazily.
    scratch[0] = 0;

    let bestField = 0;
    let bestChannel = -1;
    let smallestMultiplier = Infinity;
    if (fossil.enabled) {
      const carries = rng() < fossil.fraction;
      const zf = normalQuantile(rng() + HALF_STEP);
      if (carries && m1 >= fossil.loMsun && m1 <= fossil.hiMsun) {
        bestField = fossilFieldMG(lognormalFieldMG(fossil.medianKG, fossil.widthDex, zf), mainSequenceRadiusRsun(m1), whiteDwarfRadiusOf(mwd));
        bestChannel = FOSSIL;
        if (bestField >= threshold) smallestMultiplier = 0;
      }
    }

    let setting = SINGLE;
    for (let r = 0; r < rowCount; r++) {
      const row = rows[r];
      const u = rng();
      if (!(u < row.drawThreshold)) continue;
      const uMass = rng();
      const uPeriod = rng();
      let m2 = row.massQuantile ? powerLawQuantile(row.massQuantile, uMass) : flatSample(row.massLo, row.massHi, uMass);
      if (row.massIsRatio) m2 *= m1;
      const periodDays = row.periodQuantile
        ? powerLawQuantile(row.periodQuantile, uPeriod)
        : truncatedLognormalPeriodDays(row.meanLog10PeriodDays, row.sigmaLog10Period, row.cdfLo, row.cdfSpan, uPeriod, normalQuantile);
      companionFate(prepared, m1, mwd, m2, periodDays, z);
      const fate = fateOut[0];
      const present = u < row.presentThreshold;
      const companionField = fateOut[1];
      if (companionField >= threshold) {
        const m = u / row.occurrence;
        if (m < smallestMultiplier) smallestMultiplier = m;
      }
      if (!present) continue;
      companionFates[fate]++;
      fateMap[(fate * massBins + binIndex(BINS.log10CompanionMsun, Math.log10(m2))) * periodBins + binIndex(BINS.log10PeriodDays, Math.log10(periodDays))]++;
      if (fate === WIDE || fate === POST_CE) {
        if (fate === POST_CE) setting = POST_CE_SETTING;
        else if (setting === SINGLE) setting = WIDE_SETTING;
        survivorSeparation[fate * separationBins + binIndex(BINS.log10SeparationAU, Math.log10(fateOut[3]))]++;
      } else if (companionField > bestField) {
        bestField = companionField;
        bestChannel = fateOut[2];
      }
    }

    settingWhiteDwarfs[setting]++;
    const massBin = binIndex(BINS.wdMassMsun, mwd);
    if (bestField > 0) logField[binIndex(BINS.log10FieldMG, Math.log10(bestField))]++;
    if (bestField >= threshold) {
      magnetic++;
      byChannel[bestChannel]++;
      settingMagnetic[setting]++;
      channelBySetting[bestChannel * 3 + setting]++;
      wdMassMagnetic[massBin]++;
    } else {
      wdMassNonMagnetic[massBin]++;
    }
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
  tally.multiplierFossil = multiplierFossil;
  return tally;
}

/**
 * Decides one companion's fate and writes [fate, field MG, channel, final separation AU] into
 * fateOut. Order: engulfed? → if not, a wide survivor on an orbit widened by the mass loss;
 * if so, a common envelope: survivor if the post-CE orbit keeps the companion inside its
 * Roche lobe and outside the core, else destroyed — disrupted if its tidal radius lies outside
 * the core, merged with the core otherwise. The field is that of the destroying channel, 0 if
 * that channel is switched off.
 */
function companionFate(prepared: PreparedScenario, m1: number, mwd: number, m2: number, periodDays: number, z: number): void {
  const a0 = semiMajorAxisAU(periodDays, m1 + m2);
  const giant = prepared.giant;
  let giantMass: number;
  let coreMass: number;
  let radiusAU: number;
  let coreRadius: number;
  if (giant.kind === 'fixedReach') {
    if (!(a0 < giant.reachAU)) return survivor(WIDE, widenedSeparationAU(a0, m1 + m2, mwd + m2));
    // fixedReach: the envelope engulfs the companion at R = a0, with the final core and the full envelope.
    giantMass = m1;
    coreMass = mwd;
    radiusAU = a0;
    coreRadius = whiteDwarfRadiusOf(mwd);
  } else {
    if (!(a0 < criticalSeparationAU(giant.grid, m1, m2))) return survivor(WIDE, widenedSeparationAU(a0, m1 + m2, mwd + m2));
    envelopeAtRadius(giant.grid, m1, a0, envelopeOut);
    coreMass = envelopeOut[0];
    giantMass = envelopeOut[1];
    radiusAU = envelopeOut[2];
    coreRadius = whiteDwarfRadiusRsun(coreMass);
  }
  const finalAU = postCommonEnvelopeSeparationAU(radiusAU, radiusAU, giantMass, coreMass, m2, prepared.alphaCE, prepared.lambda);
  const finalRsun = finalAU * RSUN_PER_AU;
  const r2 = companionRadiusRsun(m2);
  if (finalRsun > coreRadius && r2 < rocheLobeFraction(m2 / coreMass) * finalRsun) return survivor(POST_CE, finalAU);
  const tidalRadius = tidalRadiusRsun(prepared.eta, r2, coreMass, m2);
  fateOut[3] = 0;
  if (tidalRadius > coreRadius) {
    fateOut[0] = DISRUPTED;
    fateOut[2] = DISRUPTION;
    const f = prepared.field.disruption;
    if (!prepared.disruptionMakesField) fateOut[1] = 0;
    else if (f.kind === 'lognormal') fateOut[1] = lognormalFieldMG(f.medianMG, f.widthDex, z);
    else fateOut[1] = lognormalFieldMG(accretionFieldMG(coreMass, coreRadius, f.discMassFraction * m2, tidalRadius, f.alpha, f.aspectRatio), f.widthDex, z);
  } else {
    fateOut[0] = MERGED;
    fateOut[2] = CORE_MERGER;
    const f = prepared.field.coreMerger;
    fateOut[1] = prepared.coreMergerMakesField ? lognormalFieldMG(f.medianMG, f.widthDex, z) : 0;
  }
}

/** Radius of the current system's white dwarf (Rsun) in scratch[0], computed at most once per system. */
function whiteDwarfRadiusOf(mwd: number): number {
  if (scratch[0] === 0) scratch[0] = whiteDwarfRadiusRsun(mwd);
  return scratch[0];
}

function survivor(fate: number, separationAU: number): void {
  fateOut[0] = fate;
  fateOut[1] = 0;
  fateOut[2] = -1;
  fateOut[3] = separationAU;
}
