import canonicalize from 'canonicalize';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
import type { GiantTrackOptions } from '../../contracts/scenario.ts';
import { EngineError, requireInRange } from '../errors.ts';
import { sharedFloat64Array } from '../numerics/shared-arrays.ts';
import { criticalSeparationOnTrackAU } from './critical-separation.ts';
import { buildGiantTrack } from './giant-track.ts';
import { evolveOrbitAlongTrack } from './orbit-evolution.ts';

/**
 * Version of the grid algorithm, part of the cache key: bump it whenever the physics or the
 * numerics of the track, the orbit integration or the tables change.
 */
const ALGORITHM_VERSION = 'tidefield-engulfment-grid/2';
/**
 * Samples per (M1, M2) node of the onset table, uniform in x = ln(a0 / a_crit) from
 * ONSET_LOG_RATIO_MIN to ONSET_LOG_RATIO_MAX (≈ 0.095 in x, 10% in a0, apart). The onset state
 * jumps where an orbit that escapes the red-giant tip is caught on the AGB (the core mass jumps
 * from ≈ 0.47 to the AGB's); linear interpolation smears that jump over one sample step.
 */
const ONSET_SAMPLES = 64;
/** x = ln(a0/a_crit) of the first sample: a0 = a_crit/400, inside the giant's Roche lobe at the track's start for every grid node (below it the state is the start's). */
const ONSET_LOG_RATIO_MIN = -6;
/** x of the last sample, just inside a_crit (its bisection tolerance is 5×10⁻⁴ in ln a). */
const ONSET_LOG_RATIO_MAX = -1e-3;

export interface EngulfmentGridInput {
  /** Ascending grid nodes in initial primary mass, Msun (0.8–8). */
  primaryMassesMsun: number[];
  /** IFMR white-dwarf mass at each primary node, Msun: the track ends when the core reaches it. */
  finalCoreMassesMsun: number[];
  /** Ascending grid nodes in companion mass, Msun (10⁻⁵–2). */
  companionMassesMsun: number[];
  /** Parsed options of the giant track (its schema: GIANT_CHOICE in shared/contracts/method-choices.ts). */
  track: GiantTrackOptions;
}

/**
 * The engulfment boundary and envelope tables on the (M1, M2) grid, with its tables as `Table`.
 * Row-major tables: entry (i, j) of an M1 × M2 table sits at i · M2count + j; entry (i, k) of
 * a per-primary table at i · envelopeSamples + k.
 */
export interface EngulfmentGridOf<Table extends ArrayLike<number>> {
  algorithmVersion: string;
  /** engulfmentGridKey of the input this grid was built from. */
  key: string;
  /** ln(M1 / Msun) at the primary nodes. */
  logPrimaryMass: Table;
  /** ln(M2 / Msun) at the companion nodes. */
  logCompanionMass: Table;
  /** ln(a_crit / AU), M1 × M2, row-major. */
  logCriticalSeparationAU: Table;
  /** Samples per (M1, M2) node of the onset tables, uniform in x = ln(a0/a_crit) over [onsetLogRatioMin, onsetLogRatioMax]. */
  onsetSamples: number;
  onsetLogRatioMin: number;
  onsetLogRatioMax: number;
  /**
   * The giant's state at the onset of the common envelope (it fills its Roche lobe towards the
   * companion on the tidally decaying orbit), entry ((i · M2count) + j) · onsetSamples + k:
   * core mass and total mass (Msun), radius and orbital separation (AU) at that moment.
   */
  onsetCoreMassMsun: Table;
  onsetStarMassMsun: Table;
  onsetRadiusAU: Table;
  onsetSeparationAU: Table;
}

/** The grid as plain data: how it is built, cached (JSON) and handed to a thread. */
export type EngulfmentGrid = EngulfmentGridOf<number[]>;

/**
 * The grid as the kernel holds it: every table a Float64Array on shared memory where the platform
 * has it (numerics/shared-arrays.ts), so the prepared scenario sent to a worker with each batch
 * shares the ≈ 0.9 MB of tables instead of copying them.
 */
