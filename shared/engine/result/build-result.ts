import type { ResultFraction, ScenarioResult } from '../../contracts/result.ts';
import type { Scenario } from '../../contracts/scenario.ts';
import { BINS, FATES, SETTINGS, binEdges } from '../kernel/bins.ts';
import { planChunks } from '../kernel/chunks.ts';
import type { PreparedScenario } from '../kernel/prepare.ts';
import { multiplierMaxFor, resolvedRows } from '../kernel/scenario-physics.ts';
import { scenarioHash } from '../kernel/scenario-hash.ts';
import type { ChunkTally } from '../kernel/tally.ts';
import { compareWithObserved } from '../stats/compare-observed.ts';
import { impliedMultiplier } from '../stats/implied-occurrence.ts';
import { monteCarloStandardError } from '../stats/mc-error.ts';
import { ENGINE_VERSION } from '../version.ts';
import { assumptionsFor } from './assumptions.ts';
import { methodsUsed } from './methods.ts';

/**
 * The result document from a scenario and the sum of its chunk tallies (any subset of chunks:
 * `complete` says whether all were summed). `meta.prepared` avoids recomputing the hash;
 * `meta.compareObserved: false` leaves out the comparison with the scenario's own observed counts
 * and the implied occurrence (an exact test inversion, most of the cost of a result: a fit scores
 * its 10^4 nodes against its constraint set and never reads them).
 */
