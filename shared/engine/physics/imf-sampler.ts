import { byOption } from '../../contracts/method-option.ts';
import type { ImfOptions } from '../../contracts/scenario.ts';
import { EngineError } from '../errors.ts';
import { CHABRIER_2003, chabrierLognormalPerLog } from './imf-chabrier2003.ts';
import { KROUPA_2001 } from './imf-kroupa2001.ts';
import { tableQuantile, tabulateQuantile, type QuantileTable } from '../numerics/quantile-table.ts';
import { brokenPowerLawPieces, powerLawLog10Quantile, powerLawPieceIntegral, powerLawQuantileTable, type PowerLawQuantileTable } from './imf-power-law.ts';
import { SALPETER_1955 } from './imf-salpeter1955.ts';
import { sharedFloat64Array } from '../numerics/shared-arrays.ts';

/**
 * A power-law piece (its exact inverse CDF, and that inverse CDF of log10 M tabulated when the table
 * meets numerics/quantile-table.ts's tolerance; null = drawn exactly) or a tabulated log-normal
 * piece (log10 M at u = i/(n−1)).
 */
export type ImfPiece =
  | { kind: 'powerlaw'; loMsun: number; hiMsun: number; slope: number; quantile: PowerLawQuantileTable; log10MassTable: QuantileTable | null }
  | { kind: 'table'; loMsun: number; hiMsun: number; log10MassAtU: number[] };

/** Plain-data sampler for one IMF over one mass range; `cumulative[i]` is P(M ≤ piece i's top). */
export interface ImfSampler {
  pieces: ImfPiece[];
  cumulative: number[];
}

/** Nodes of the quadrature behind the tabulated log-normal CDF, and of its inverse table. */
const CDF_NODES = 4097;
const INVERSE_NODES = 2049;

/**
 * Builds the sampler of the scenario's IMF restricted to [lo, hi]: exact inverse CDF for every
 * power-law piece, and for the log-normal part of Chabrier (2003) a CDF tabulated by trapezoidal
 * quadrature in log M (4096 intervals) and inverted onto a uniform grid in u (2048 intervals;
 * linear interpolation between nodes). Example: kroupa2001 on [0.8, 8] gives one piece of slope 2.3.
 */
export function buildImfSampler(imf: ImfOptions, massRangeMsun: readonly [number, number]): ImfSampler {
  const [lo, hi] = massRangeMsun;
  if (!(lo > 0 && hi > lo)) throw new EngineError('primaries.massRangeMsun', massRangeMsun, '0 < low < high');
  const weighted = imfPieces(imf, lo, hi);
  const total = weighted.reduce((s, w) => s + w.weight, 0);
  let running = 0;
  const cumulative = weighted.map((w) => (running += w.weight) / total);
  cumulative[cumulative.length - 1] = 1;
  return { pieces: weighted.map((w) => w.piece), cumulative };
}

function powerLawPiece(loMsun: number, hiMsun: number, slope: number): ImfPiece {
  const quantile = powerLawQuantileTable(loMsun, hiMsun, 1 - slope);
  return { kind: 'powerlaw', loMsun, hiMsun, slope, quantile, log10MassTable: tabulateQuantile((u) => powerLawLog10Quantile(quantile, u)) };
}

type WeightedPiece = { piece: ImfPiece; weight: number };

/** The weighted pieces of each law over [lo, hi]; every law of the contract has its entry (a new one without it does not type-check). */
const imfPieces = byOption<ImfOptions, 'law', WeightedPiece[], [number, number]>('law', {
  powerlaw: (imf, lo, hi) => powerLawPieces({ breaksMsun: [], slopes: [imf.slope] }, lo, hi),
  brokenPowerlaw: (imf, lo, hi) => powerLawPieces(imf, lo, hi),
  salpeter1955: (_imf, lo, hi) => powerLawPieces(SALPETER_1955, lo, hi),
  kroupa2001: (_imf, lo, hi) => powerLawPieces(KROUPA_2001, lo, hi),
  chabrier2003: (_imf, lo, hi) => chabrierPieces(lo, hi),
});

