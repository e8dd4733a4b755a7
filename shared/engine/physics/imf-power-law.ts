import { EngineError, requireInRange } from '../errors.ts';

/**
 * Inverse-CDF sampling of one power-law piece dN/dM ∝ M^-slope on [loMsun, hiMsun].
 * The CDF is F(M) = (M^β − lo^β)/(hi^β − lo^β) with β = 1 − slope, so
 * M = (lo^β + u (hi^β − lo^β))^(1/β); for β = 0 (slope 1) the piece is log-uniform,
 * M = lo (hi/lo)^u. This is exact (no table): the method of e.g. Press et al. 1992 §7.2
 * applied to a power law. Valid for 0 < lo < hi and any real slope.
 * Example: slope 2.35 on [1, 8] with u = 0.5 gives M ≈ 1.60 Msun.
 */
export function powerLawPieceMsun(loMsun: number, hiMsun: number, slope: number, u: number): number {
  return powerLawQuantile(powerLawQuantileTable(loMsun, hiMsun, 1 - slope), u);
}

/**
 * The constants of the inverse CDF of dN ∝ x^(β−1) dx (that is, ∝ x^β dln x) on [lo, hi], so
 * that a draw costs one pow: `log` pieces (β = 0) store ln lo and ln(hi/lo), the others lo^β,
 * hi^β − lo^β and 1/β. Shared by the IMF pieces (β = 1 − slope) and the companion rows
 * (β = the row's exponent in ln x).
 */
export interface PowerLawQuantileTable {
  log: boolean;
  base: number;
  span: number;
  inverseExponent: number;
}

export function powerLawQuantileTable(lo: number, hi: number, beta: number): PowerLawQuantileTable {
  if (Math.abs(beta) < 1e-12) return { log: true, base: Math.log(lo), span: Math.log(hi / lo), inverseExponent: 0 };
  const a = Math.pow(lo, beta);
  return { log: false, base: a, span: Math.pow(hi, beta) - a, inverseExponent: 1 / beta };
}

/** x at cumulative probability u for a table from powerLawQuantileTable. */
export function powerLawQuantile(table: PowerLawQuantileTable, u: number): number {
  // exp(b ln x) rather than Math.pow(x, b): V8's pow costs ~2.5× more, and the two agree to ~1e-14.
  return Math.exp(table.log ? table.base + u * table.span : table.inverseExponent * Math.log(table.base + u * table.span));
}

/** log10 of x at cumulative probability u (the same inverse CDF, without the final exp). */
export function powerLawLog10Quantile(table: PowerLawQuantileTable, u: number): number {
  return (table.log ? table.base + u * table.span : table.inverseExponent * Math.log(table.base + u * table.span)) * Math.LOG10E;
}

/**
 * ∫ M^-slope dM over [lo, hi] (the un-normalised number in a piece), used to weight the
 * pieces of a broken power law. Example: slope 2.35 on [1, 8] gives (1 − 8^-1.35)/1.35 ≈ 0.696.
 */
export function powerLawPieceIntegral(loMsun: number, hiMsun: number, slope: number): number {
  requireInRange('loMsun', loMsun, Number.MIN_VALUE, hiMsun);
  if (!(hiMsun > loMsun)) throw new EngineError('hiMsun', hiMsun, `(${loMsun}, ∞) Msun`);
  const beta = 1 - slope;
  if (Math.abs(beta) < 1e-12) return Math.log(hiMsun / loMsun);
  return (Math.pow(hiMsun, beta) - Math.pow(loMsun, beta)) / beta;
}

/**
 * A continuous broken power law: `slopes[i]` applies between `breaksMsun[i-1]` and
 * `breaksMsun[i]` (the first slope below the first break, the last above the last break).
 * Returns the pieces that overlap [loMsun, hiMsun] with the continuity constants c_i such that
 * dN/dM = c_i M^-slope_i is continuous at every break (c_0 = 1).
 * Example: Kroupa (2001) breaks [0.08, 0.5], slopes [0.3, 1.3, 2.3] on [0.1, 8] gives two
 * pieces, [0.1, 0.5] with c = 0.08 and [0.5, 8] with c = 0.04.
 */
export function brokenPowerLawPieces(
  breaksMsun: readonly number[],
  slopes: readonly number[],
  loMsun: number,
  hiMsun: number,
): { loMsun: number; hiMsun: number; slope: number; coefficient: number }[] {
  if (slopes.length !== breaksMsun.length + 1) {
    throw new EngineError('slopes.length', slopes.length, `exactly breaksMsun.length + 1 = ${breaksMsun.length + 1}`);
  }
  const edges = [0, ...breaksMsun, Infinity];
  const pieces: { loMsun: number; hiMsun: number; slope: number; coefficient: number }[] = [];
  let coefficient = 1;
  for (let i = 0; i < slopes.length; i++) {
    if (i > 0) coefficient *= Math.pow(edges[i], slopes[i] - slopes[i - 1]); // continuity at the break
    const lo = Math.max(edges[i], loMsun);
    const hi = Math.min(edges[i + 1], hiMsun);
    if (hi > lo) pieces.push({ loMsun: lo, hiMsun: hi, slope: slopes[i], coefficient });
  }
  return pieces;
}
