import { ENGINE_VERSION } from '../version.ts';
import { ARRAY_FIELDS, SCALAR_FIELDS, emptyTallyFor, type ChunkTally } from './tally.ts';

/**
 * The tallies of many parameter points in one Float64Array: point p's counts are
 * counts[p · PACKED_TALLY_LENGTH …], the scalar counts (SCALAR_FIELDS order) followed by every array
 * field (ARRAY_FIELDS order). This is how a multi-point batch's tallies travel: moved between
 * threads as one transferable buffer, sent between processes as bytes, and summed over a batch's
 * chunks without an object per point per chunk. Every count is an integer below 2^53, which a
 * double holds exactly (IEEE 754 binary64 has a 53-bit significand), so packing, adding and
 * unpacking are exact and the order of addition does not matter.
 */
export interface PackedTallies {
  engineVersion: string;
  /** Point p's scenario hash (its tally's scenarioHash). */
  scenarioHashes: string[];
  counts: Float64Array;
}

/** Where each array field starts in a point's packed counts, and its length (fixed for an engine version). */
const LAYOUT = (() => {
  const template = emptyTallyFor('');
  let offset = SCALAR_FIELDS.length;
  return ARRAY_FIELDS.map((key) => {
    const field = { key, offset, length: template[key].length };
    offset += field.length;
    return field;
  });
})();

/** Counts per point in packed form (≈ 2,700 for engine 2). */
export const PACKED_TALLY_LENGTH = LAYOUT[LAYOUT.length - 1].offset + LAYOUT[LAYOUT.length - 1].length;

/** All-zero packed tallies, one per scenario hash. */
export function emptyPackedTallies(scenarioHashes: readonly string[], engineVersion: string = ENGINE_VERSION): PackedTallies {
  return { engineVersion, scenarioHashes: [...scenarioHashes], counts: new Float64Array(scenarioHashes.length * PACKED_TALLY_LENGTH) };
}

/** The tallies packed, in their order (inputs untouched). */
export function packTallies(tallies: readonly ChunkTally[]): PackedTallies {
  if (tallies.length === 0) throw new Error('packTallies needs at least one tally');
  const packed = emptyPackedTallies(
    tallies.map((t) => t.scenarioHash),
    tallies[0].engineVersion,
  );
  tallies.forEach((tally, p) => addTallyToPacked(packed, p, tally));
  return packed;
}

/** Adds `tally` into point p's packed counts, in place (engine version, scenario and layout checked). */
export function addTallyToPacked(packed: PackedTallies, p: number, tally: ChunkTally): void {
  checkPoint(packed, p, tally);
  for (const { key, length } of LAYOUT) {
    if (tally[key].length !== length) throw new Error(`cannot pack a tally whose ${key} has ${tally[key].length} entries (expected ${length})`);
  }
  const counts = packed.counts;
  const base = p * PACKED_TALLY_LENGTH;
  for (let k = 0; k < SCALAR_FIELDS.length; k++) counts[base + k] += tally[SCALAR_FIELDS[k]];
  for (const { key, offset, length } of LAYOUT) {
    const values = tally[key];
    const start = base + offset;
    for (let i = 0; i < length; i++) counts[start + i] += values[i];
  }
}

/** Point p's tally as a plain ChunkTally (the JSON shape that is stored and served). */
export function unpackTally(packed: PackedTallies, p: number): ChunkTally {
  checkPoint(packed, p);
  const tally = emptyTallyFor(packed.scenarioHashes[p]);
  tally.engineVersion = packed.engineVersion;
  return addPackedInto(tally, packed, p);
}

/** Adds point p's packed counts into `target` in place and returns it (engine version and scenario checked). */
export function addPackedInto(target: ChunkTally, packed: PackedTallies, p: number): ChunkTally {
  checkPoint(packed, p, target);
  const counts = packed.counts;
  const base = p * PACKED_TALLY_LENGTH;
  for (let k = 0; k < SCALAR_FIELDS.length; k++) target[SCALAR_FIELDS[k]] += counts[base + k];
  for (const { key, offset, length } of LAYOUT) {
    const values = target[key];
    if (values.length !== length) throw new Error(`cannot add packed counts to a tally whose ${key} has ${values.length} entries (expected ${length})`);
    const start = base + offset;
    for (let i = 0; i < length; i++) {
      // Most counts are zero: skipping them spares the stores (and the running totals' integer arrays a conversion to doubles).
      const count = counts[start + i];
      if (count !== 0) values[i] += count;
    }
  }
  return target;
}

/** Adds every point's packed counts into the running totals, point p into targets[p]. */
export function addPackedIntoAll(targets: readonly ChunkTally[], packed: PackedTallies): void {
  if (packed.scenarioHashes.length !== targets.length) throw new Error(`packed tallies of ${packed.scenarioHashes.length} points cannot be added to ${targets.length} running totals`);
  targets.forEach((target, p) => addPackedInto(target, packed, p));
}

function checkPoint(packed: PackedTallies, p: number, tally?: ChunkTally): void {
  const points = packed.scenarioHashes.length;
  if (!(Number.isInteger(p) && p >= 0 && p < points)) throw new RangeError(`point ${p} is outside the packed tallies' range [0, ${points - 1}]`);
  if (packed.counts.length !== points * PACKED_TALLY_LENGTH) throw new Error(`packed tallies of ${points} points hold ${packed.counts.length} counts, not ${points * PACKED_TALLY_LENGTH}`);
  if (!tally) return;
  if (tally.engineVersion !== packed.engineVersion) throw new Error(`cannot add tallies of engine ${tally.engineVersion} and ${packed.engineVersion}`);
  if (tally.scenarioHash !== packed.scenarioHashes[p]) throw new Error(`cannot add tallies of scenarios ${tally.scenarioHash} and ${packed.scenarioHashes[p]}`);
}
