import { buildEngulfmentGrid as buildGrid, type EngulfmentGrid, type EngulfmentGridInput } from '../../shared/engine/physics/engulfment-grid.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { runChunkPoints } from '../../shared/engine/kernel/run-points.ts';
import type { PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { addTallyInto, type ChunkTally } from '../../shared/engine/kernel/tally.ts';
import type { PointPass } from './point-passes.ts';

/** One pool task: several chunks of one prepared scenario (sent once per batch, not per chunk). */
export interface ChunkBatchTask {
  prepared: PreparedScenario;
  chunks: number[];
  /** A multi-point job: its passes (one per set of draw-changing values); one tally per point comes back, in the job's order. */
  passes?: PointPass[];
}

/**
 * Piscina task entry: runs the batch's chunks in order and returns their summed tally (the
 * engine's own tally and merge, so this code never cares which bins exist).
 */
export default function runChunkBatch(task: ChunkBatchTask): ChunkTally | ChunkTally[] {
  if (task.chunks.length === 0) throw new Error('a chunk batch needs at least one chunk');
  if (task.passes) return runChunkBatchPasses(task.passes, task.chunks);
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

/** A multi-point batch: each pass's chunks run once, the tallies summed per point and put in the job's order. */
function runChunkBatchPasses(passes: PointPass[], chunks: number[]): ChunkTally[] {
  const out: ChunkTally[] = [];
  for (const pass of passes) {
    const [first, ...rest] = chunks;
    const sums = runChunkPoints(pass.prepared, pass.points, first);
    for (const chunkIndex of rest) runChunkPoints(pass.prepared, pass.points, chunkIndex).forEach((tally, p) => addTallyInto(sums[p], tally));
    sums.forEach((tally, p) => (out[pass.indices[p]] = tally));
  }
  return out;
}
