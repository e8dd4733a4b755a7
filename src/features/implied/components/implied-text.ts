import { formatAtResolution, formatPercent, formatSignificant } from '../../../../shared/engine/stats/format.ts';

export interface ImpliedAnswer {
  interval68: [number, number] | null;
  interval95: [number, number] | null;
  bestFit: number;
  curve: { multiplier: number; fraction: number }[];
}

/** The range the curve covers: from m = 0 to the largest multiplier the table allows (no row's occurrence above 1). */
export function curveEnds(curve: ImpliedAnswer['curve']): [number, number] {
  return [curve[0]?.multiplier ?? 0, curve[curve.length - 1]?.multiplier ?? 0];
}

/**
 * One interval in words, as "between 0.97 and 1.8 times", with an end at the edge of the
 * explored range said plainly: "at most 1.8 times" when it reaches m = 0, "at least 0.65 times"
 * when it reaches the largest multiplier the table allows.
 */
export function multiplierRangeWords(range: [number, number], ends: [number, number], resolution: number): string {
  const m = (x: number) => formatAtResolution(x, resolution);
  const atLow = range[0] === ends[0];
  const atHigh = range[1] === ends[1];
  if (atLow && atHigh) return `anything from ${m(ends[0])} to ${m(ends[1])} times`;
  if (atLow) return `at most ${m(range[1])} times`;
  if (atHigh) return `at least ${m(range[0])} times`;
  return `between ${m(range[0])} and ${m(range[1])} times`;
}

/**
 * The observer's answer in a referee's words: which multiples of the table's companion
 * occurrence the sample allows at 68% and at 95%, and the best fit.
 * Example: 68% [0.97, 1.81], 95% [0.65, 2.28], best 1.27 on a curve from 0 to 4.35 →
 * "The sample allows between 0.97 and 1.8 times the table’s companion occurrence at 68%
 * confidence, and between 0.65 and 2.3 times at 95%. The best fit is 1.3 times."
 */
export function impliedSentence(answer: ImpliedAnswer, tableWords = 'the table’s companion occurrence'): string {
  const ends = curveEnds(answer.curve);
  const widest = answer.interval95 ?? answer.interval68;
  const resolution = widest ? widest[1] - widest[0] : 0;
  const m = (x: number) => formatAtResolution(x, resolution);
  if (answer.interval95 === null) {
    const fractions = answer.curve.map((p) => p.fraction);
    return (
      `No multiple of ${tableWords} from ${formatSignificant(ends[0], 2)} to ${formatSignificant(ends[1], 2)} reproduces the sample, even at 95% confidence: ` +
      `the predicted fraction only spans ${formatPercent(Math.min(...fractions))} to ${formatPercent(Math.max(...fractions))}. ` +
      `The closest is ${formatSignificant(answer.bestFit, 2)} times. Something other than the occurrence has to change.`
    );
  }
  const best = ` The best fit is ${m(answer.bestFit)} times.`;
  const reachesTop = answer.interval95[1] === ends[1] || answer.interval68?.[1] === ends[1];
  const edge = reachesTop ? ` Beyond ${m(ends[1])} times a row’s occurrence would pass 100%, so the range cannot extend further.` : '';
  const at95 = multiplierRangeWords(answer.interval95, ends, resolution);
  if (answer.interval68 === null) return `The sample allows ${at95} ${tableWords} at 95% confidence, but no multiplier at 68%.${best}${edge}`;
  const at68 = multiplierRangeWords(answer.interval68, ends, resolution);
  return `The sample allows ${at68} ${tableWords} at 68% confidence, and ${at95} at 95%.${best}${edge}`;
}

export interface OccurrenceRow {
  label: string;
  occurrence: number;
}

/** A row's occurrence scaled by m, as a percentage (capped at 100%, where the curve ends). */
export function scaledOccurrence(row: OccurrenceRow, m: number): string {
  return formatPercent(Math.min(1, row.occurrence * m));
}

/** The rows of a resolved scenario document with their labels, or null when it names a stored table. */
export function occurrenceRows(resolved: Record<string, unknown> | undefined): OccurrenceRow[] | null {
  const companions = resolved?.companions as { rows?: { label?: string; class?: string; occurrence?: number }[] } | undefined;
  if (!companions?.rows) return null;
  return companions.rows.map((row, i) => ({ label: row.label ?? `${row.class ?? 'Row'} ${i + 1}`, occurrence: row.occurrence ?? 0 }));
}

/** "about 40 s left", "about 3 min left"; null while the server cannot tell yet. */
export function etaText(seconds: number | null): string | null {
  if (seconds === null || !Number.isFinite(seconds)) return null;
  const s = Math.max(1, Math.round(seconds));
  return s < 90 ? `about ${s} s left` : `about ${Math.round(s / 60)} min left`;
}

/**
 * A cancelled question in words: how far its fit got, that nothing of it was kept (the server
 * deletes a cancelled job's checkpoint) and that the whole reservation was given back (billing's
 * refund on cancel, also for the part computed).
 * Example: progress 0.25, 13 credits → "Cancelled after 25% of its one pass, which was discarded:
 * there is no answer. Its whole reservation was given back (13 credits, and any free systems taken
 * from this month’s allowance). Ask again above."
 */
export function cancelledQuestionText(answer: { progress: number; costCredits: number | null }): string {
  const reached = answer.progress > 0 ? `Cancelled after ${formatSignificant(100 * answer.progress, 2)}% of its one pass, which was discarded` : 'Cancelled before its first chunk was computed';
  const credits = answer.costCredits === null || answer.costCredits === 0 ? '' : `${answer.costCredits.toLocaleString('en-US')} credit${answer.costCredits === 1 ? '' : 's'}, and `;
  return `${reached}: there is no answer. Its whole reservation was given back (${credits}any free systems taken from this month’s allowance). Ask again above.`;
}