export type SharedEngulfmentGrid = EngulfmentGridOf<Float64Array>;

/** The kernel's form of a grid (see SharedEngulfmentGrid); a grid already in that form is returned as it is. */
export function sharedEngulfmentGrid(grid: EngulfmentGrid | SharedEngulfmentGrid): SharedEngulfmentGrid {
  const shared = (t: ArrayLike<number>) => {
    if (t instanceof Float64Array) return t;
    const out = sharedFloat64Array(t.length);
    out.set(t);
    return out;
  };
  return {
    ...grid,
    logPrimaryMass: shared(grid.logPrimaryMass),
    logCompanionMass: shared(grid.logCompanionMass),
    logCriticalSeparationAU: shared(grid.logCriticalSeparationAU),
    onsetCoreMassMsun: shared(grid.onsetCoreMassMsun),
    onsetStarMassMsun: shared(grid.onsetStarMassMsun),
    onsetRadiusAU: shared(grid.onsetRadiusAU),
    onsetSeparationAU: shared(grid.onsetSeparationAU),
  };
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
 * bisection on the orbit ODE, relative precision 5×10⁻⁴), plus the onset table: the giant's
 * state at the onset of the common envelope for 64 initial separations from a_crit/400 to a_crit.
 * Cost: one track per primary node and ~20 + 64 orbit integrations per (M1, M2) node.
 * Units: masses in Msun. Example: 24 primaries (0.8–8 Msun) × 16 companions (10⁻⁴–1 Msun).
 */
export function buildEngulfmentGrid(input: EngulfmentGridInput): EngulfmentGrid {
  const key = engulfmentGridKey(input);
  const { primaryMassesMsun, finalCoreMassesMsun, companionMassesMsun, track: options } = input;
  const logCriticalSeparationAU: number[] = [];
  const onsetCoreMassMsun: number[] = [];
  const onsetStarMassMsun: number[] = [];
  const onsetRadiusAU: number[] = [];
  const onsetSeparationAU: number[] = [];
  for (let i = 0; i < primaryMassesMsun.length; i++) {
    const track = buildGiantTrack(primaryMassesMsun[i], finalCoreMassesMsun[i], options);
    let hint = 0;
    for (const m2 of companionMassesMsun) {
      // Companions ascend, and a heavier companion is engulfed wherever a lighter one is.
      hint = criticalSeparationOnTrackAU(track, m2, options.tide, hint);
      logCriticalSeparationAU.push(Math.log(hint));
      for (let k = 0; k < ONSET_SAMPLES; k++) {
        const x = ONSET_LOG_RATIO_MIN + ((ONSET_LOG_RATIO_MAX - ONSET_LOG_RATIO_MIN) * k) / (ONSET_SAMPLES - 1);
        // One direct integration per sample, stopped at the onset (the hot loop interpolates).
        const onset = evolveOrbitAlongTrack(track, m2, hint * Math.exp(x), options.tide);
        onsetCoreMassMsun.push(onset.coreMassMsun);
        onsetStarMassMsun.push(onset.starMassMsun);
        onsetRadiusAU.push(onset.radiusAU);
        onsetSeparationAU.push(onset.separationAU);
      }
    }
  }
  return {
    algorithmVersion: ALGORITHM_VERSION,
    key,
    logPrimaryMass: primaryMassesMsun.map(Math.log),
    logCompanionMass: companionMassesMsun.map(Math.log),
    logCriticalSeparationAU,
    onsetSamples: ONSET_SAMPLES,
    onsetLogRatioMin: ONSET_LOG_RATIO_MIN,
    onsetLogRatioMax: ONSET_LOG_RATIO_MAX,
    onsetCoreMassMsun,
    onsetStarMassMsun,
    onsetRadiusAU,
    onsetSeparationAU,
  };
}