function powerLawPieces(law: { breaksMsun: readonly number[]; slopes: readonly number[] }, lo: number, hi: number): WeightedPiece[] {
  return brokenPowerLawPieces(law.breaksMsun, law.slopes, lo, hi).map((p) => ({
    piece: powerLawPiece(p.loMsun, p.hiMsun, p.slope),
    weight: p.coefficient * powerLawPieceIntegral(p.loMsun, p.hiMsun, p.slope),
  }));
}

/** Chabrier (2003): the tabulated log-normal below its upper mass, the power law above. */
function chabrierPieces(lo: number, hi: number): WeightedPiece[] {
  const weighted: WeightedPiece[] = [];
  const split = CHABRIER_2003.lognormal.upperMsun;
  if (lo < split) {
    const top = Math.min(hi, split);
    const { table, total } = tabulateLognormal(lo, top);
    weighted.push({ piece: { kind: 'table', loMsun: lo, hiMsun: top, log10MassAtU: table }, weight: total });
  }
  if (hi > split) {
    const bottom = Math.max(lo, split);
    const slope = CHABRIER_2003.powerLaw.slopePerLog + 1; // per dM: ξ(log M)/(M ln 10)
    const weight = (CHABRIER_2003.powerLaw.amplitude / Math.LN10) * powerLawPieceIntegral(bottom, hi, slope);
    weighted.push({ piece: powerLawPiece(bottom, hi, slope), weight });
  }
  return weighted;
}

function tabulateLognormal(lo: number, hi: number): { table: number[]; total: number } {
  const x0 = Math.log10(lo);
  const dx = (Math.log10(hi) - x0) / (CDF_NODES - 1);
  const cdf = sharedFloat64Array(CDF_NODES);
  let previous = chabrierLognormalPerLog(lo);
  for (let j = 1; j < CDF_NODES; j++) {
    const current = chabrierLognormalPerLog(Math.pow(10, x0 + j * dx));
    cdf[j] = cdf[j - 1] + 0.5 * (previous + current) * dx;
    previous = current;
  }
  const total = cdf[CDF_NODES - 1];
  const table = new Array<number>(INVERSE_NODES);
  let j = 0;
  for (let i = 0; i < INVERSE_NODES; i++) {
    const target = (i / (INVERSE_NODES - 1)) * total;
    while (j < CDF_NODES - 2 && cdf[j + 1] < target) j++;
    const span = cdf[j + 1] - cdf[j];
    const t = span > 0 ? Math.min(1, Math.max(0, (target - cdf[j]) / span)) : 0;
    table[i] = x0 + (j + t) * dx;
  }
  table[0] = x0;
  table[INVERSE_NODES - 1] = Math.log10(hi);
  return { table, total };
}

/** Draws one initial mass (Msun) from the sampler with one uniform u in [0, 1). */
export function sampleImfMsun(sampler: ImfSampler, u: number): number {
  return Math.exp(sampleImfLog10Msun(sampler, u) * Math.LN10); // 10^x without Math.pow's cost
}

/**
 * log10 of the initial mass (Msun) drawn with the uniform u in [0, 1): the kernel's form, since
 * the main-sequence lifetime is a function of log10 M (no logarithm of the drawn mass needed).
 */
export function sampleImfLog10Msun(sampler: ImfSampler, u: number): number {
  const { pieces, cumulative } = sampler;
  let i = 0;
  while (i < pieces.length - 1 && u >= cumulative[i]) i++;
  const below = i === 0 ? 0 : cumulative[i - 1];
  const v = (u - below) / (cumulative[i] - below); // rescaled uniform inside the piece
  const piece = pieces[i];
  if (piece.kind === 'powerlaw') return piece.log10MassTable ? tableQuantile(piece.log10MassTable, v) : powerLawLog10Quantile(piece.quantile, v);
  const table = piece.log10MassAtU;
  const position = v * (table.length - 1);
  const k = Math.min(table.length - 2, Math.floor(position));
  return table[k] + (position - k) * (table[k + 1] - table[k]);
}
