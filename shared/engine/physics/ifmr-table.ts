import type { IfmrSegments } from './ifmr-piecewise.ts';

/**
 * A user IFMR table of (initial, final) points as piecewise-linear segments through them
 * (linear interpolation; the end segments extend beyond the table). Units: Msun.
 * Example: points (1, 0.55) and (3, 0.75) give Mf(2) = 0.65 and Mf(4) = 0.85.
 */
export function ifmrFromTable(points: readonly { initialMsun: number; finalMsun: number }[]): IfmrSegments {
  const loMsun: number[] = [];
  const slope: number[] = [];
  const intercept: number[] = [];
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i];
    const b = points[i + 1];
    const s = (b.finalMsun - a.finalMsun) / (b.initialMsun - a.initialMsun);
    loMsun.push(a.initialMsun);
    slope.push(s);
    intercept.push(a.finalMsun - s * a.initialMsun);
  }
  return { loMsun, slope, intercept, validMsun: [points[0].initialMsun, points[points.length - 1].initialMsun] };
}
