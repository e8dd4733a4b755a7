import type { RunStatus } from '../../../../shared/contracts/runs.ts';
import type { BadgeTone } from '../../../components/ui/badge.tsx';
import { formatDuration } from '../../../lib/format.ts';

// Moved to the shared formats (the fits page shows durations too); runs import it from here as before.
export { formatDuration };

/** What each status is called on screen, and the tone of its badge. */
export const RUN_STATUS_TEXT: Record<RunStatus, { label: string; tone: BadgeTone }> = {
  queued: { label: 'Queued', tone: 'neutral' },
  running: { label: 'Running', tone: 'info' },
  succeeded: { label: 'Finished', tone: 'success' },
  failed: { label: 'Failed', tone: 'danger' },
  cancelled: { label: 'Cancelled', tone: 'warning' },
};

/** A run's compute time: milliseconds below a second, else formatDuration. */
export function formatComputeTime(ms: number): string {
  return ms < 1000 ? `${Math.round(ms)} ms` : formatDuration(ms / 1000);
}

/** 10000000 → "10,000,000". */
export function formatCount(n: number): string {
  return n.toLocaleString('en-US');
}

/**
 * The number typed into a "systems" box: "1e6", "2.5e7", "10^8", "3 × 10^6", "1,000,000",
 * "1 000 000" and "1_000_000" all read as numbers. Returns null when nothing is typed and NaN
 * when it is not a number, so that the schema can say what is allowed.
 */
export function parseSystemsInput(text: string): number | null {
  const compact = text.trim().replace(/[\s,_\u2009\u202f]/g, '');
  if (compact === '') return null;
  const power = /^(?:(\d+(?:\.\d+)?)[x×*])?10\^(\d{1,2})$/i.exec(compact);
  if (power) return (power[1] === undefined ? 1 : Number(power[1])) * 10 ** Number(power[2]);
  if (!/^\d+(?:\.\d+)?(?:e\d{1,2})?$/i.test(compact)) return Number.NaN;
  return Number(compact);
}

/**
 * How strongly an observation disagrees with a prediction, in the words of the usual
 * conventions: below 2σ no significant tension; 2–3σ tension that is not yet significant; 3σ
 * (p ≈ 0.0027) "evidence"; 5σ (p ≈ 5.7 × 10⁻⁷) the usual discovery standard, "excluded".
 * `sigma` null means infinitely many σ (the prediction gives the observation zero probability).
 */
export function tensionInWords(sigma: number | null): string {
  if (sigma === null || sigma === Infinity) {
    return 'The prediction is excluded outright: it gives the observed count zero probability.';
  }
  if (sigma < 2) return 'No significant tension: the observation is consistent with the prediction (below 2σ).';
  if (sigma < 3) return 'Mild tension (2–3σ): worth noting, but not significant by the usual 3σ standard.';
  if (sigma < 5) return 'Significant tension (3–5σ): evidence against the prediction, short of the 5σ standard for excluding it.';
  return 'The prediction is excluded at 5σ or more.';
}
