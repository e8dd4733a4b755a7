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
