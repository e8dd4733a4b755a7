import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { runBins } from './runs.table.ts';

type BinRow = typeof runBins.$inferInsert;

/** The result's histograms as run_bins rows (zero bins are left out; absent rows mean zero). */
export function resultBinRows(runId: string, result: ScenarioResult): BinRow[] {
  const rows: BinRow[] = [];
  const oneD = (histogram: string, series: string, edges: number[], counts: number[]) => {
    counts.forEach((count, bin) => {
      if (count > 0) rows.push({ runId, histogram, series, bin, bin2: 0, lo: edges[bin], hi: edges[bin + 1], count });
    });
  };
  const { wdMass, logField, fateMap, survivorSeparation } = result.bins;
  oneD('wdMass', 'magnetic', wdMass.edgesMsun, wdMass.magnetic);
  oneD('wdMass', 'nonMagnetic', wdMass.edgesMsun, wdMass.nonMagnetic);
  oneD('logField', 'all', logField.edgesLog10MG, logField.counts);
  oneD('separation', 'wide', survivorSeparation.edgesLog10AU, survivorSeparation.wide);
  oneD('separation', 'postCE', survivorSeparation.edgesLog10AU, survivorSeparation.postCE);
  fateMap.fates.forEach((fate, f) => {
    fateMap.counts[f].forEach((periodCounts, m) => {
      periodCounts.forEach((count, p) => {
        if (count > 0) {
          rows.push({
            runId, histogram: 'fateMap', series: fate, bin: m, bin2: p,
            lo: fateMap.log10MassEdgesMsun[m], hi: fateMap.log10MassEdgesMsun[m + 1],
            lo2: fateMap.log10PeriodEdgesDays[p], hi2: fateMap.log10PeriodEdgesDays[p + 1], count,
          });
        }
      });
    });
  });
  return rows;
}
