import canonicalize from 'canonicalize';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
import type { GiantTrackOptions } from '../../contracts/giant-track.ts';
import { EngineError, requireInRange } from '../errors.ts';
import { criticalSeparationOnTrackAU } from './critical-separation.ts';
import { buildGiantTrack, type GiantTrack } from './giant-track.ts';

/**
 * Version of the grid algorithm, part of the cache key: bump it whenever the physics or the
 * numerics of the track, the orbit integration or the tables change.
 */
const ALGORITHM_VERSION = 'tidefield-engulfment-grid/1';
/**
 * Samples per primary node of the envelope-at-radius table, uniform in ln R (≈ 2% in R apart).
 * The first-crossing state jumps where the AGB first outgrows the red-giant tip (the core mass
 * jumps from 0.47 to the AGB's); linear interpolation smears that jump over one sample step.
 */
const ENVELOPE_SAMPLES = 256;

export interface EngulfmentGridInput {
  /** Ascending grid nodes in initial primary mass, Msun (0.8–8). */
  primaryMassesMsun: number[];
  /** IFMR white-dwarf mass at each primary node, Msun: the track ends when the core reaches it. */
  finalCoreMassesMsun: number[];
  /** Ascending grid nodes in companion mass, Msun (10⁻⁵–2). */
  companionMassesMsun: number[];
  /** Parsed options from shared/contracts/giant-track.ts. */
  track: GiantTrackOptions;
}

/**
 * The engulfment boundary and envelope tables on the (M1, M2) grid; plain data only.
 * Row-major tables: entry (i, j) of an M1 × M2 table sits at i · M2count + j; entry (i, k) of
 * a per-primary table at i · envelopeSamples + k.
 */
export interface EngulfmentGrid {
  algorithmVersion: string;
  /** engulfmentGridKey of the input this grid was built from. */
  key: string;
  /** ln(M1 / Msun) at the primary nodes. */
  logPrimaryMass: number[];
  /** ln(M2 / Msun) at the companion nodes. */
  logCompanionMass: number[];
  /** ln(a_crit / AU), M1 × M2, row-major. */
  logCriticalSeparationAU: number[];
  envelopeSamples: number;
  /** ln(R / AU) at the first and at the largest radius of each primary's track. */
  logRadiusStartAU: number[];
  logRadiusMaxAU: number[];
  /** Core and total mass (Msun) the first time the radius reaches each sample, uniform in ln R from start to max. */
  envelopeCoreMassMsun: number[];
  envelopeTotalMassMsun: number[];
}

/**
 * Cache key of an engulfment grid: hex SHA-256 (FIPS 180-4) of the RFC 8785 canonical JSON of
 * { algorithmVersion, input }. Same physics in, same key out, on every machine.
 * Example: two inputs differing only in reimersEta (0.477 vs 0.5) get different keys.
 */
export function engulfmentGridKey(input: EngulfmentGridInput): string {
  validateInput(input);
  const json = canonicalize({ algorithmVersion: ALGORITHM_VERSION, input });
  if (json === undefined) throw new EngineError('input', input, 'a JSON-serialisable object');
  return bytesToHex(sha256(utf8ToBytes(json)));
}

/**
 * Builds the engulfment grid: for every primary node its analytic giant track (giant-track.ts)
 * and for every companion node the critical separation a_crit (critical-separation.ts, a
 * bisection on the orbit ODE, relative precision 5×10⁻⁴), plus the envelope-at-radius table.
 * Cost: one track per primary node and ~20 orbit integrations per (M1, M2) node.
 * Units: masses in Msun. Example: 24 primaries (0.8–8 Msun) × 16 companions (10⁻⁴–1 Msun).
 */
export function buildEngulfmentGrid(input: EngulfmentGridInput): EngulfmentGrid {
  const key = engulfmentGridKey(input);
  const { primaryMassesMsun, finalCoreMassesMsun, companionMassesMsun, track: options } = input;
  const logCriticalSeparationAU: number[] = [];
  const logRadiusStartAU: number[] = [];
  const logRadiusMaxAU: number[] = [];
  const envelopeCoreMassMsun: number[] = [];
  const envelopeTotalMassMsun: number[] = [];
  for (let i = 0; i < primaryMassesMsun.length; i++) {
    const track = buildGiantTrack(primaryMassesMsun[i], finalCoreMassesMsun[i], options);
    let hint = 0;
    for (const m2 of companionMassesMsun) {
      // Companions ascend, and a heavier companion is engulfed wherever a lighter one is.
      hint = criticalSeparationOnTrackAU(track, m2, options.tide, hint);
      logCriticalSeparationAU.push(Math.log(hint));
    }
    appendEnvelopeTable(track, logRadiusStartAU, logRadiusMaxAU, envelopeCoreMassMsun, envelopeTotalMassMsun);
  }
  return {
    algorithmVersion: ALGORITHM_VERSION,
    key,
    logPrimaryMass: primaryMassesMsun.map(Math.log),
    logCompanionMass: companionMassesMsun.map(Math.log),
    logCriticalSeparationAU,
    envelopeSamples: ENVELOPE_SAMPLES,
    logRadiusStartAU,
    logRadiusMaxAU,
    envelopeCoreMassMsun,
    envelopeTotalMassMsun,
  };
}

