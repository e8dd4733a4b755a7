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
