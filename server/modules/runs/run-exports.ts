import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { Scenario } from '../../../shared/contracts/scenario.ts';
import { methodsText } from '../../../shared/engine/result/methods-paragraph.ts';
import { toCsv } from '../../lib/csv.ts';

/** A CSV with one section per table of the result: headline counts, then every histogram. */
export function resultCsv(result: ScenarioResult): string {
  const rows: (string | number | null)[][] = [];
  const row = (...cells: (string | number | null)[]) => rows.push(cells);
  row('run', 'engineVersion', result.engineVersion);
  row('run', 'scenarioHash', result.scenarioHash);
  row('run', 'seed', result.seed);
  row('run', 'systems', result.systems);
  row('counts', 'primaries', result.counts.primaries);
  row('counts', 'whiteDwarfs', result.counts.whiteDwarfs);
  row('counts', 'magnetic', result.counts.magnetic);
  row('fraction', 'magnetic/whiteDwarfs', result.fraction.value, result.fraction.se);
  for (const [channel, n] of Object.entries(result.counts.byChannel)) row('byChannel', channel, n);
  for (const [setting, c] of Object.entries(result.counts.bySetting)) {
    const f = result.fractionBySetting[setting as keyof typeof result.fractionBySetting];
    row('bySetting', setting, c.magnetic, f.se, null, null, c.whiteDwarfs);
  }
  const { wdMass, logField, fateMap } = result.bins;
  wdMass.magnetic.forEach((c, i) => row('wdMassMsun', 'magnetic', c, null, wdMass.edgesMsun[i], wdMass.edgesMsun[i + 1]));
  wdMass.nonMagnetic.forEach((c, i) => row('wdMassMsun', 'nonMagnetic', c, null, wdMass.edgesMsun[i], wdMass.edgesMsun[i + 1]));
  logField.counts.forEach((c, i) => row('log10FieldMG', 'all', c, null, logField.edgesLog10MG[i], logField.edgesLog10MG[i + 1]));
  fateMap.fates.forEach((fate, f) =>
    fateMap.counts[f].forEach((periods, m) =>
      periods.forEach((c, p) => {
        if (c > 0) {
          row('fateMap', fate, c, null, fateMap.log10MassEdgesMsun[m], fateMap.log10MassEdgesMsun[m + 1], `log10P ${fateMap.log10PeriodEdgesDays[p]}..${fateMap.log10PeriodEdgesDays[p + 1]}`);
        }
      }),
    ),
  );
  return toCsv(['section', 'key', 'value', 'se', 'lo', 'hi', 'extra'], rows);
}

/**
 * The methods export of a run: the paragraph a paper can quote (shared/engine/result/methods-paragraph.ts),
 * then its assumptions and its references, each a section of its own. The run id names it.
 */
export function methodsParagraph(scenario: Scenario, result: ScenarioResult, runId: string): string {
  return methodsText(scenario, result, runId);
}
