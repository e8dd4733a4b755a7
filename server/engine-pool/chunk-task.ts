import { buildEngulfmentGrid as buildGrid, type EngulfmentGrid, type EngulfmentGridInput } from '../../shared/engine/physics/engulfment-grid.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import type { PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { addTallyInto, type ChunkTally } from '../../shared/engine/kernel/tally.ts';

/** One pool task: several chunks of one prepared scenario (sent once per batch, not per chunk). */
export interface ChunkBatchTask {
  prepared: PreparedScenario;
  chunks: number[];
  /** true: return each chunk's tally (the caller persists them); false: return the batch's sum only. */
  perChunk: boolean;
}

export interface ChunkBatchResult {
  /** The chunks summed into `tally`: one chunk when perChunk, else the whole batch. */
  chunks: number[];
  tally: ChunkTally;
}

/** Piscina task entry: runs the batch's chunks in order; one result per chunk, or one for the batch. */
export default function runChunkBatch(task: ChunkBatchTask): ChunkBatchResult[] {
  if (task.perChunk) return task.chunks.map((chunkIndex) => ({ chunks: [chunkIndex], tally: runChunk(task.prepared, chunkIndex) }));
  let sum: ChunkTally | null = null;
  for (const chunkIndex of task.chunks) {
    const tally = runChunk(task.prepared, chunkIndex);
    sum = sum === null ? tally : addTallyInto(sum, tally);
  }
  return sum === null ? [] : [{ chunks: task.chunks, tally: sum }];
}

/**
 * Piscina task `buildEngulfmentGrid` (run with `{ name: 'buildEngulfmentGrid' }`): integrates the
 * `track` giant's engulfment boundary on a worker, so the server's main thread never does it.
 */
export function buildEngulfmentGrid(task: { input: EngulfmentGridInput }): EngulfmentGrid {
  return buildGrid(task.input);
}
