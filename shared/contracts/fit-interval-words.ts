import type { FitParameter, FitPosterior } from './fits.ts';

/** A grid value or interval end in a sentence: three significant figures, exponent form beyond 10^4 and below 10^-3. Example: 0.011347 → "0.0113". */
export const formatGridValue = (x: number) =>
  Math.abs(x) >= 1e4 || (Math.abs(x) < 1e-3 && x !== 0) ? x.toExponential(2) : Number(x.toPrecision(3)).toString();

/**
 * What an interval is worth, said beside it (the sentence, the methods text and the fit page use
 * the same words): nothing when the data bound it; "cut by the grid's lower edge (0.01)" when the
 * posterior is still high there, so that end is the grid's and not the data's; that the posterior
 * piles at the parameter's own limit (a multiplier of 0), so the result is in effect one-sided; and for a flat
 * likelihood, that the interval is the prior's.
 * Example: lowerEdge on a grid from 0.01 to 2 → "cut by the grid's lower edge (0.01), where the posterior is still high".
 */
export function intervalCaveat(
  iv: Pick<FitPosterior['intervals'][number], 'lowerEdge' | 'upperEdge' | 'lowerLimit' | 'upperLimit' | 'flat'>,
  parameter: Pick<FitParameter, 'min' | 'max'>,
  unit: string,
): string | null {
  const u = unit ? ` ${unit}` : '';
  const [lo, hi] = [formatGridValue(parameter.min), formatGridValue(parameter.max)];
  if (iv.flat) return `not constrained: the likelihood is flat along it, so the interval is the prior's over the grid's ${lo}–${hi}${u}`;
  const edges = [iv.lowerEdge ? `lower edge (${lo}${u})` : null, iv.upperEdge ? `upper edge (${hi}${u})` : null].filter((e) => e !== null);
  const words = [
    edges.length > 0 ? `cut by the grid's ${edges.join(' and ')}, where the posterior is still high` : null,
    iv.lowerLimit ? `the posterior piles up at the lowest value the parameter can take (${lo}${u}): read it as an upper limit` : null,
    iv.upperLimit ? `the posterior piles up at the highest value the parameter can take (${hi}${u}): read it as a lower limit` : null,
  ].filter((w) => w !== null);
  return words.length > 0 ? words.join('; ') : null;
}
