import { buildEngulfmentGrid as buildGrid, type EngulfmentGrid, type EngulfmentGridInput } from '../../shared/engine/physics/engulfment-grid.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { runChunkPoints, type PreparedPoints } from '../../shared/engine/kernel/run-points.ts';
import type { PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { addTallyInto, type ChunkTally } from '../../shared/engine/kernel/tally.ts';

/** One pool task: several chunks of one prepared scenario (sent once per batch, not per chunk). */
export interface ChunkBatchTask {
  prepared: PreparedScenario;
  chunks: number[];
  /** A multi-point job: the points evaluated from each chunk's draws (one tally per point comes back). */
  points?: PreparedPoints;
}

/**
 * Piscina task entry: runs the batch's chunks in order and returns their summed tally (the
 * engine's own tally and merge, so this code never cares which bins exist).
 */
export default function runChunkBatch(task: ChunkBatchTask): ChunkTally | ChunkTally[] {
  if (task.chunks.length === 0) throw new Error('a chunk batch needs at least one chunk');
  if (task.points) return runChunkBatchPoints(task.prepared, task.points, task.chunks);
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

/** A multi-point batch: the chunks' tallies summed per point (tally p belongs to point p). */
function runChunkBatchPoints(prepared: PreparedScenario, points: PreparedPoints, chunks: number[]): ChunkTally[] {
  const [first, ...rest] = chunks;
  const sums = runChunkPoints(prepared, points, first);
  for (const chunkIndex of rest) runChunkPoints(prepared, points, chunkIndex).forEach((tally, p) => addTallyInto(sums[p], tally));
  return sums;
}
