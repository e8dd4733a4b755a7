import { EngineError } from '../errors.ts';
import { QUANTILE_TABLE_TOLERANCE, tabulateQuantiles } from '../numerics/quantile-table.ts';
import { sampleImfLog10Msun, type ImfSampler } from '../physics/imf-sampler.ts';
import { lifetimeAtLog10MassGyr, type PreparedLifetime } from './scenario-physics.ts';

/** Most cells the primary table may take (a power of two: u · cells and k / cells are exact). */
const MAX_CELLS = 65536;
/** Entries per node: mass (Msun), main-sequence lifetime (Gyr), log10 of the node's mass. */
export const PRIMARY_STRIDE = 3;

/**
 * The primary star as a function of its mass uniform u: initial mass M(u) (the IMF's inverse
 * CDF) and main-sequence lifetime t_MS(M(u)), tabulated on one grid in u and interpolated
 * linearly, so that a primary costs one cell look-up and two multiply-adds instead of the IMF
 * quantile and two exponentials (the inversion method by table, Devroye 1986, Non-Uniform Random
 * Variate Generation, §II.2; see numerics/quantile-table.ts for the accuracy rule).
 *
 * Accuracy: both columns meet the quantile tables' rule, |u' − u| ≤ 1e-7 where u' is the uniform
 * at which the exact function takes the interpolated value. So the probability of any interval of
 * initial mass, and of "t_MS < age" (a white dwarf today) for any age, moves by at most 2e-7, and
 * the lifetime read off is the exact lifetime at a uniform within 1e-7: for Kroupa (2001) on
 * [0.8, 8] Msun with t_MS = 10 Gyr M^-2.5 that is at most 3e-6 Gyr (3 kyr) of cooling age.
 *
 * Layout: nodes[3k] = M(k / cells), nodes[3k + 1] = t_MS there, nodes[3k + 2] = log10 of that
 * mass (exact, Math.log10): a lower bound of log10 M for every u in cell k (M rises with u),
 * which lets the kernel tell an orbit far outside the engulfment reach without a logarithm.
 * t_MS falls with u (the contract keeps lifetimes falling with mass), so on cell k the
 * interpolated lifetime is at least the node value at k + 1: an age at or below that node's
 * lifetime rejects the primary without interpolating (the squeeze principle of rejection
 * sampling, Marsaglia 1977, Computers & Mathematics with Applications 3, 321).
 */
export interface PrimaryTable {
  cells: number;
  nodes: Float64Array;
  /** Largest |u' − u| over both columns. */
  maxCdfError: number;
}

export function buildPrimaryTable(imf: ImfSampler, lifetime: PreparedLifetime): PrimaryTable {
  const log10Mass = (u: number) => sampleImfLog10Msun(imf, u);
  const tables = tabulateQuantiles(
    [(u) => 10 ** log10Mass(u), (u) => -lifetimeAtLog10MassGyr(lifetime, log10Mass(u))],
    QUANTILE_TABLE_TOLERANCE,
    MAX_CELLS,
  );
  if (!tables) {
    throw new EngineError('primaries', 'imf / lifetime', `a primary mass and lifetime that can be tabulated in ${MAX_CELLS} cells to within ${QUANTILE_TABLE_TOLERANCE} in probability (a lifetime that does not fall with mass, or an extreme IMF piece)`);
  }
  const { cells, values } = tables;
  const nodes = new Float64Array(PRIMARY_STRIDE * (cells + 1));
  for (let k = 0; k <= cells; k++) {
    nodes[PRIMARY_STRIDE * k] = values[0][k];
    nodes[PRIMARY_STRIDE * k + 1] = -values[1][k];
    nodes[PRIMARY_STRIDE * k + 2] = Math.log10(values[0][k]);
  }
  return { cells, nodes, maxCdfError: tables.maxCdfError };
}
