import { EngineError } from '../errors.ts';
import { clopperPearson } from './clopper-pearson.ts';
import { MC_ERROR_NEGLIGIBLE_RATIO, type ObservedCounts } from './compare-observed.ts';
import { formatAtResolution, formatPercent, formatSignificant } from './format.ts';
import { monteCarloStandardError } from './mc-error.ts';
import { acceptedFractionRanges } from './test-inversion.ts';
import { requireCount, requireSuccesses } from './validate.ts';

/**
 * The exact response of a run's magnetic count to the companion-occurrence multiplier m, tallied
 * by the kernel from one seeded run with common random numbers.
 */
export interface MultiplierResponse {
  /** N white dwarfs in the run (does not depend on m) */
  whiteDwarfs: number;
  /** ascending, multiplierEdges[0] = 0; the largest allowed m is the last edge */
  multiplierEdges: number[];
  /** magneticAt[j] = magnetic white dwarfs when m = multiplierEdges[j] (non-decreasing) */
  magneticAt: number[];
}

/** Which multipliers an observed magnetic fraction allows: plain data. */
export interface ImpliedOccurrence {
  interval68: [number, number] | null;
  interval95: [number, number] | null;
  bestFit: number;
  curve: { multiplier: number; fraction: number }[];
  summary: string;
  method: string;
}

interface CurvePoint {
  multiplier: number;
  fraction: number;
}

/**
 * Which values of the companion-occurrence multiplier m does an observed k magnetic of n allow?
 * The predicted fraction f(m) = magneticAt(m)/N is interpolated linearly between the edges; m is
 * allowed at 68% (95%) when the exact two-sided binomial test of k of n against f(m) does not
 * reject at 1 − 0.68 (1 − 0.95) — the test of R's binom.test, inverted by acceptedFractionRanges
 * (Fay 2010, The R Journal 2(1), 53). The allowed fractions are mapped back through the curve;
 * an end may sit at m = 0 or at the last edge, which the summary calls "at the edge".
 * `bestFit` is the smallest m with f(m) closest to k/n. The curve's own Monte Carlo error
 * √(f(1 − f)/N) is not folded in; `method` states it.
 * Valid for N ≥ 1, ≥ 2 strictly ascending finite edges starting at 0, integer counts
 * 0 ≤ magneticAt[j] ≤ N non-decreasing, and 0 ≤ k ≤ n, n ≥ 1. Inputs are not modified.
 * Example: N = 1000, edges [0, 1, 2], magneticAt [0, 100, 200] and 3 of 20 observed give a best
 * fit m = 1.5 (f = 15%).
 */
export function impliedMultiplier(response: MultiplierResponse, observed: ObservedCounts): ImpliedOccurrence {
  const n = requireCount('response.whiteDwarfs', response.whiteDwarfs);
  if (n < 1) throw new EngineError('response.whiteDwarfs', n, `integers 1 … ${Number.MAX_SAFE_INTEGER}`);
  const edges = response.multiplierEdges;
  const counts = response.magneticAt;
  if (!Array.isArray(edges) || edges.length < 2) {
    throw new EngineError('response.multiplierEdges', edges, 'an array of at least 2 multipliers');
  }
  if (!Array.isArray(counts) || counts.length !== edges.length) {
    throw new EngineError('response.magneticAt', counts, `an array of ${edges.length} counts (one per edge)`);
  }
  if (edges[0] !== 0) throw new EngineError('response.multiplierEdges[0]', edges[0], '0 exactly');
  edges.forEach((m, j) => {
    if (!Number.isFinite(m) || (j > 0 && !(m > edges[j - 1]))) {
      throw new EngineError(`response.multiplierEdges[${j}]`, m, `finite and > ${edges[j - 1]} (strictly ascending)`);
    }
  });
  counts.forEach((c, j) => {
    requireSuccesses(`response.magneticAt[${j}]`, c, 'response.whiteDwarfs', n);
    if (j > 0 && c < counts[j - 1]) {
      throw new EngineError(`response.magneticAt[${j}]`, c, `≥ ${counts[j - 1]} (non-decreasing in m)`);
    }
  });
  const curve = edges.map((multiplier, j) => ({ multiplier, fraction: counts[j] / n }));
  const spacing = largestSpacing(curve);
  return impliedFromCurve(curve, observed, (best) => {
    const se = monteCarloStandardError(Math.round(best.fraction * n), n);
    return {
      se,
      text:
        `exact response from one run with common random numbers (N = ${n} white dwarfs), ` +
        `interpolated linearly between ${curve.length} multiplier edges (resolution: largest ` +
        `spacing Δm = ${formatSignificant(spacing, 2)}); the curve's Monte Carlo error ` +
        `√(f(1 − f)/N) is ±${formatPercent(se)} at the best fit and is not included in the intervals`,
    };
  });
}

