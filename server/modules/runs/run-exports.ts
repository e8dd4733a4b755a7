import type { MethodEntry, ScenarioResult } from '../../../shared/contracts/result.ts';
import type { Scenario } from '../../../shared/contracts/scenario.ts';
import { formatPercentWithError } from '../../../shared/engine/stats/format.ts';
import { methodsUsed } from '../../../shared/engine/result/methods.ts';
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
 * A plain-text methods paragraph a paper can quote: every published method the scenario uses
 * with its reference, and what it takes to reproduce the run exactly.
 */
export function methodsParagraph(scenario: Scenario, result: ScenarioResult, runId: string): string {
  const methods: MethodEntry[] = methodsUsed(scenario);
  const value = result.fraction.value;
  const headline =
    value !== null && result.fraction.se !== null
      ? `The predicted fraction of strongly magnetic white dwarfs (B ≥ ${scenario.field.thresholdMG} MG) is ${formatPercentWithError(value, result.fraction.se)} (${result.counts.magnetic} of ${result.counts.whiteDwarfs} model white dwarfs; the uncertainty is the binomial Monte Carlo standard error).`
      : 'The run produced no white dwarfs, so no magnetic fraction is defined.';
  const body = methods.map((m) => `${m.topic}: ${m.method} (${m.reference}).`).join(' ');
  const references = [...new Set(methods.map((m) => m.reference))].filter((r) => r !== 'definition' && r !== 'user supplied');
  return [
    `We modelled the population with Tidefield (engine ${result.engineVersion}), drawing ${result.systems.toLocaleString('en-US')} primaries in ${result.chunkCount} independently seeded chunks from seed "${result.seed}". ${body}`,
    headline,
    `The run (Tidefield run ${runId}) is reproduced exactly by the scenario document with SHA-256 ${result.scenarioHash}, the same seed and engine version.`,
    '',
    'Assumptions:',
    ...result.assumptions.map((a) => `- ${a}`),
    '',
    'References:',
    ...references.map((r) => `- ${r}`),
    '',
  ].join('\n');
}
