import type { Scenario } from '../../shared/contracts/scenario.ts';
import type { PointValues } from '../../shared/engine/kernel/run-points.ts';
import type { PackedTallies } from '../../shared/engine/kernel/packed-tally.ts';
import type { ChunkTally } from '../../shared/engine/kernel/tally.ts';
import type { WorkerStatus } from '../../shared/contracts/workers.ts';

/** A finished batch: the chunks it covers and their summed tally (the engine's own tally type). */
export interface BatchDone {
  /** Index of the batch in the run's fixed partition (chunks batch·size … batch·size + size − 1). */
  batch: number;
  chunks: number[];
  /** The summed tally (of the first point, for a multi-point job). */
  tally: ChunkTally;
  /**
   * A multi-point job: one summed tally per point, in the request's order, packed (tally is point
   * 0's, unpacked); add them with addPackedIntoAll (packed-tally.ts), never one object per point.
   */
  pointTallies?: PackedTallies;
}

export interface ExecuteRequest {
  runId: string;
  scenario: Scenario;
  /** The chunks still to compute (the others are in the caller's running total). */
  pending: number[];
  signal: AbortSignal;
  /**
   * A multi-point job (a sweep or a fit in one pass): the parameter values of every point; the
   * scenario is the first point's. Each batch then carries one tally per point.
   */
  points?: PointValues[];
}

/**
 * Computes a run's chunks somewhere — the app's own worker threads or BullMQ workers on other
 * machines — and hands back finished batches in completion order. The caller owns the running
 * total: it adds each batch once (by batch index) and checkpoints, so the result is the same bit
 * for bit however many workers, machines or retries there were.
 */
export interface ChunkExecutor {
  readonly kind: 'embedded' | 'redis';
  execute(request: ExecuteRequest): AsyncIterable<BatchDone>;
  /** Called when a run is cancelled: pending work is dropped and running work told to stop. */
  cancel?(runId: string): Promise<void>;
  /** Called when a run ended (any outcome): frees what the executor kept for it. */
  forget?(runId: string): Promise<void>;
  /** The workers computing for this executor (GET /api/workers). */
  workers?(): Promise<WorkerStatus[]>;
  close(): Promise<void>;
}

/** The error a cancelled or interrupted run rejects with. */
export class RunAbortedError extends Error {
  override readonly name = 'AbortError';
  constructor(reason?: unknown) {
    super('The run was cancelled', { cause: reason });
  }
}

/** A batch that kept failing after its retries: the run fails, keeping what was computed. */
export class BatchFailedError extends Error {
  override readonly name = 'BatchFailedError';
  constructor(
    readonly chunks: number[],
    readonly attempts: number,
    cause: unknown,
  ) {
    super(`${cause instanceof Error ? cause.message : String(cause)} (chunks ${chunks[0]}–${chunks[chunks.length - 1]}, ${attempts} attempts)`, { cause });
  }
}

/** Retries of a failed batch before the run fails (so at most three attempts in all). */
export const BATCH_RETRIES = 2;

/**
 * Cuts the pending chunks along the run's fixed partition into batches of `size` chunks. The
 * partition depends only on the chunk count and `size`, so a batch keeps its index (and its job
 * id) across restarts; a batch whose chunks are all done is left out.
 */
export function pendingBatches(pending: readonly number[], size: number): { batch: number; chunks: number[] }[] {
  const byBatch = new Map<number, number[]>();
  for (const chunk of [...pending].sort((a, b) => a - b)) {
    const batch = Math.floor(chunk / size);
    const list = byBatch.get(batch);
    if (list) list.push(chunk);
    else byBatch.set(batch, [chunk]);
  }
  return [...byBatch].map(([batch, chunks]) => ({ batch, chunks }));
}

/** The outcome of one batch as FinishedBatches queues it. */
type Settled<T> = { ok: true; value: T } | { ok: false; error: unknown };

/**
 * The batches of one job in flight, handed back as they finish. Promise.race over the batches still
 * running would add a reaction to each of them on every wait, and each reaction keeps that race's
 * result reachable (a finished batch's counts: ≈ 260 MB at 10^4 points) for as long as the batch it
 * is attached to runs: a 10^4-point fit held several batches' counts at once that way. Here each
 * batch gets one reaction, which queues its outcome.
 */
export class FinishedBatches<T> {
  private readonly finished: Settled<T>[] = [];
  private wake: (() => void) | undefined;
  private running = 0;

  /** Batches added and not yet handed back by next(). */
  get size(): number {
    return this.running;
  }

  add(batch: Promise<T>): void {
    this.running++;
    batch.then(
      (value) => this.settle({ ok: true, value }),
      (error: unknown) => this.settle({ ok: false, error }),
    );
  }

  /**
   * The next batch to finish (thrown if it failed), or the error that `watchFailure` passes to its
   * `reject` first (a pool failure, an abort); `watchFailure` returns how to stop watching.
   */
  async next(watchFailure: (reject: (error: unknown) => void) => () => void): Promise<T> {
    while (this.finished.length === 0) {
      let detach = () => {};
      try {
        await new Promise<void>((resolve, reject) => {
          this.wake = resolve;
          detach = watchFailure(reject);
        });
      } finally {
        this.wake = undefined;
        detach();
      }
    }
    const entry = this.finished.shift()!;
    this.running--;
    if (!entry.ok) throw entry.error;
    return entry.value;
  }

  private settle(entry: Settled<T>): void {
    this.finished.push(entry);
    this.wake?.();
  }
}