/**
 * impliedMultiplier for a response measured at sweep points (m_j, magnetic_j, N_j) from separate
 * runs: f_j = magnetic_j / N_j, interpolated linearly in m between the points (sorted by m; the
 * input array is not reordered). Such a curve carries independent Monte Carlo noise at every
 * point and need not be monotone; the allowed range is then the hull of all allowed m.
 * Valid for ≥ 2 points with distinct finite multipliers ≥ 0, integers 0 ≤ magnetic_j ≤ N_j,
 * N_j ≥ 1, and 0 ≤ k ≤ n, n ≥ 1.
 * Example: points (0, 0, 1000), (1, 100, 1000), (2, 200, 1000) with 3 of 20 observed give the
 * same answer as the matching MultiplierResponse.
 */
export function impliedMultiplierFromPoints(
  points: { multiplier: number; magnetic: number; whiteDwarfs: number }[],
  observed: ObservedCounts,
): ImpliedOccurrence {
  if (!Array.isArray(points) || points.length < 2) {
    throw new EngineError('points', points, 'an array of at least 2 sweep points');
  }
  points.forEach((point, j) => {
    if (!Number.isFinite(point.multiplier) || point.multiplier < 0) {
      throw new EngineError(`points[${j}].multiplier`, point.multiplier, '[0, Infinity) finite');
    }
    requireSuccesses(`points[${j}].magnetic`, point.magnetic, `points[${j}].whiteDwarfs`, point.whiteDwarfs);
  });
  const sorted = [...points].sort((a, b) => a.multiplier - b.multiplier);
  sorted.forEach((point, j) => {
    if (j > 0 && point.multiplier === sorted[j - 1].multiplier) {
      throw new EngineError('points.multiplier', point.multiplier, 'distinct values (one sweep point per multiplier)');
    }
  });
  const curve = sorted.map((p) => ({ multiplier: p.multiplier, fraction: p.magnetic / p.whiteDwarfs }));
  const errors = sorted.map((p) => monteCarloStandardError(p.magnetic, p.whiteDwarfs));
  const monotone = curve.every((p, j) => j === 0 || p.fraction >= curve[j - 1].fraction);
  const sizes = sorted.map((p) => p.whiteDwarfs);
  return impliedFromCurve(curve, observed, (best) => {
    const se = interpolate(curve.map((p, j) => ({ multiplier: p.multiplier, fraction: errors[j] })), best.multiplier);
    return {
      se,
      text:
        `response measured at ${curve.length} sweep points from separate runs ` +
        `(N = ${Math.min(...sizes) === Math.max(...sizes) ? sizes[0] : `${Math.min(...sizes)}–${Math.max(...sizes)}`} ` +
        'white dwarfs each), interpolated linearly ' +
        `(resolution: largest spacing Δm = ${formatSignificant(largestSpacing(curve), 2)}); each point ` +
        `carries its own Monte Carlo error √(f(1 − f)/N_j), ±${formatPercent(se)} near the best fit, ` +
        `not included in the intervals` +
        (monotone ? '' : '; the measured curve is not monotone, so each interval is the hull of all allowed m'),
    };
  });
}

function largestSpacing(curve: CurvePoint[]): number {
  return Math.max(...curve.slice(1).map((p, j) => p.multiplier - curve[j].multiplier));
}

/** Linear interpolation of the curve's fraction at m (inside its range). */
function interpolate(curve: CurvePoint[], m: number): number {
  for (let j = 1; j < curve.length; j++) {
    const a = curve[j - 1];
    const b = curve[j];
    if (m <= b.multiplier) return a.fraction + ((b.fraction - a.fraction) * (m - a.multiplier)) / (b.multiplier - a.multiplier);
  }
  return curve[curve.length - 1].fraction;
}

/** Hull of the multipliers whose interpolated fraction lies in [lo, hi]; null if there are none. */
function multiplierRange(curve: CurvePoint[], lo: number, hi: number): [number, number] | null {
  let min = Infinity;
  let max = -Infinity;
  for (let j = 1; j < curve.length; j++) {
    const a = curve[j - 1];
    const b = curve[j];
    let t0: number;
    let t1: number;
    if (a.fraction === b.fraction) {
      if (a.fraction < lo || a.fraction > hi) continue;
      [t0, t1] = [0, 1];
    } else {
      const tLo = (lo - a.fraction) / (b.fraction - a.fraction);
      const tHi = (hi - a.fraction) / (b.fraction - a.fraction);
      t0 = Math.max(0, Math.min(tLo, tHi));
      t1 = Math.min(1, Math.max(tLo, tHi));
      if (t0 > t1) continue;
    }
    const width = b.multiplier - a.multiplier;
    min = Math.min(min, a.multiplier + t0 * width);
    max = Math.max(max, t1 === 1 ? b.multiplier : a.multiplier + t1 * width);
  }
  return min <= max ? [min, max] : null;
}