/**
 * Largest initial separation (AU) that is engulfed for this (M1, M2): bilinear interpolation
 * in (ln M1, ln M2) of ln a_crit; inputs outside the grid are clamped to its edge.
 * Allocation-free: it runs in the hot loop millions of times per second.
 * Units: masses in Msun (> 0). Example: on a grid built with default options, (1, 0.001) → ≈ 2.5 AU.
 */
export function criticalSeparationAU(grid: EngulfmentGridOf<ArrayLike<number>>, m1Msun: number, m2Msun: number): number {
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
 * The giant's state at the onset of the common envelope for a companion of mass m2 starting at
 * a0: returns false (and leaves `out` alone) if a0 ≥ a_crit(M1, M2) — no common envelope — and
 * otherwise writes [core mass Msun, total mass Msun, radius AU, separation AU] at the onset into
 * `out` (length ≥ 4) and returns true. The state is read from the onset tables at
 * x = ln(a0 / a_crit): linearly between the x samples of each of the four surrounding
 * (ln M1, ln M2) nodes, then bilinearly between the nodes (the same weights as a_crit). Below
 * the first sample x is clamped (the onset is then the track's first node for every grid node).
 * Allocation-free: it runs in the hot loop. Units: masses in Msun (> 0, clamped to the grid), a0 in AU.
 * Example: M1 = 1 (IFMR 0.569), M2 = 0.3, a0 = 1.76 AU, default track options → a red-giant-branch
 * onset; the direct integration gives core 0.325 Msun, envelope 0.64 Msun, R ≈ 41 Rsun, a ≈ 0.40 AU.
 */
export function commonEnvelopeOnset(grid: EngulfmentGridOf<ArrayLike<number>>, m1Msun: number, m2Msun: number, a0AU: number, out: Float64Array): boolean {
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
  const row = ys.length;
  const n00 = i * row + j;
  const n10 = n00 + row;
  const table = grid.logCriticalSeparationAU;
  const logCritical = (1 - wx) * ((1 - wy) * table[n00] + wy * table[n00 + 1]) + wx * ((1 - wy) * table[n10] + wy * table[n10 + 1]);
  const ratio = Math.log(a0AU) - logCritical;
  if (!(ratio < 0)) return false;
  const samples = grid.onsetSamples;
  const lo = grid.onsetLogRatioMin;
  const position = clamp(((ratio - lo) / (grid.onsetLogRatioMax - lo)) * (samples - 1), 0, samples - 1);
  const k = position < samples - 1 ? Math.floor(position) : samples - 2;
  const w = position - k;
  const w00 = (1 - wx) * (1 - wy);
  const w01 = (1 - wx) * wy;
  const w10 = wx * (1 - wy);
  const w11 = wx * wy;
  const o00 = n00 * samples + k;
  const o01 = o00 + samples;
  const o10 = n10 * samples + k;
  const o11 = o10 + samples;
  out[0] = blend(grid.onsetCoreMassMsun, o00, o01, o10, o11, w00, w01, w10, w11, w);
  out[1] = blend(grid.onsetStarMassMsun, o00, o01, o10, o11, w00, w01, w10, w11, w);
  out[2] = blend(grid.onsetRadiusAU, o00, o01, o10, o11, w00, w01, w10, w11, w);
  out[3] = blend(grid.onsetSeparationAU, o00, o01, o10, o11, w00, w01, w10, w11, w);
  return true;
}

/** Bilinear blend of four nodes' values, each linear between its samples at offset and offset + 1. */
function blend(t: ArrayLike<number>, o00: number, o01: number, o10: number, o11: number, w00: number, w01: number, w10: number, w11: number, w: number): number {
  const v = w00 * t[o00] + w01 * t[o01] + w10 * t[o10] + w11 * t[o11];
  const v1 = w00 * t[o00 + 1] + w01 * t[o01 + 1] + w10 * t[o10 + 1] + w11 * t[o11 + 1];
  return v + w * (v1 - v);
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
function lowerNode(nodes: ArrayLike<number>, x: number): number {
  let lo = 0;
  let hi = nodes.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (nodes[mid] <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}
