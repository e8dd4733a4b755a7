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
 * t_MS falls with u (the contract keeps lifetimes falling with mass), so t̃ is linear and falling
 * on every cell: what buildWhiteDwarfDraw relies on.
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

/** Guide-table entries per table cell (Chen & Asau 1974: the search starts at most a few cells before its answer). */
const GUIDE_PER_CELL = 1;

/**
 * The primaries that are white dwarfs today, drawn directly rather than by rejection: a chunk of n
 * primaries holds W ~ Binomial(n, probability) white dwarfs (one uniform, stats/binomial-quantile.ts),
 * and each is drawn from the joint distribution of its mass uniform u and birth time conditioned
 * on t_MS < age. Exact for the tabulated lifetime t̃(u) (linear on each cell, falling with u):
 * - burst of age A: a white dwarf iff u > u*, t̃(u*) = A; u is uniform on (u*, 1), cooling = A − t̃(u);
 * - constant star formation over A: the birth time is uniform, so u has the density
 *   (A − t̃(u))⁺ / (A · probability) — linear on each cell — and the cooling age is uniform on
 *   (0, A − t̃(u)). A cell is chosen through its cumulative weight (a guide table: Chen, H.-C. &
 *   Asau, Y. 1974, Journal of the Chinese Institute of Engineers 24, 115 — from memory; Devroye 1986
 *   §III.2.4), the position inside it by inverting the linear density (a square root).
 * Either way two uniforms per white dwarf (burst: one) replace two per primary plus a rejection, and
 * the counts have exactly the distribution of drawing every primary and keeping the white dwarfs.
 */
export interface WhiteDwarfDraw {
  ageGyr: number;
  /** Probability that a primary is a white dwarf today. */
  probability: number;
  /** burst: the mass uniform u* below which no primary is a white dwarf yet. */
  uLowest: number;
  /** constant: cumulative weight ∫ (A − t̃)⁺ du up to node k (k = 0 … cells), in units of A · cells⁻¹. */
  cumulative: Float64Array;
  /** constant: guide[j] = the cell holding the cumulative weight j / guide.length of the total. */
  guide: Int32Array;
}

export function buildWhiteDwarfDraw(primary: PrimaryTable, history: { constant: boolean; ageGyr: number }): WhiteDwarfDraw {
  const { cells, nodes } = primary;
  const A = history.ageGyr;
  const t = (k: number) => nodes[PRIMARY_STRIDE * k + 1];
  // u* on the tabulated lifetime: the first node below A, and the crossing inside its cell.
  let first = 0;
  while (first <= cells && !(t(first) < A)) first++;
  const uLowest = first > cells ? 1 : first === 0 ? 0 : (first - 1 + (t(first - 1) - A) / (t(first - 1) - t(first))) / cells;
  const cumulative = new Float64Array(cells + 1);
  for (let k = 0; k < cells; k++) cumulative[k + 1] = cumulative[k] + cellWeight(A - t(k), A - t(k + 1));
  const total = cumulative[cells];
  const guide = new Int32Array(cells * GUIDE_PER_CELL);
  let k = 0;
  for (let j = 0; j < guide.length; j++) {
    while (k < cells - 1 && cumulative[k + 1] <= (j / guide.length) * total) k++;
    guide[j] = k;
  }
  const probability = history.constant ? total / (cells * A) : 1 - uLowest;
  return { ageGyr: A, probability: Math.min(1, Math.max(0, probability)), uLowest, cumulative, guide };
}

/** ∫₀¹ max(0, g0 + (g1 − g0) s) ds for a linear g: the weight of one cell (times cells). */
function cellWeight(g0: number, g1: number): number {
  if (g0 >= 0 && g1 >= 0) return 0.5 * (g0 + g1);
  if (g0 <= 0 && g1 <= 0) return 0;
  const positive = g0 > 0 ? g0 : g1;
  return (0.5 * positive * positive) / Math.abs(g1 - g0);
}

/**
 * Position of a white dwarf in the primary table (cell index + fraction, i.e. u · cells) from the
 * next uniform v, for constant star formation: the cell whose cumulative weight brackets v · total,
 * then the inverse of the linear density inside it. Written to out[at] (the kernel keeps its
 * doubles in typed arrays, see run-chunk.ts).
 */
export function whiteDwarfPosition(draw: WhiteDwarfDraw, primary: PrimaryTable, rng: () => number, out: Float64Array, at: number): void {
  const v = rng();
  const { cumulative, guide } = draw;
  const cells = primary.cells;
  const x = v * cumulative[cells];
  let k = guide[(v * guide.length) | 0];
  while (k < cells - 1 && cumulative[k + 1] <= x) k++;
  const weight = cumulative[k + 1] - cumulative[k];
  const r = weight > 0 ? (x - cumulative[k]) / weight : 0;
  const nodes = primary.nodes;
  const g0 = draw.ageGyr - nodes[PRIMARY_STRIDE * k + 1];
  const g1 = draw.ageGyr - nodes[PRIMARY_STRIDE * (k + 1) + 1];
  let s: number;
  if (g0 >= 0) {
    // Density g0 + d s on [0, 1]: s solves g0 s + d s²/2 = r (g0 + d/2), in the form without cancellation.
    const d = g1 - g0;
    const rw = r * (g0 + 0.5 * d);
    s = rw > 0 ? (2 * rw) / (g0 + Math.sqrt(g0 * g0 + 2 * d * rw)) : 0;
  } else {
    // The cell where t̃ crosses A: zero up to s0, then rising linearly to g1.
    const s0 = -g0 / (g1 - g0);
    s = s0 + (1 - s0) * Math.sqrt(r);
  }
  out[at] = k + Math.min(s, 1 - 2 ** -40);
}