/**
 * Largest initial separation (AU) that is engulfed for this (M1, M2): bilinear interpolation
 * in (ln M1, ln M2) of ln a_crit; inputs outside the grid are clamped to its edge.
 * Allocation-free: it runs in the hot loop millions of times per second.
 * Units: masses in Msun (> 0). Example: on a grid built with default options, (1, 0.001) → ≈ 2.5 AU.
 */
export function criticalSeparationAU(grid: EngulfmentGrid, m1Msun: number, m2Msun: number): number {
  if (!(m1Msun > 0 && m1Msun < Infinity)) throw new EngineError('m1Msun', m1Msun, '(0, ∞) Msun');
  if (!(m2Msun > 0 && m2Msun < Infinity)) throw new EngineError('m2Msun', m2Msun, '(0, ∞) Msun');
  const xs = grid.logPrimaryMass;
  const ys = grid.logCompanionMass;
  const x = clamp(Math.log(m1Msun), xs[0], xs[xs.length - 1]);
  const y = clamp(Math.log(m2Msun), ys[0], ys[ys.length - 1]);
  const i = lowerNode(xs, x);
  const j = lowerNode(ys, y);
  const wx = (x - xs[i]) / (xs[i + 1] - xs[i]);
  const wy = (y - ys[j]) / (ys[j + 1] - ys[j]);
  const table = grid.logCriticalSeparationAU;
  const row = ys.length;
  const v00 = table[i * row + j];
  const v01 = table[i * row + j + 1];
  const v10 = table[(i + 1) * row + j];
  const v11 = table[(i + 1) * row + j + 1];
  return Math.exp((1 - wx) * ((1 - wy) * v00 + wy * v01) + wx * ((1 - wy) * v10 + wy * v11));
}

/**
 * The primary's state the first time its radius reaches radiusAU along the track, for the
 * common-envelope energy budget: writes [core mass Msun, total mass Msun, radius used AU] into
 * `out` (length ≥ 3) and returns it. The radius used is radiusAU clamped to the range the track
 * spans at this M1 (from its first radius to the largest it reaches, both interpolated in ln M1).
 * Between primary nodes each node's table is read at that radius (clamped to the node's own
 * range) and the two states are blended linearly in ln M1. The first-crossing state jumps where
 * the AGB outgrows the red-giant tip; between nodes that jump is smeared over the radii between
 * the two nodes' tip radii (a few per cent in R). Allocation-free.
 * Units: m1 in Msun (> 0, clamped to the grid), radius in AU (> 0).
 * Example: default 24-node grid, M1 = 1, R = 0.9 AU (just below its red-giant tip at ≈ 0.95 AU)
 * → ≈ [0.464, 0.748, 0.9].
 */
export function envelopeAtRadius(grid: EngulfmentGrid, m1Msun: number, radiusAU: number, out: Float64Array): Float64Array {
  if (!(m1Msun > 0 && m1Msun < Infinity)) throw new EngineError('m1Msun', m1Msun, '(0, ∞) Msun');
  if (!(radiusAU > 0 && radiusAU < Infinity)) throw new EngineError('radiusAU', radiusAU, '(0, ∞) AU');
  if (out.length < 3) throw new EngineError('out.length', out.length, '[3, ∞)');
  const xs = grid.logPrimaryMass;
  const x = clamp(Math.log(m1Msun), xs[0], xs[xs.length - 1]);
  const i = lowerNode(xs, x);
  const wx = (x - xs[i]) / (xs[i + 1] - xs[i]);
  const starts = grid.logRadiusStartAU;
  const maxima = grid.logRadiusMaxAU;
  const lnR = clamp(Math.log(radiusAU), (1 - wx) * starts[i] + wx * starts[i + 1], (1 - wx) * maxima[i] + wx * maxima[i + 1]);
  const samples = grid.envelopeSamples;
  // Each node is read at the same radius, clamped to its own range, then the two are blended.
  const p0 = tablePosition(lnR, starts[i], maxima[i], samples);
  const p1 = tablePosition(lnR, starts[i + 1], maxima[i + 1], samples);
  out[0] = (1 - wx) * tableValue(grid.envelopeCoreMassMsun, i * samples, p0, samples) + wx * tableValue(grid.envelopeCoreMassMsun, (i + 1) * samples, p1, samples);
  out[1] = (1 - wx) * tableValue(grid.envelopeTotalMassMsun, i * samples, p0, samples) + wx * tableValue(grid.envelopeTotalMassMsun, (i + 1) * samples, p1, samples);
  out[2] = Math.exp(lnR);
  return out;
}

