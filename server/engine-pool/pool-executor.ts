import { hostname } from 'node:os';
import type { Piscina } from 'piscina';
import type { Scenario } from '../../shared/contracts/scenario.ts';
import type { EngulfmentGrid } from '../../shared/engine/kernel/engulfment.ts';
import { prepareScenario, type PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { scenarioHash } from '../../shared/engine/kernel/scenario-hash.ts';
import { unpackTally, type PackedTallies } from '../../shared/engine/kernel/packed-tally.ts';
import type { ChunkTally } from '../../shared/engine/kernel/tally.ts';
import { BATCH_RETRIES, BatchFailedError, FinishedBatches, pendingBatches, RunAbortedError, type BatchDone, type ChunkExecutor, type ExecuteRequest } from './chunk-executor.ts';
import type { ChunkBatchTask } from './chunk-task.ts';
import { preparePointPasses } from './point-passes.ts';

export interface PoolExecutorOptions {
  pool: Piscina;
  /** The cached engulfment grid of a `track` scenario (built once, shared by every batch). */
  resolveGrid?: (scenario: Scenario) => Promise<EngulfmentGrid | undefined>;
  /** Chunks per pool task (default: about eight tasks per thread, at most 16 chunks each). */
  chunksPerTask?: number;
  /** Retries of a failed batch before the run fails (default BATCH_RETRIES). */
  retries?: number;
  onRetry?: (info: { chunks: number[]; attempt: number; error: unknown }) => void;
}

/** Threads of a piscina pool. */
export function poolThreads(pool: Piscina): number {
  return Math.max(1, pool.options.maxThreads ?? 1);
}

/**
 * The embedded executor: a run's batches on the app's own piscina pool, at most two tasks per
 * thread in flight (so a 10^10-system run never queues 150,000 tasks). A batch that fails is
 * retried (piscina replaces a thread that crashed, so the retry runs on a fresh one); after
 * `retries` retries the run fails with a BatchFailedError. An aborted signal stops the loop at
 * once and cancels the tasks in flight.
 */
export function createPoolExecutor(options: PoolExecutorOptions): ChunkExecutor {
  const { pool } = options;
  const retries = options.retries ?? BATCH_RETRIES;
  const startedAt = new Date().toISOString();
  let jobsDone = 0;
  let activeJobs = 0;

  async function runBatch(task: ChunkBatchTask, signal: AbortSignal): Promise<ChunkTally | PackedTallies> {
    for (let attempt = 0; ; attempt++) {
      activeJobs++;
      try {
        const tally = (await pool.run(task, { signal })) as ChunkTally | PackedTallies; // packed: a multi-point task
        jobsDone++;
        return tally;
      } catch (error) {
        if (signal.aborted) throw new RunAbortedError(signal.reason);
        if (attempt >= retries) throw new BatchFailedError(task.chunks, attempt + 1, error);
        options.onRetry?.({ chunks: task.chunks, attempt: attempt + 1, error });
      } finally {
        activeJobs--;
      }
    }
  }

  async function* execute(request: ExecuteRequest): AsyncGenerator<BatchDone> {
    const { signal } = request;
    if (signal.aborted) throw new RunAbortedError(signal.reason);
    // The job's own scenario is usually also its first pass: prepare each scenario once.
    const preparedByHash = new Map<string, Promise<PreparedScenario>>();
    const prepare = (scenario: Scenario) => {
      const key = scenarioHash(scenario);
      if (!preparedByHash.has(key)) preparedByHash.set(key, (async () => prepareScenario(scenario, { engulfmentGrid: await options.resolveGrid?.(scenario) }))());
      return preparedByHash.get(key)!;
    };
    const prepared = await prepare(request.scenario);
    const passes = request.points ? await preparePointPasses(request.scenario, request.points, prepare) : undefined;
    const threads = poolThreads(pool);
    const size = options.chunksPerTask ?? Math.max(1, Math.min(16, Math.ceil(request.pending.length / (threads * 8))));
    const batches = pendingBatches(request.pending, size);
    // Tasks in flight are cancelled when the run is aborted or the loop ends early (a failure).
    const local = new AbortController();
    const stop = () => local.abort(signal.reason);
    signal.addEventListener('abort', stop, { once: true });
    // A thread that cannot start makes the pool emit 'error' instead of rejecting a task.
    let poolError: { error: unknown } | undefined;
    let onFailure: ((error: unknown) => void) | undefined;
    const onPoolError = (error: unknown) => {
      poolError ??= { error };
      onFailure?.(error);
    };
    pool.on('error', onPoolError);
    const watchPool = (reject: (error: unknown) => void) => {
      if (poolError) reject(poolError.error);
      else onFailure = reject;
      return () => (onFailure = undefined);
    };
    const inFlight = new FinishedBatches<BatchDone>();
    let next = 0;
    try {
      while (next < batches.length || inFlight.size > 0) {
        while (inFlight.size < threads * 2 && next < batches.length) {
          const { batch, chunks } = batches[next++];
          const done = runBatch({ prepared, chunks, passes, packed: true }, local.signal).then((tally): BatchDone =>
            'counts' in tally ? { batch, chunks, tally: unpackTally(tally, 0), pointTallies: tally } : { batch, chunks, tally },
          );
          inFlight.add(done); // a late rejection after a failure is expected and handled there
        }
        const finished = await inFlight.next(watchPool);
        if (signal.aborted) throw new RunAbortedError(signal.reason);
        yield finished;
      }
    } finally {
      signal.removeEventListener('abort', stop);
      pool.off('error', onPoolError);
      if (inFlight.size > 0) local.abort(new RunAbortedError());
    }
  }

  return {
    kind: 'embedded',
    execute,
    async workers() {
      const now = new Date().toISOString();
      return [{ id: 'embedded', host: hostname(), pid: process.pid, threads: poolThreads(pool), jobsDone, activeJobs, startedAt, lastSeenAt: now }];
    },
    async close() {},
  };
}
