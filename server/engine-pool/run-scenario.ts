import type { Piscina } from 'piscina';
import type { ScenarioResult } from '../../shared/contracts/result.ts';
import type { Scenario } from '../../shared/contracts/scenario.ts';
import type { EngulfmentGrid } from '../../shared/engine/kernel/engulfment.ts';
import { prepareScenario } from '../../shared/engine/kernel/prepare.ts';
import { addTallyInto, type ChunkTally } from '../../shared/engine/kernel/tally.ts';
import { emptyTally } from '../../shared/engine/kernel/empty-tally.ts';
import { buildResult } from '../../shared/engine/result/build-result.ts';
import type { ChunkBatchResult, ChunkBatchTask } from './chunk-task.ts';
import { createEnginePool, defaultWorkerCount } from './engine-pool.ts';

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
  /** Fires once per finished chunk with its own tally (the server persists it to resume). Without it, workers return one summed tally per batch. */
  onChunk?: (chunkIndex: number, tally: ChunkTally) => void;
  signal?: AbortSignal;
  /** Chunks already summed into initialTally (a resumed run). */
  skipChunks?: Iterable<number>;
  initialTally?: ChunkTally;
  /** A cached engulfment grid for giant.kind = "track". */
  engulfmentGrid?: EngulfmentGrid;
  /** Chunks per pool task (default: about eight tasks per worker, at most 16 chunks each). */
  chunksPerTask?: number;
}

/** The error a cancelled run rejects with. */
export class RunAbortedError extends Error {
  override readonly name = 'AbortError';
  constructor(reason?: unknown) {
    super('The run was cancelled', { cause: reason });
  }
}

/**
 * Runs a scenario on a piscina pool: chunks are batched into tasks, at most two tasks per
 * worker are in flight (so a 1e10-system run never queues 150,000 tasks), and chunk tallies are
 * summed exactly as they arrive, so the result is bit-identical for any number of workers and
 * any completion order. A task that throws fails the run with that error and cancels the other
 * tasks; an aborted signal rejects at once with an AbortError.
 */
export async function runScenario(scenario: Scenario, options: RunScenarioOptions = {}): Promise<ScenarioResult> {
  const prepared = prepareScenario(scenario, { engulfmentGrid: options.engulfmentGrid });
  const skip = new Set(options.skipChunks ?? []);
  const pending: number[] = [];
  for (let i = 0; i < prepared.chunkCount; i++) if (!skip.has(i)) pending.push(i);
  // The running sum is owned here and added into in place (exact integer sums, any order).
  const total = options.initialTally ? structuredClone(options.initialTally) : emptyTally(prepared);
  if (options.initialTally && options.initialTally.chunks !== skip.size) {
    throw new Error(`initialTally sums ${options.initialTally.chunks} chunks but skipChunks lists ${skip.size}`);
  }
  if (options.signal?.aborted) throw new RunAbortedError(options.signal.reason);

  const ownPool = options.pool === undefined;
  const pool = options.pool ?? createEnginePool({ workers: options.workers ?? defaultWorkerCount() });
  const threads = Math.max(1, pool.options.maxThreads ?? 1);
  const perTask = options.chunksPerTask ?? Math.max(1, Math.min(16, Math.ceil(pending.length / (threads * 8))));
  const batches: number[][] = [];
  for (let i = 0; i < pending.length; i += perTask) batches.push(pending.slice(i, i + perTask));

  const cancel = new AbortController();
  let chunksDone = skip.size;
  let systemsDone = total.systems;
  try {
    await new Promise<void>((resolve, reject) => {
      let next = 0;
      let inFlight = 0;
      let settled = false;
      const onAbort = () => fail(new RunAbortedError(options.signal?.reason));
      // A worker that cannot start makes the pool emit 'error' instead of rejecting a task.
      const onPoolError = (error: unknown) => fail(error);
      const settle = () => {
        settled = true;
        options.signal?.removeEventListener('abort', onAbort);
        pool.off('error', onPoolError);
      };
      const fail = (error: unknown) => {
        if (settled) return;
        settle();
        cancel.abort(error);
        reject(error);
      };
      const finish = () => {
        if (settled) return;
        settle();
        resolve();
      };
      options.signal?.addEventListener('abort', onAbort, { once: true });
      pool.on('error', onPoolError);
      const launch = () => {
        while (!settled && inFlight < threads * 2 && next < batches.length) {
          const task: ChunkBatchTask = { prepared, chunks: batches[next++], perChunk: options.onChunk !== undefined };
          inFlight++;
          (pool.run(task, { signal: cancel.signal }) as Promise<ChunkBatchResult[]>).then(
            (results) => {
              inFlight--;
              if (settled) return;
              try {
                for (const { chunks, tally } of results) {
                  addTallyInto(total, tally);
                  chunksDone += chunks.length;
                  systemsDone += tally.systems;
                  if (options.onChunk) options.onChunk(chunks[0], tally);
                  options.onProgress?.({
                    chunksDone,
                    chunkCount: prepared.chunkCount,
                    systemsDone,
                    systems: prepared.systems,
                    fraction: total.whiteDwarfs > 0 ? total.magnetic / total.whiteDwarfs : null,
                  });
                }
              } catch (error) {
                fail(error);
                return;
              }
              if (next >= batches.length && inFlight === 0) finish();
              else launch();
            },
            (error: unknown) => {
              inFlight--;
              fail(error);
            },
          );
        }
        if (batches.length === 0) finish();
      };
      launch();
    });
  } finally {
    if (ownPool) await pool.destroy();
  }
  return buildResult(scenario, total, { prepared });
}
