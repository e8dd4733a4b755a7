/**
 * Systems per chunk. Chunk i always holds systems [i·CHUNK_SYSTEMS, (i+1)·CHUNK_SYSTEMS) and is
 * drawn from its own generator, so the chunk size is part of what a seed means: changing it
 * changes every result, which is why it is folded into ENGINE_VERSION.
 */
export const CHUNK_SYSTEMS = 65536;

/** Version of the engine's numbers: bump on any change to physics, draw order or chunking. */
export const ENGINE_VERSION = `1.0.1+chunk${CHUNK_SYSTEMS}`; // 1.0.1: Φ from the 1e-15 normal tail (log-normal period truncation)
