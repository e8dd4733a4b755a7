import { EngineError } from '../errors.ts';

/** Result of groupedMoments: plain data, in the unit of the bin edges. */
export interface GroupedMoments {
  count: number;
  mean: number;
  /** Standard deviation after Sheppard's correction (variance − h²/12, floored at 0). */
  sd: number;
  /** Standard error of the mean, sd / √count: the Monte Carlo error of the predicted mean. */
  se: number;
}

/**
 * Mean and standard deviation of a quantity known only as a histogram (counts between edges),
 * with the bin width accounted for: each count sits at its bin's centre, and the variance of the
 * grouped values is reduced by Sheppard's correction h²/12 (Sheppard 1898, Proc. London Math.
 * Soc. 29, 353; Kendall & Stuart, The Advanced Theory of Statistics, vol. 1, §3.18), exact to
 * first order for a smooth density whose bins have width h (for unequal bins the count-weighted
 * mean of h_i²/12 is used). The grouped mean needs no correction to that order.
 * Units: those of the edges (e.g. Msun). Valid for edges strictly increasing, counts ≥ 0 with
 * counts.length = edges.length − 1. Returns null when the histogram is empty.
 * Example: counts [1, 2, 1] on edges [0, 1, 2, 3] → mean 1.5, grouped variance 0.5,
 * corrected sd √(0.5 − 1/12) = 0.6455, se 0.3227.
 */
export function groupedMoments(edges: readonly number[], counts: readonly number[]): GroupedMoments | null {
  if (counts.length !== edges.length - 1) throw new EngineError('counts.length', counts.length, `${edges.length - 1} (one per bin)`);
  let n = 0;
  let sum = 0;
  for (let i = 0; i < counts.length; i++) {
    const c = counts[i];
    if (!(c >= 0)) throw new EngineError(`counts[${i}]`, c, '[0, Infinity]');
    if (!(edges[i + 1] > edges[i])) throw new EngineError(`edges[${i + 1}]`, edges[i + 1], `above edges[${i}] = ${edges[i]}`);
    n += c;
    sum += c * 0.5 * (edges[i] + edges[i + 1]);
  }
  if (n === 0) return null;
  const mean = sum / n;
  let squares = 0;
  let sheppard = 0;
  for (let i = 0; i < counts.length; i++) {
    const h = edges[i + 1] - edges[i];
    const d = 0.5 * (edges[i] + edges[i + 1]) - mean; // deviations, not raw squares: no cancellation
    squares += counts[i] * d * d;
    sheppard += (counts[i] * h * h) / 12;
  }
  const sd = Math.sqrt(Math.max(0, (squares - sheppard) / n));
  return { count: n, mean, sd, se: sd / Math.sqrt(n) };
}
