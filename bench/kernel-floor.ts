import type { PreparedScenario } from '../shared/engine/kernel/prepare.ts';
import { BINS, binIndex } from '../shared/engine/kernel/bins.ts';
import {
  companionLog10MassDraw,
  companionLog10PeriodDraw,
  companionMassDraw,
  companionPeriodDaysDraw,
} from '../shared/engine/kernel/companion-draws.ts';
import { LOG_BIN_LOOKUPS, logBinIndex } from '../shared/engine/kernel/log-bins.ts';
import { PRIMARY_STRIDE, whiteDwarfPosition } from '../shared/engine/kernel/primary-table.ts';
import { emptyTallyFor } from '../shared/engine/kernel/tally.ts';
import { finalMassMsun } from '../shared/engine/physics/ifmr-piecewise.ts';
import { ChunkStream } from '../shared/engine/random.ts';
import { binomialQuantile } from '../shared/engine/stats/binomial-quantile.ts';
import { CHUNK_SYSTEMS } from '../shared/engine/version.ts';

/**
 * The kernel's floor on this machine: a loop that makes the same draws as the kernel for the
 * prepared scenario (the white dwarfs directly, their positions in the primary table, the IFMR
 * mass, the cooling age and field uniforms, each row's presence uniform and, below the draw
 * threshold, the companion's mass and period from the same tables) and counts the white dwarfs
 * and the present companions into the same histograms, but decides no fate and makes no field:
 * no orbit, no common envelope, no multiplier response. Not a valid run; it measures what the
 * draws, the table reads and the counting cost before any physics (bench/engine.ts prints it in
 * draws' time per system next to the kernel's own figure).
 */
export function floorSystemsPerSecond(prepared: PreparedScenario, chunks: number): number {
  const stream = new ChunkStream();
  const position = new Float64Array(1);
  const tally = emptyTallyFor(prepared.scenarioHash);
  const { rows, ifmr, whiteDwarfs, constantHistory, ageGyr } = prepared;
  const { cells, nodes } = prepared.primary;
  const massBins = BINS.log10CompanionMsun.count;
  const periodBins = BINS.log10PeriodDays.count;
  let sink = 0;
  const chunk = (chunkIndex: number) => {
    const rng = stream.reset(prepared.seed, chunkIndex);
    const count = binomialQuantile(rng.uniform(), CHUNK_SYSTEMS, whiteDwarfs.probability);
    for (let s = 0; s < count; s++) {
      if (constantHistory) whiteDwarfPosition(whiteDwarfs, prepared.primary, rng, position, 0);
      else position[0] = (whiteDwarfs.uLowest + (1 - whiteDwarfs.uLowest) * rng.uniform()) * cells;
      const k = Math.min(position[0] | 0, cells - 1);
      const at = PRIMARY_STRIDE * k;
      const w = position[0] - k;
      const tms = nodes[at + 1] + w * (nodes[at + PRIMARY_STRIDE + 1] - nodes[at + 1]);
      const m1 = nodes[at] + w * (nodes[at + PRIMARY_STRIDE] - nodes[at]);
      const mwd = finalMassMsun(ifmr, m1);
      const cooling = constantHistory ? Math.max(0, ageGyr - tms) * rng.uniform() : Math.max(0, ageGyr - tms);
      sink += rng.uniform(); // the field uniform
      let setting = 0;
      for (let r = 0; r < rows.length; r++) {
        const row = rows[r];
        const u = rng.uniform();
        if (!(u < row.drawThreshold)) continue;
        const uMass = rng.uniform();
        const uPeriod = rng.uniform();
        const log10Mass = row.log10MassTable
          ? companionLog10MassDraw(row, uMass)
          : Math.log10(companionMassDraw(row, uMass));
        const log10Period = row.log10PeriodTable
          ? companionLog10PeriodDraw(row, uPeriod)
          : Math.log10(companionPeriodDaysDraw(row, uPeriod));
        if (!(u < row.presentThreshold)) continue;
        setting = 1;
        tally.companionFates[0]++;
        tally.fateMap[
          binIndex(BINS.log10CompanionMsun, log10Mass) * periodBins + binIndex(BINS.log10PeriodDays, log10Period)
        ]++;
      }
      const massBin = binIndex(BINS.wdMassMsun, mwd);
      tally.whiteDwarfs++;
      tally.settingWhiteDwarfs[setting]++;
      tally.wdMassNonMagnetic[massBin]++;
      tally.wdMassBySetting[(setting * 2 + 1) * BINS.wdMassMsun.count + massBin]++;
      tally.coolingAge[BINS.log10CoolingAgeGyr.count + logBinIndex(LOG_BIN_LOOKUPS.log10CoolingAgeGyr, cooling)]++;
    }
    sink += massBins;
  };
  for (let i = 0; i < 3; i++) chunk(i); // warm-up (JIT)
  const t = performance.now();
  for (let i = 3; i < 3 + chunks; i++) chunk(i % prepared.chunkCount);
  const seconds = (performance.now() - t) / 1000;
  if (sink < 0 || tally.whiteDwarfs < 0) throw new Error('unreachable');
  return (chunks * CHUNK_SYSTEMS) / seconds;
}