/** The smallest m whose interpolated fraction is closest to `target`. */
function closestMultiplier(curve: CurvePoint[], target: number): number {
  for (let j = 1; j < curve.length; j++) {
    const a = curve[j - 1];
    const b = curve[j];
    if (a.fraction === target) return a.multiplier;
    if ((a.fraction - target) * (b.fraction - target) < 0) {
      return a.multiplier + ((target - a.fraction) / (b.fraction - a.fraction)) * (b.multiplier - a.multiplier);
    }
  }
  // No crossing: on a piecewise-linear curve the closest point is then a vertex.
  let best = curve[0];
  for (const p of curve) if (Math.abs(p.fraction - target) < Math.abs(best.fraction - target)) best = p;
  return best.multiplier;
}

function impliedFromCurve(
  curve: CurvePoint[],
  observed: ObservedCounts,
  describeCurve: (best: CurvePoint) => { se: number; text: string },
): ImpliedOccurrence {
  const { magnetic: k, total: n } = observed;
  requireSuccesses('observed.magnetic', k, 'observed.total', n);
  const target = k / n;
  const [accepted68, accepted95] = acceptedFractionRanges(k, n, [0.68, 0.95]);
  const interval68 = multiplierRange(curve, accepted68.lower, accepted68.upper);
  const interval95 = multiplierRange(curve, accepted95.lower, accepted95.upper);
  const bestFit = closestMultiplier(curve, target);
  const best = { multiplier: bestFit, fraction: interpolate(curve, bestFit) };
  const first = curve[0].multiplier;
  const last = curve[curve.length - 1].multiplier;

  const atEdge = (m: number) => m === first || m === last;
  // Multipliers are written at the resolution of the widest interval, so narrow ones stay legible.
  const widest = interval95 ?? interval68;
  const m = (x: number) => formatAtResolution(x, widest ? widest[1] - widest[0] : 0);
  const range = (r: [number, number] | null, label: string) => {
    if (r === null) return `no multiplier at ${label}`;
    const edges = atEdge(r[0]) && atEdge(r[1]) ? '; both ends' : atEdge(r[0]) ? '; lower end' : atEdge(r[1]) ? '; upper end' : '';
    return `a multiplier between ${m(r[0])} and ${m(r[1])} (${label}${edges ? `${edges} at the edge` : ''})`;
  };
  const opening = `The observed ${k} of ${n} (${formatPercent(target)})`;
  const summary =
    interval95 === null
      ? `${opening} is not reproduced by any multiplier from ${formatSignificant(first, 2)} to ` +
        `${formatSignificant(last, 2)} at 95%: the predicted fraction only spans ` +
        `${formatPercent(Math.min(...curve.map((p) => p.fraction)))}–${formatPercent(Math.max(...curve.map((p) => p.fraction)))}, ` +
        `and the closest, m = ${formatSignificant(bestFit, 2)}, predicts ${formatPercent(best.fraction)}.`
      : `${opening} implies ${range(interval68, '68%')} and ${range(interval95, '95%').replace(/^a multiplier /, '')}, ` +
        `best fit ${m(bestFit)}${atEdge(bestFit) ? ' (at the edge)' : ''}.`;

  const { se, text } = describeCurve(best);
  const observed68 = clopperPearson(k, n, 0.68);
  const mcMatters = se > MC_ERROR_NEGLIGIBLE_RATIO * 0.5 * (observed68.upper - observed68.lower);
  const gaps = accepted68.gaps || accepted95.gaps;
  const method =
    `${text}${mcMatters ? ', and it is not negligible against the observed 68% interval' : ''}; ` +
    'allowed multipliers are those whose predicted fraction the exact two-sided binomial test ' +
    '(outcomes no more likely than the observed one, as R binom.test) does not reject at ' +
    '1 − 0.68 and 1 − 0.95' +
    (gaps ? '; the accepted fractions have gaps, so each interval is their hull' : '');

  return {
    interval68,
    interval95,
    bestFit,
    curve: curve.map((p) => ({ multiplier: p.multiplier, fraction: p.fraction })),
    summary,
    method,
  };
}
