import type { ConstraintEvaluation } from '../../../../shared/contracts/constraints.ts';
import { formatPValue, formatSigma } from '../../../../shared/engine/stats/format.ts';

/** "12.3σ"; an infinite significance (JSON null on a scored line) as "∞σ"; "—" when not scored. */
export function sigmaCell(c: Pick<ConstraintEvaluation, 'status' | 'sigma'>): string {
  if (c.status !== 'scored') return '—';
  return formatSigma(c.sigma ?? Infinity);
}

/** "p = 0.43", "p = 5.7 × 10⁻¹⁰", "—" when there is no p. */
export function pCell(p: number | null): string {
  return p === null ? '—' : `p = ${formatPValue(p > 0 ? Math.log(p) : -Infinity)}`;
}

/** The tone of a line: by significance, as the verdict words are (2, 3, 5σ; common practice, no source). */
export function toneOf(c: Pick<ConstraintEvaluation, 'status' | 'sigma'>): 'success' | 'warning' | 'danger' | 'neutral' {
  if (c.status !== 'scored') return 'neutral';
  const s = c.sigma ?? Infinity;
  return s < 2 ? 'success' : s < 5 ? 'warning' : 'danger';
}

/** A short label for the badge beside a line. */
export function shortVerdict(c: Pick<ConstraintEvaluation, 'status' | 'sigma'>): string {
  if (c.status === 'unavailable') return 'not available';
  if (c.status === 'notTestable') return 'not tested';
  const s = c.sigma ?? Infinity;
  return s < 2 ? 'consistent' : s < 3 ? 'mild tension' : s < 5 ? 'strong tension' : 'rejected';
}
