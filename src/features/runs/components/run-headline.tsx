import type { ResultFraction, ScenarioResult } from '../../../../shared/contracts/result.ts';
import { fractionOrLimitText } from '../../../../shared/engine/stats/fraction-text.ts';
import { formatCount } from './run-text.ts';

/** "9.03% ± 0.09%", or a dash when there were no white dwarfs to count. */
export function fractionWithError(f: ResultFraction): string {
  return f.value === null || f.se === null ? '—' : (fractionOrLimitText(f.k, f.n, f.se) ?? '—');
}

/** The run's answer in one line: the magnetic fraction with its Monte Carlo error, and what it counts. */
export function RunHeadline({ result }: { result: ScenarioResult }) {
  const { fraction, counts } = result;
  const threshold = result.bins.logField.thresholdMG;
  const selected = counts.whiteDwarfs !== counts.whiteDwarfsFormed;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm font-bold tracking-wide text-lantern-300 uppercase">Predicted magnetic fraction</p>
      <p className="text-[2.5rem] leading-tight font-bold tabular-nums text-foam-50 sm:text-[3.25rem]">{fractionWithError(fraction)}</p>
      <p className="max-w-prose text-foam-300">
        {fraction.n === 0
          ? 'The run made no white dwarfs, so no fraction can be given.'
          : `of white dwarfs have B ≥ ${threshold} MG: ${formatCount(fraction.k)} of ${formatCount(fraction.n)} model white dwarfs${selected ? ' in the selected sample' : ''}. The ± is the binomial Monte Carlo standard error of the run, not an astrophysical uncertainty.`}
      </p>
      <p className="text-sm text-foam-400">
        {formatCount(counts.primaries)} primaries drawn; {formatCount(counts.whiteDwarfsFormed)} are white dwarfs today
        {selected ? `, ${formatCount(counts.whiteDwarfs)} of them in the selected sample` : ''}.
      </p>
    </div>
  );
}
