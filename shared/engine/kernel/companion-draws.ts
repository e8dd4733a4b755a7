import { normalQuantile } from '../numerics/normal-quantile.ts';
import { tableQuantile } from '../numerics/quantile-table.ts';
import { flatSample, truncatedLognormalPeriodDays } from '../physics/companion-distribution.ts';
import { powerLawQuantile } from '../physics/imf-power-law.ts';
import type { PreparedRow } from './prepare.ts';

/**
 * A companion's mass (Msun, or the mass ratio q for a ratio row) and initial period (days) from one
 * uniform each, by the row's inverse CDF (physics/companion-distribution.ts): from the tabulated
 * log10 quantile where prepareScenario built one (numerics/quantile-table.ts: Kolmogorov distance
 * to the exact distribution ≤ 1e-7), else exactly. Example: a log-uniform row on [10, 1000] MJup
 * with u = 0.5 gives 100 MJup (in Msun).
 */
export function companionMassDraw(row: PreparedRow, u: number): number {
  if (row.log10MassTable) return Math.exp(tableQuantile(row.log10MassTable, u) * Math.LN10);
  return row.massQuantile ? powerLawQuantile(row.massQuantile, u) : flatSample(row.massLo, row.massHi, u);
}

export function companionPeriodDaysDraw(row: PreparedRow, u: number): number {
  if (row.log10PeriodTable) return Math.exp(tableQuantile(row.log10PeriodTable, u) * Math.LN10);
  return row.periodQuantile
    ? powerLawQuantile(row.periodQuantile, u)
    : truncatedLognormalPeriodDays(row.meanLog10PeriodDays, row.sigmaLog10Period, row.cdfLo, row.cdfSpan, u, normalQuantile);
}