/** Fractional index in a node's table of samples uniform in ln R over [start, max], clamped to the table. */
function tablePosition(lnR: number, start: number, max: number, samples: number): number {
  if (!(max > start)) return 0;
  return clamp(((lnR - start) / (max - start)) * (samples - 1), 0, samples - 1);
}

/** Linear interpolation at a fractional position in the row of `samples` values starting at offset. */
function tableValue(table: number[], offset: number, position: number, samples: number): number {
  const k = Math.min(Math.floor(position), samples - 2);
  const w = position - k;
  return (1 - w) * table[offset + k] + w * table[offset + k + 1];
}

/** The first-crossing table of one track: core and total mass the first time R reaches each sample radius. */
function appendEnvelopeTable(track: GiantTrack, starts: number[], maxima: number[], cores: number[], totals: number[]): void {
  const { radiusAU, coreMassMsun, massMsun } = track;
  const largest = Math.max(...radiusAU);
  const start = Math.log(radiusAU[0]);
  const max = Math.log(largest);
  starts.push(start);
  maxima.push(max);
  // k scans the nodes once: the first node at or above a radius never moves back as the radius grows.
  let k = 0;
  for (let s = 0; s < ENVELOPE_SAMPLES; s++) {
    // min(): exp(log(x)) may round above x, and the last sample must find the largest node.
    const r = s === ENVELOPE_SAMPLES - 1 ? largest : Math.min(largest, Math.exp(start + ((max - start) * s) / (ENVELOPE_SAMPLES - 1)));
    while (k < radiusAU.length - 1 && radiusAU[k] < r) k++;
    if (k === 0 || radiusAU[k] < r) {
      cores.push(coreMassMsun[k]);
      totals.push(massMsun[k]);
      continue;
    }
    // Node k is the first to reach r and node k − 1 is below it: interpolate the crossing.
    const w = (r - radiusAU[k - 1]) / (radiusAU[k] - radiusAU[k - 1]);
    cores.push(coreMassMsun[k - 1] + w * (coreMassMsun[k] - coreMassMsun[k - 1]));
    totals.push(massMsun[k - 1] + w * (massMsun[k] - massMsun[k - 1]));
  }
}

function validateInput(input: EngulfmentGridInput): void {
  requireAscending('primaryMassesMsun', input.primaryMassesMsun, 0.8, 8);
  requireAscending('companionMassesMsun', input.companionMassesMsun, 1e-5, 2);
  const finals = input.finalCoreMassesMsun;
  if (!Array.isArray(finals) || finals.length !== input.primaryMassesMsun.length) {
    throw new EngineError('finalCoreMassesMsun.length', Array.isArray(finals) ? finals.length : finals, `${input.primaryMassesMsun.length} (one per primary node)`);
  }
  finals.forEach((mf, i) => {
    const m1 = input.primaryMassesMsun[i];
    if (!(mf >= 0.3 && mf <= 1.44 && mf < m1)) {
      throw new EngineError(`finalCoreMassesMsun[${i}]`, mf, `[0.3, ${Math.min(1.44, m1)}] Msun and below the primary mass ${m1}`);
    }
  });
  // The options arrive over worker messages and caches as plain data: check them as unknown.
  const track = input.track as { kind?: unknown; reimersEta?: unknown; superwind?: { kind?: unknown; eta?: unknown }; tide?: { kind?: unknown } };
  if (track?.kind !== 'track') throw new EngineError('track.kind', track?.kind, '"track"');
  requireInRange('track.reimersEta', track.reimersEta as number, 0.05, 3);
  const superwind = track.superwind?.kind;
  if (superwind === 'bloecker1995') requireInRange('track.superwind.eta', track.superwind?.eta as number, 0.001, 1);
  else if (superwind !== 'none') throw new EngineError('track.superwind.kind', superwind, '"bloecker1995" | "none"');
  const tide = track.tide?.kind;
  if (tide !== 'zahn1977' && tide !== 'none') throw new EngineError('track.tide.kind', tide, '"zahn1977" | "none"');
}

function requireAscending(name: string, nodes: number[], lo: number, hi: number): void {
  if (!Array.isArray(nodes) || nodes.length < 2 || nodes.length > 1000) {
    throw new EngineError(`${name}.length`, Array.isArray(nodes) ? nodes.length : nodes, '[2, 1000] nodes');
  }
  nodes.forEach((value, i) => {
    requireInRange(`${name}[${i}]`, value, lo, hi, 'Msun');
    if (i > 0 && !(value > nodes[i - 1])) {
      throw new EngineError(`${name}[${i}]`, value, `(${nodes[i - 1]}, ${hi}] Msun (strictly ascending)`);
    }
  });
}

function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

/** Index i of the interval [nodes[i], nodes[i + 1]] holding x (x within the nodes), by bisection. */
function lowerNode(nodes: number[], x: number): number {
  let lo = 0;
  let hi = nodes.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (nodes[mid] <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}
