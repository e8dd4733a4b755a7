import { normalQuantile } from '../numerics/normal-quantile.ts';
import { tableQuantile } from '../numerics/quantile-table.ts';
import { flatSample, truncatedLognormalPeriodDays } from '../physics/companion-distribution.ts';
import { powerLawQuantile } from '../physics/imf-power-law.ts';
import type { PreparedRow } from './prepare.ts';

/**
 * A companion's mass and initial period from one uniform each, by the row's inverse CDF
 * (physics/companion-distribution.ts). Where prepareScenario tabulated the quantile
 * (numerics/quantile-table.ts: Kolmogorov distance to the exact distribution ≤ 1e-7) the draw is
 * log10 of the quantity, read off the table, and the kernel takes 10^x only if it needs the value
 * itself; otherwise the draw is the quantity, computed exactly.
 * Example: a log-uniform row on [10, 1000] MJup with u = 0.5 gives log10 M = log10(100 MJup in Msun).
 */

/** log10 of the mass (Msun, or of the mass ratio q for a ratio row); only for a row with row.log10MassTable. */
export function companionLog10MassDraw(row: PreparedRow, u: number): number {
  return tableQuantile(row.log10MassTable!, u);
}

/** The mass (Msun, or the mass ratio q), exactly; for a row without a mass table. */
export function companionMassDraw(row: PreparedRow, u: number): number {
  return row.massQuantile ? powerLawQuantile(row.massQuantile, u) : flatSample(row.massLo, row.massHi, u);
}

/** log10 of the initial period (days); only for a row with row.log10PeriodTable. */
export function companionLog10PeriodDraw(row: PreparedRow, u: number): number {
  return tableQuantile(row.log10PeriodTable!, u);
}

/** The initial period (days), exactly; for a row without a period table. */
export function companionPeriodDaysDraw(row: PreparedRow, u: number): number {
  return row.periodQuantile
    ? powerLawQuantile(row.periodQuantile, u)
    : truncatedLognormalPeriodDays(row.meanLog10PeriodDays, row.sigmaLog10Period, row.cdfLo, row.cdfSpan, u, normalQuantile);
}
