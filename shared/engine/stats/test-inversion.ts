import { logBinomialPmfUnchecked } from './binomial-pmf.ts';
import { binomialTestTwoSidedLog } from './binomial-test.ts';
import { requireOpenUnit, requireSuccesses } from './validate.ts';

/** The fractions an exact test does not reject at one confidence level (see acceptedFractionRanges). */
export interface AcceptedRange {
  confidence: number;
  lower: number;
  upper: number;
  /** true when some fraction inside [lower, upper] was rejected (the accepted set is not an interval) */
  gaps: boolean;
}

// Grid points per side between the observed fraction and the certain-rejection point.
const GRID = 200;
const LOG_REL_ERR = Math.log1p(1e-7);

/**
 * The range of true fractions p that the exact two-sided binomial test of k of n
 * (binomialTestTwoSided, the minimum-likelihood rule of R's binom.test) does not reject at
 * level 1 − confidence, i.e. the confidence set obtained by inverting that test (Fay 2010,
 * The R Journal 2(1), 53, who also shows that this set need not be an interval). Returned as its
 * hull [lower, upper], with `gaps` telling whether a rejected fraction was found inside.
 * Method: every outcome that enters the p-value is no more likely than k, so the p-value is at
 * most (n + 1)(1 + 1e-7) P(X = k | p), which falls steadily away from p = k/n; where it drops
 * below 1 − confidence, every farther p is rejected. Between k/n and that point the test is
 * evaluated on 200 evenly spaced fractions per side (one shared grid for all levels, so the sets
 * for higher confidence contain those for lower), and the outermost accepted one is refined by
 * bisection to a relative 1e-13. Pockets narrower than the grid step (1/200 of the range
 * searched) can be missed. The returned ends are themselves accepted.
 * Dimensionless. Valid for integers 0 ≤ k ≤ n (n ≥ 1) and confidences in (0, 1).
 * Example: acceptedFractionRanges(3, 20, [0.95]) ≈ [{ lower: 0.0422, upper: 0.3722, … }], close to
 * the Clopper–Pearson interval 0.0321–0.3789 (the two need not nest).
 */
export function acceptedFractionRanges(k: number, n: number, confidences: readonly number[]): AcceptedRange[] {
  requireSuccesses('k', k, 'n', n);
  confidences.forEach((c, i) => requireOpenUnit(`confidences[${i}]`, c));
  if (confidences.length === 0) return [];
  const levels = confidences.map((c) => Math.log(1 - c));
  const observed = k / n;
  const down = k === 0 ? null : scanSide(k, n, observed, 0, levels);
  const up = k === n ? null : scanSide(k, n, observed, 1, levels);
  return confidences.map((confidence, i) => ({
    confidence,
    lower: down ? down[i].end : observed,
    upper: up ? up[i].end : observed,
    gaps: (down?.[i].gaps ?? false) || (up?.[i].gaps ?? false),
  }));
}

function scanSide(k: number, n: number, observed: number, limit: number, logLevels: number[]) {
  const logPValue = (p: number) => binomialTestTwoSidedLog(k, n, p);
  const far = certainRejection(k, n, observed, limit, Math.min(...logLevels));
  const grid = Array.from({ length: GRID + 1 }, (_, i) => observed + ((far - observed) * i) / GRID);
  const logP = grid.map((p, i) => (i === 0 ? 0 : logPValue(p)));
  return logLevels.map((logLevel) => {
    let outer = 0;
    for (let i = GRID; i > 0; i--) {
      if (logP[i] >= logLevel) {
        outer = i;
        break;
      }
    }
    const gaps = logP.slice(0, outer).some((l) => l < logLevel);
    if (outer === GRID) return { end: far, gaps };
    // Bisection between the outermost accepted grid point and the next (rejected) one.
    let inside = grid[outer];
    let outside = grid[outer + 1];
    while (Math.abs(outside - inside) > 1e-13 * Math.max(inside, outside)) {
      const mid = 0.5 * (inside + outside);
      if (logPValue(mid) >= logLevel) inside = mid;
      else outside = mid;
    }
    return { end: inside, gaps };
  });
}

/**
 * The fraction between `observed` and `limit` beyond which (n + 1)(1 + 1e-7) P(X = k | p) stays
 * below e^logLevel, found by bisection (that bound decreases monotonically away from k/n);
 * `limit` itself when the bound never gets that low.
 */
function certainRejection(k: number, n: number, observed: number, limit: number, logLevel: number): number {
  const logBound = (p: number) => Math.log(n + 1) + LOG_REL_ERR + logBinomialPmfUnchecked(k, n, p);
  if (logBound(limit) >= logLevel) return limit;
  let near = observed;
  let beyond = limit;
  while (Math.abs(beyond - near) > 1e-13 * Math.max(near, beyond)) {
    const mid = 0.5 * (near + beyond);
    if (logBound(mid) >= logLevel) near = mid;
    else beyond = mid;
  }
  return beyond;
}
