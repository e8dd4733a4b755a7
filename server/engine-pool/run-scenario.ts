import type { Piscina } from 'piscina';
import type { ScenarioResult } from '../../shared/contracts/result.ts';
import type { Scenario } from '../../shared/contracts/scenario.ts';
import type { EngulfmentGrid } from '../../shared/engine/kernel/engulfment.ts';
import { scenarioHash } from '../../shared/engine/kernel/scenario-hash.ts';
import { addTallyInto, emptyTallyFor, type ChunkTally } from '../../shared/engine/kernel/tally.ts';
import { planChunks } from '../../shared/engine/kernel/chunks.ts';
import { buildResult } from '../../shared/engine/result/build-result.ts';
import { RunAbortedError, type BatchDone } from './chunk-executor.ts';
import { createEnginePool, defaultWorkerCount } from './engine-pool.ts';
import { createPoolExecutor } from './pool-executor.ts';

export { RunAbortedError };

export interface RunProgress {
  chunksDone: number;
  chunkCount: number;
  systemsDone: number;
  systems: number;
  /** Running magnetic fraction of the chunks summed so far (null before any white dwarf). */
  fraction: number | null;
}

export interface RunScenarioOptions {
  /** Worker threads for a pool made here (ignored when `pool` is given). Default: one per core. */
  workers?: number;
  /** A long-lived pool to use (it is not destroyed at the end). */
  pool?: Piscina;
  onProgress?: (progress: RunProgress) => void;
  /** Fires once per finished batch with the chunks it covers and their summed tally. */
  onBatch?: (done: BatchDone) => void;
  signal?: AbortSignal;
  /** Chunks already summed into initialTally (a resumed run). */
  skipChunks?: Iterable<number>;
  initialTally?: ChunkTally;
  /** A cached engulfment grid for giant.kind = "track". */
  engulfmentGrid?: EngulfmentGrid;
  /** Chunks per pool task (default: about eight tasks per worker, at most 16 chunks each). */
  chunksPerTask?: number;
}

/**
 * Runs a scenario on a piscina pool in one process (the command line, benchmarks, tests): one
 * running total, to which each finished batch is added as it arrives. Sums are exact integer
 * sums, so the result is bit-identical for any number of workers and any completion order.
 */
export async function runScenario(scenario: Scenario, options: RunScenarioOptions = {}): Promise<ScenarioResult> {
  const { chunkCount } = planChunks(scenario.systems);
  const skip = new Set(options.skipChunks ?? []);
  if (options.initialTally && options.initialTally.chunks !== skip.size) {
    throw new Error(`initialTally sums ${options.initialTally.chunks} chunks but skipChunks lists ${skip.size}`);
  }
  const total = options.initialTally ? structuredClone(options.initialTally) : emptyTallyFor(scenarioHash(scenario));
  const pending: number[] = [];
  for (let i = 0; i < chunkCount; i++) if (!skip.has(i)) pending.push(i);
  const signal = options.signal ?? new AbortController().signal;
  if (signal.aborted) throw new RunAbortedError(signal.reason);

  const ownPool = options.pool === undefined;
  const pool = options.pool ?? createEnginePool({ workers: options.workers ?? defaultWorkerCount() });
  const executor = createPoolExecutor({ pool, chunksPerTask: options.chunksPerTask, resolveGrid: async () => options.engulfmentGrid });
  try {
    for await (const done of executor.execute({ runId: 'local', scenario, pending, signal })) {
      addTallyInto(total, done.tally);
      options.onBatch?.(done);
      options.onProgress?.({
        chunksDone: total.chunks,
        chunkCount,
        systemsDone: total.systems,
        systems: scenario.systems,
        fraction: total.whiteDwarfs > 0 ? total.magnetic / total.whiteDwarfs : null,
      });
    }
  } finally {
    if (ownPool) await pool.destroy();
  }
  return buildResult(scenario, total);
}
