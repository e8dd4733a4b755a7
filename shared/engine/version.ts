/**
 * Systems per chunk. Chunk i always holds systems [i·CHUNK_SYSTEMS, (i+1)·CHUNK_SYSTEMS) and is
 * drawn from its own generator, so the chunk size is part of what a seed means: changing it
 * changes every result, which is why it is folded into ENGINE_VERSION.
 */
export const CHUNK_SYSTEMS = 65536;

/** Version of the engine's numbers: bump on any change to physics, draw order or chunking. */
export const ENGINE_VERSION = `2.2.0+chunk${CHUNK_SYSTEMS}`;

/**
 * Major version of ENGINE_VERSION (engine 2: common-envelope onset state, the literature's
 * channels, remnant masses, cooling ages and post-CE periods). Results of engine 1 stay readable.
 */
export function engineMajorVersion(version: string): number {
  const major = Number.parseInt(version, 10);
  return Number.isFinite(major) ? major : 0;
}
