import type { FitSummary } from '../../../../shared/contracts/fits.ts';
import { formatDuration } from '../../../lib/format.ts';

/**
 * What a computing fit is doing, in words: queued; preparing (before the first chunk of the one
 * pass is done, which for a large grid on a track scenario can take a minute or two: the points
 * are prepared and the first chunk evaluates every one of them); or the time left.
 */
export function fitProgressText(fit: Pick<FitSummary, 'status' | 'chunksDone' | 'chunkCount' | 'etaSeconds'>): string {
  if (fit.status === 'queued') return 'Queued: it starts by itself when a worker is free.';
  if (fit.chunksDone === 0) return 'Preparing the grid points and computing the first chunks; the bar moves when the first chunk is done.';
  if (fit.etaSeconds === null) return 'Working out the time left…';
  return `About ${formatDuration(fit.etaSeconds)} left.`;
}

const plural = (n: number, one: string) => `${n.toLocaleString('en-US')} ${one}${n === 1 ? '' : 's'}`;

/**
 * What a cancel gives back, as the server does it (billing's settleRun on 'cancelled'): the whole
 * reservation, not only the part still unused. Free systems come back only within the month they
 * were taken from (an earlier month's allowance has lapsed).
 */
function refundWords(costCredits: number | null): string {
  const free = 'any free systems it took from this month’s allowance';
  if (costCredits === null) return `the credit reserved for it and ${free}`;
  if (costCredits === 0) return `${free} (it reserved no credits)`;
  return `the ${plural(costCredits, 'credit')} reserved for it and ${free}`;
}

/** The confirmation before a cancel: what stops, what comes back, what is lost. */
export function cancelFitWarning(fit: Pick<FitSummary, 'status'> & { costCredits: number | null }): string {
  const stops = fit.status === 'queued' ? 'The fit is taken off the queue before it starts.' : 'The fit stops at once.';
  return (
    `${stops} Its whole reservation is given back, also for any chunks already computed: ${refundWords(fit.costCredits)}, in one refund entry of the credit ledger. ` +
    'The chunks computed so far are discarded, so a cancelled fit has no posterior and cannot be resumed; to get one, start the fit again.'
  );
}

/** A cancelled fit in words: when, how far it got, that nothing of it is kept, and the refund. `when` is the time already formatted, or null. */
export function cancelledFitText(fit: Pick<FitSummary, 'chunksDone' | 'chunkCount'> & { costCredits: number | null }, when: string | null = null): string {
  const at = when ? ` ${when},` : '';
  const reached =
    fit.chunksDone > 0
      ? `Cancelled${at} after ${fit.chunksDone.toLocaleString('en-US')} of ${plural(fit.chunkCount, 'chunk')} of its one pass (${((100 * fit.chunksDone) / Math.max(1, fit.chunkCount)).toFixed(1)}%); those chunks were discarded`
      : `Cancelled${at} before its first chunk was computed`;
  return `${reached}, so there is no posterior: no intervals, no best point and no methods paragraph. Its whole reservation was given back: ${refundWords(fit.costCredits)}.`;
}
