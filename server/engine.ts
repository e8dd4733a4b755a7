/**
 * The engine pieces the server uses, gathered in one place so the server's modules do not
 * reach into shared/engine's internals.
 */
export { scenarioHash } from '../shared/engine/kernel/scenario-hash.ts';
export { addTally, type ChunkTally } from '../shared/engine/kernel/tally.ts';
export { planChunks } from '../shared/engine/kernel/chunks.ts';
export { ENGINE_VERSION, CHUNK_SYSTEMS } from '../shared/engine/version.ts';
export { methodsUsed } from '../shared/engine/result/methods.ts';
