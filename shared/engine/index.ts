/**
 * The engine's public surface: what the CLI, the pool workers and the server call.
 * Physics modules are imported from their own files.
 */
export { CHUNK_SYSTEMS, ENGINE_VERSION } from './version.ts';
export { planChunks, type ChunkPlan } from './kernel/chunks.ts';
export { scenarioHash } from './kernel/scenario-hash.ts';
export { prepareScenario, type PreparedScenario } from './kernel/prepare.ts';
export { engulfmentGridInputFor, type EngulfmentGrid, type EngulfmentGridInput } from './kernel/engulfment.ts';
export { runChunk } from './kernel/run-chunk.ts';
export { addTally, addTallyInto, type ChunkTally } from './kernel/tally.ts';
export { emptyTally } from './kernel/empty-tally.ts';
export { buildResult } from './result/build-result.ts';
export { methodsUsed } from './result/methods.ts';
export { assumptionsFor } from './result/assumptions.ts';
