import { EngineError, requireInRange } from '../errors.ts';
import { CHUNK_SYSTEMS } from '../version.ts';

export interface ChunkPlan {
  chunkCount: number;
  systemsInChunk(chunkIndex: number): number;
}

/** Cuts a run of `systems` primaries into fixed chunks of CHUNK_SYSTEMS (the last one shorter). */
export function planChunks(systems: number): ChunkPlan {
  if (!Number.isInteger(systems) || systems < 1 || systems > 1e10) throw new EngineError('systems', systems, 'integers [1, 1e10]');
  const chunkCount = Math.ceil(systems / CHUNK_SYSTEMS);
  return {
    chunkCount,
    systemsInChunk(chunkIndex: number): number {
      requireInRange('chunkIndex', chunkIndex, 0, chunkCount - 1);
      return Math.min(CHUNK_SYSTEMS, systems - chunkIndex * CHUNK_SYSTEMS);
    },
  };
}
