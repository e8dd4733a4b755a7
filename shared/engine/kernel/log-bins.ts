import { BINS, binIndex, type UniformBins } from './bins.ts';

/** Cells per octave: 2^6 = 64, each at most 2^(1/64) wide (0.0047 dex), far below the narrowest log10 bin of BINS (0.083 dex). */
const CELL_BITS = 6;
/** The high 32 bits of a double hold sign, 11 exponent bits and the top 20 mantissa bits; keep exponent + CELL_BITS mantissa bits. */
const CELL_SHIFT = 20 - CELL_BITS;
/** Float64 ↔ Uint32 view of one double; index of its high word (1 on little-endian machines). */
const scratchDouble = new Float64Array(1);
const scratchWords = new Uint32Array(scratchDouble.buffer);
const HIGH_WORD = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;

/**
 * A lookup that gives binIndex(bins, Math.log10(x)) for x > 0 without computing the logarithm: the
 * tallies' bins are uniform in log10 and a Math.log10 per tallied value was a tenth of the
 * kernel's time. The double's exponent and top mantissa bits (read through a typed-array view, a
 * monotone function of x > 0) pick one of 64 cells per octave; a cell holds at most one bin edge,
 * stored as the smallest double whose log10 lands in the next bin (found by bisection when the
 * lookup is built), so a look-up is one table read and one comparison.
 * Exact: it returns what binIndex(bins, Math.log10(x)) returns for every x > 0 (including values
 * outside the range, which go to the first or last bin), given only that Math.log10 is
 * non-decreasing; log-bins.test.ts checks this at random values and at every edge.
 * Example: for the cooling-age bins (log10 Gyr, −3 to log10 14, 50 bins), x = 1 Gyr gives bin 36.
 */
export interface LogBinLookup {
  /** Cell index of the smallest double in cell 0 (its high word shifted by CELL_SHIFT). */
  firstCell: number;
  /** Bin of the lowest value in each cell. */
  cellBin: Uint8Array;
  /** The smallest value in each cell that lies in the next bin; Infinity if the cell holds no edge. */
  cellEdge: Float64Array;
}

/** The cell of x > 0 before the offset: a monotone integer function of x. */
function rawCell(x: number): number {
  scratchDouble[0] = x;
  return scratchWords[HIGH_WORD] >>> CELL_SHIFT;
}

export function buildLogBinLookup(bins: UniformBins): LogBinLookup {
  if (bins.count > 255) throw new RangeError(`bins.count = ${bins.count} is outside the allowed range [1, 255]`);
  const binOf = (x: number) => binIndex(bins, Math.log10(x));
  // One octave of margin on each side; beyond it every value is in the first or last bin.
  const lowOctave = Math.floor(bins.lo * Math.log2(10)) - 1;
  const highOctave = Math.ceil(bins.hi * Math.log2(10)) + 1;
  const firstCell = rawCell(2 ** lowOctave);
  const cells = rawCell(2 ** highOctave) - firstCell;
  const cellBin = new Uint8Array(cells);
  const cellEdge = new Float64Array(cells).fill(Infinity);
  const cellStart = (c: number) => 2 ** (lowOctave + Math.floor(c / 2 ** CELL_BITS)) * (1 + (c % 2 ** CELL_BITS) / 2 ** CELL_BITS);
  for (let c = 0; c < cells; c++) {
    const lo = cellStart(c);
    const next = cellStart(c + 1);
    cellBin[c] = binOf(lo);
    if (binOf(next) === cellBin[c]) continue; // the bin is non-decreasing in x: the whole cell is in one bin
    // Bisection on doubles, keeping binOf(a) = cellBin[c] < binOf(b), until a and b are neighbours.
    let a = lo;
    let b = next;
    for (;;) {
      const mid = a + (b - a) / 2;
      if (mid === a || mid === b) break;
      if (binOf(mid) === cellBin[c]) a = mid;
      else b = mid;
    }
    if (b < next) cellEdge[c] = b; // else the edge is the next cell's start, where that cell's bin begins
  }
  return { firstCell, cellBin, cellEdge };
}

/** binIndex(bins, Math.log10(x)) for x > 0, from the lookup built for those bins. */
export function logBinIndex(lookup: LogBinLookup, x: number): number {
  const cell = rawCell(x) - lookup.firstCell;
  if (cell < 0) return lookup.cellBin[0];
  if (cell >= lookup.cellBin.length) return lookup.cellBin[lookup.cellBin.length - 1];
  return lookup.cellBin[cell] + (x >= lookup.cellEdge[cell] ? 1 : 0);
}

/** The lookups of the tallies' log10 bins (BINS), built once when the module loads (in every worker). */
export const LOG_BIN_LOOKUPS = {
  log10CoolingAgeGyr: buildLogBinLookup(BINS.log10CoolingAgeGyr),
  log10PostCEPeriodDays: buildLogBinLookup(BINS.log10PostCEPeriodDays),
  log10SeparationAU: buildLogBinLookup(BINS.log10SeparationAU),
};
