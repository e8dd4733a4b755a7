/**
 * An inverse CDF tabulated on a uniform grid in u and interpolated linearly: the table form of
 * the inversion method (Devroye 1986, Non-Uniform Random Variate Generation, Springer, §II.2;
 * numerical inversion by interpolation as in Hörmann & Leydold 2003, ACM Transactions on Modeling
 * and Computer Simulation 13, 347 — from memory), so that a draw costs one table look-up instead
 * of the transcendental calls of the exact quantile. The tabulated quantity is whatever smooth,
 * non-decreasing function of u the caller passes (the engine tabulates log10 of masses and periods,
 * which are smooth in u where the quantities themselves span decades).
 *
 * Accuracy, stated in the units that matter for a Monte Carlo count: a draw x̃(u) from the table
 * is the exact quantile at u' = F(x̃(u)); the table is accepted only if |u' − u| ≤ `tolerance` (the
 * default 1e-7) at the midpoint and quarter points of every cell, where the error of linear
 * interpolation of a smooth function peaks. |u' − u| ≤ ε bounds the Kolmogorov distance between
 * the tabulated and the exact distribution by ε, so the probability of any event x ∈ [a, b]
 * changes by at most 2ε. The grid doubles from 512 cells up to 16384; if even that misses the
 * tolerance, there is no table (null) and the caller keeps the exact quantile.
 * Valid for any quantile that is finite and non-decreasing on [0, 1].
 * Example: the log10 quantile of dN ∝ P^0.26 dln P on [2, 2000] d needs 4096 cells (largest |u′ − u| ≈ 3.7e-8).
 */
export interface QuantileTable {
  cells: number;
  /** The quantile at u = k / cells, k = 0 … cells. */
  values: Float64Array;
  /** Largest |u' − u| found when the table was built. */
  maxCdfError: number;
}

const MIN_CELLS = 512;
const MAX_CELLS = 16384;
export const QUANTILE_TABLE_TOLERANCE = 1e-7;

export function tabulateQuantile(quantile: (u: number) => number, tolerance = QUANTILE_TABLE_TOLERANCE): QuantileTable | null {
  const tables = tabulateQuantiles([quantile], tolerance);
  return tables && { cells: tables.cells, values: tables.values[0], maxCdfError: tables.maxCdfError };
}

/**
 * Several functions of the same uniform tabulated on one grid (so that one cell index serves them
 * all), each under the accuracy rule above: the grid doubles from 512 cells up to `maxCells` until
 * every function meets `tolerance`; null if one of them is not finite and non-decreasing or
 * misses it even then. Example: the primary's mass and (negated) main-sequence lifetime as
 * functions of the mass uniform (kernel/primary-table.ts).
 */
export function tabulateQuantiles(
  quantiles: readonly ((u: number) => number)[],
  tolerance = QUANTILE_TABLE_TOLERANCE,
  maxCells = MAX_CELLS,
): { cells: number; values: Float64Array[]; maxCdfError: number } | null {
  for (let cells = MIN_CELLS; cells <= maxCells; cells *= 2) {
    const values: Float64Array[] = [];
    let worst = 0;
    for (const quantile of quantiles) {
      const table = { cells, values: new Float64Array(cells + 1), maxCdfError: 0 };
      for (let k = 0; k <= cells; k++) table.values[k] = quantile(k / cells);
      if (!table.values.every(Number.isFinite)) return null;
      const error = worstCdfError(table, quantile, tolerance);
      if (error === null) return null;
      worst = Math.max(worst, error);
      if (worst > tolerance) break;
      values.push(table.values);
    }
    if (worst <= tolerance) return { cells, values, maxCdfError: worst };
  }
  return null;
}

/** Largest |u' − u| of the table at the quarter points of its cells (stops early past `stopAbove`); null if the quantile falls. */
function worstCdfError(table: QuantileTable, quantile: (u: number) => number, stopAbove: number): number | null {
  const { cells, values } = table;
  let worst = 0;
  for (let k = 0; k < cells && worst <= stopAbove; k++) {
    const slope = (values[k + 1] - values[k]) * cells; // dx/du across the cell
    if (!(slope >= 0)) return null;
    for (const t of [0.25, 0.5, 0.75]) {
      const u = (k + t) / cells;
      const error = Math.abs(tableQuantile(table, u) - quantile(u));
      // Secant-slope conversion to u units; a flat cell (slope 0) with an error is a failure.
      const cdfError = error === 0 ? 0 : slope > 0 ? error / slope : Infinity;
      if (cdfError > worst) worst = cdfError;
    }
  }
  return worst;
}

/** The tabulated quantile at u in [0, 1]. */
export function tableQuantile(table: QuantileTable, u: number): number {
  const position = u * table.cells;
  const k = position < table.cells ? position | 0 : table.cells - 1;
  const values = table.values;
  return values[k] + (position - k) * (values[k + 1] - values[k]);
}
