import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import type { PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import type { ChunkTally } from '../../shared/engine/kernel/tally.ts';

/** One pool task: several chunks of one prepared scenario (sent once per batch, not per chunk). */
export interface ChunkBatchTask {
  prepared: PreparedScenario;
  chunks: number[];
}

export interface ChunkBatchResult {
  chunkIndex: number;
  tally: ChunkTally;
}

/** Piscina task entry: runs the batch's chunks in order and returns one tally per chunk. */
export default function runChunkBatch(task: ChunkBatchTask): ChunkBatchResult[] {
  return task.chunks.map((chunkIndex) => ({ chunkIndex, tally: runChunk(task.prepared, chunkIndex) }));
}