export function buildResult(scenario: Scenario, tally: ChunkTally, meta: { prepared?: PreparedScenario; compareObserved?: boolean } = {}): ScenarioResult {
  const hash = meta.prepared?.scenarioHash ?? scenarioHash(scenario);
  if (tally.scenarioHash !== hash) throw new Error(`tally belongs to scenario ${tally.scenarioHash}, not ${hash}`);
  if (tally.engineVersion !== ENGINE_VERSION) throw new Error(`tally was made by engine ${tally.engineVersion}, this is ${ENGINE_VERSION}`);
  const chunkCount = planChunks(scenario.systems).chunkCount;
  const n = tally.whiteDwarfs;
  const fraction = fractionOf(tally.magnetic, n);
  const perSetting = <T>(make: (i: number) => T) => ({ single: make(0), wide: make(1), postCE: make(2) });
  const perChannel = <T>(make: (i: number) => T) => ({ disruption: make(0), closeSurvivor: make(1), fossil: make(2) });
  const wdBins = BINS.wdMassMsun.count;
  const massSplit = (setting: number) => ({
    magnetic: tally.wdMassBySetting.slice((setting * 2) * wdBins, (setting * 2 + 1) * wdBins),
    nonMagnetic: tally.wdMassBySetting.slice((setting * 2 + 1) * wdBins, (setting * 2 + 2) * wdBins),
  });
  const halves = (values: number[]) => ({ magnetic: values.slice(0, values.length / 2), nonMagnetic: values.slice(values.length / 2) });
  const fieldBins = BINS.log10FieldMG.count;

  const massBins = BINS.log10CompanionMsun.count;
  const periodBins = BINS.log10PeriodDays.count;
  const fateCounts = FATES.map((_, f) =>
    Array.from({ length: massBins }, (_, i) => tally.fateMap.slice((f * massBins + i) * periodBins, (f * massBins + i + 1) * periodBins)),
  );
  const sepBins = BINS.log10SeparationAU.count;

  const multiplierMax = multiplierMaxFor(resolvedRows(scenario));
  const multiplierEdges = Array.from({ length: BINS.multiplierBins + 1 }, (_, j) => (j * multiplierMax) / BINS.multiplierBins);
  const magneticAt = [tally.multiplierFossil];
  for (let j = 0; j < BINS.multiplierBins; j++) magneticAt.push(magneticAt[j] + tally.multiplierBins[j]);

  const result: ScenarioResult = {
    engineVersion: ENGINE_VERSION,
    scenarioHash: hash,
    seed: scenario.seed,
    systems: scenario.systems,
    chunkCount,
    chunksCompleted: tally.chunks,
    complete: tally.chunks === chunkCount && tally.systems === scenario.systems,
    counts: {
      primaries: tally.systems,
      whiteDwarfsFormed: tally.whiteDwarfsFormed,
      whiteDwarfs: n,
      magnetic: tally.magnetic,
      byChannel: perChannel((c) => tally.byChannel[c]),
      bySetting: perSetting((s) => ({ whiteDwarfs: tally.settingWhiteDwarfs[s], magnetic: tally.settingMagnetic[s] })),
      channelBySetting: perChannel((c) => perSetting((s) => tally.channelBySetting[c * SETTINGS.length + s])),
      companionFates: { wide: tally.companionFates[0], postCE: tally.companionFates[1], disrupted: tally.companionFates[2], dissolved: tally.companionFates[3] },
      heliumWhiteDwarfs: tally.heliumWhiteDwarfs,
    },
    fraction,
    fractionBySetting: perSetting((s) => fractionOf(tally.settingMagnetic[s], tally.settingWhiteDwarfs[s])),
    fractionByChannel: perChannel((c) => fractionOf(tally.byChannel[c], n)),
    bins: {
      wdMass: { edgesMsun: binEdges(BINS.wdMassMsun), magnetic: tally.wdMassMagnetic.slice(), nonMagnetic: tally.wdMassNonMagnetic.slice() },
      wdMassBySetting: { edgesMsun: binEdges(BINS.wdMassMsun), ...perSetting(massSplit) },
      coolingAge: { edgesLog10Gyr: binEdges(BINS.log10CoolingAgeGyr), ...halves(tally.coolingAge) },
      postCommonEnvelopePeriod: { edgesLog10Days: binEdges(BINS.log10PostCEPeriodDays), ...halves(tally.postCEPeriod) },
      logField: {
        edgesLog10MG: binEdges(BINS.log10FieldMG),
        counts: tally.logField.slice(),
        thresholdMG: scenario.field.thresholdMG,
        byChannel: perChannel((c) => tally.logFieldByChannel.slice(c * fieldBins, (c + 1) * fieldBins)),
      },
      fateMap: {
        log10MassEdgesMsun: binEdges(BINS.log10CompanionMsun),
        log10PeriodEdgesDays: binEdges(BINS.log10PeriodDays),
        fates: [...FATES],
        counts: fateCounts,
      },
      survivorSeparation: {
        edgesLog10AU: binEdges(BINS.log10SeparationAU),
        wide: tally.survivorSeparation.slice(0, sepBins),
        postCE: tally.survivorSeparation.slice(sepBins, 2 * sepBins),
      },
    },
    multiplierResponse: {
      whiteDwarfs: n,
      multiplierEdges,
      magneticAt,
      runMultiplier: scenario.companions.multiplier,
      method:
        'exact response from one run with common random numbers: a companion is present iff its presence uniform is below occurrence × multiplier, so each white dwarf\'s smallest magnetizing multiplier is tallied; magneticAt is exact at the edges',
    },
    assumptions: assumptionsFor(scenario),
    methods: methodsUsed(scenario),
  };
  if (scenario.observed && meta.compareObserved !== false && fraction.value !== null && fraction.se !== null) {
    const observed = { magnetic: scenario.observed.magnetic, total: scenario.observed.total };
    result.comparison = compareWithObserved({ value: fraction.value, se: fraction.se }, observed);
    if (n > 0) result.impliedOccurrence = impliedMultiplier({ whiteDwarfs: n, multiplierEdges, magneticAt }, observed);
  }
  return result;
}

function fractionOf(k: number, n: number): ResultFraction {
  if (n === 0) return { value: null, se: null, k, n };
  return { value: k / n, se: monteCarloStandardError(k, n), k, n };
}

