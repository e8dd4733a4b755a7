import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';

/** A response curve as the server sends it: the predicted magnetic fraction at ascending multipliers. */
export type ResponseCurve = { multiplier: number; fraction: number }[];

/** The predicted fraction at multiplier m, linear between the curve's points (as the engine defines it). */
export function fractionAt(curve: ResponseCurve, m: number): number {
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1];
    const b = curve[i];
    if (m <= b.multiplier) return a.fraction + ((b.fraction - a.fraction) * (m - a.multiplier)) / (b.multiplier - a.multiplier);
  }
  return curve[curve.length - 1].fraction;
}

/**
 * The posterior of the multiplier given k of n under a uniform prior over the curve's range,
 * computed independently of the engine: the likelihood Binomial(k | n, f(m)) from jStat's pmf at
 * f(m) interpolated on the curve, integrated by the trapezoidal rule on `steps` equal sub-steps,
 * and the central quantiles read off the cumulative sum (linear within a sub-step).
 * Returns the 68.27% and 95% central intervals and the sub-step of highest density.
 */
export function credibleReference(curve: ResponseCurve, k: number, n: number, steps = 1 << 16) {
  const lo = curve[0].multiplier;
  const hi = curve[curve.length - 1].multiplier;
  const h = (hi - lo) / steps;
  const xs = Array.from({ length: steps + 1 }, (_, s) => lo + s * h);
  const density = xs.map((x) => jStat.binomial.pdf(k, n, fractionAt(curve, x)));
  const cdf = [0];
  for (let s = 1; s <= steps; s++) cdf.push(cdf[s - 1] + ((density[s - 1] + density[s]) * h) / 2);
  const total = cdf[steps];
  const quantile = (p: number) => {
    const target = p * total;
    const s = cdf.findIndex((c) => c >= target);
    if (s <= 0) return xs[0];
    return xs[s - 1] + (h * (target - cdf[s - 1])) / (cdf[s] - cdf[s - 1]);
  };
  const peak = xs[density.indexOf(Math.max(...density))];
  // (1 − erf(1/√2)) / 2: the tail outside a central 68.27% interval (common practice, no source).
  const tail68 = 0.15865525393145707;
  return { interval68: [quantile(tail68), quantile(1 - tail68)], interval95: [quantile(0.025), quantile(0.975)], peak };
}
