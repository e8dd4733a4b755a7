import { move, transferableSymbol, valueSymbol } from 'piscina';
import { buildEngulfmentGrid as buildGrid, type EngulfmentGrid, type EngulfmentGridInput } from '../../shared/engine/physics/engulfment-grid.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { runChunkPoints } from '../../shared/engine/kernel/run-points.ts';
import type { PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { addTallyToPacked, emptyPackedTallies, unpackTally, type PackedTallies } from '../../shared/engine/kernel/packed-tally.ts';
import { addTallyInto, type ChunkTally } from '../../shared/engine/kernel/tally.ts';
import type { PointPass } from './point-passes.ts';

/** One pool task: several chunks of one prepared scenario (sent once per batch, not per chunk). */
export interface ChunkBatchTask {
  prepared: PreparedScenario;
  chunks: number[];
  /** A multi-point job: its passes (one per set of draw-changing values); one tally per point comes back, in the job's order. */
  passes?: PointPass[];
  /** A multi-point job's tallies come back as PackedTallies whose buffer is moved, not cloned (the executors ask for this); else as ChunkTally[]. */
  packed?: boolean;
}

/**
 * Piscina task entry: runs the batch's chunks in order and returns their summed tally (the
 * engine's own tally and merge, so this code never cares which bins exist).
 */
export default function runChunkBatch(task: ChunkBatchTask): ChunkTally | ChunkTally[] | PackedTallies {
  if (task.chunks.length === 0) throw new Error('a chunk batch needs at least one chunk');
  if (task.passes) {
    const packed = runChunkBatchPasses(task.passes, task.chunks);
    return task.packed ? movable(packed) : packed.scenarioHashes.map((_, p) => unpackTally(packed, p));
  }
  const [first, ...rest] = task.chunks;
  const sum = runChunk(task.prepared, first);
  for (const chunkIndex of rest) addTallyInto(sum, runChunk(task.prepared, chunkIndex));
  return sum;
}

/**
 * Piscina task `buildEngulfmentGrid` (run with `{ name: 'buildEngulfmentGrid' }`): integrates the
 * `track` giant's engulfment boundary on a worker, so the server's main thread never does it.
 */
export function buildEngulfmentGrid(task: { input: EngulfmentGridInput }): EngulfmentGrid {
  return buildGrid(task.input);
}

/**
 * A multi-point batch: each pass's chunks run once, every chunk's tallies added straight into one
 * packed accumulator at the points' places in the job's list (no object per point per batch).
 */
export function runChunkBatchPasses(passes: readonly PointPass[], chunks: readonly number[]): PackedTallies {
  const hashes: string[] = [];
  for (const pass of passes) pass.points.points.forEach((point, p) => (hashes[pass.indices[p]] = point.scenarioHash));
  const packed = emptyPackedTallies(hashes);
  for (const pass of passes) {
    for (const chunkIndex of chunks) runChunkPoints(pass.prepared, pass.points, chunkIndex).forEach((tally, p) => addTallyToPacked(packed, pass.indices[p], tally));
  }
  return packed;
}

/** The packed tallies marked for piscina to transfer their buffer to the main thread (no structured clone of the counts). */
function movable(packed: PackedTallies): PackedTallies {
  return move({ [transferableSymbol]: packed.counts.buffer, [valueSymbol]: packed }) as unknown as PackedTallies;
}
