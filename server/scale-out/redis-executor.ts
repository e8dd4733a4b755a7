import { Queue, QueueEvents, type Job } from 'bullmq';
import type { Logger } from 'pino';
import { packTallies } from '../../shared/engine/kernel/packed-tally.ts';
import { BATCH_RETRIES, BatchFailedError, FinishedBatches, pendingBatches, RunAbortedError, type BatchDone, type ChunkExecutor, type ExecuteRequest } from '../engine-pool/chunk-executor.ts';
import {
  cancelChannel,
  cancelledKey,
  decodePackedTallies,
  jobIdOf,
  redisConnection,
  workerKeyPrefix,
  type ChunkJobData,
  type ChunkJobResult,
  type WorkerHeartbeat,
} from './queue-names.ts';

export interface RedisExecutorOptions {
  url: string;
  queue: string;
  /** Chunks per job (the run's fixed partition; keep it fixed between restarts). */
  batchChunks: number;
  /** Jobs of one run queued or running at once (the rest wait in the app, not in Redis). */
  jobsPerRun: number;
  logger: Logger;
}

const DAY_S = 24 * 3600;

/** firstFinished's watcher of the run's abort signal: rejects with RunAbortedError. */
function watchAbort(signal: AbortSignal) {
  return (reject: (error: unknown) => void) => {
    const onAbort = () => reject(new RunAbortedError(signal.reason));
    if (signal.aborted) onAbort();
    else signal.addEventListener('abort', onAbort, { once: true });
    return () => signal.removeEventListener('abort', onAbort);
  };
}

/**
 * The scale-out executor: a run's batches become BullMQ jobs with idempotent ids
 * (`<runId>-<batch>`), taken by `npm run worker` processes on any machine; each completed job's
 * integer tally comes back to the app, whose scheduler merges and checkpoints it. A batch queued
 * again (after an app restart) is the same job, so work already done is not redone; a job that
 * fails is retried twice by BullMQ (three attempts), then fails the run. Cancel removes the run's
 * waiting jobs and tells the workers to abort the ones they are computing.
 */
export function createRedisExecutor(options: RedisExecutorOptions): ChunkExecutor & { queue: Queue<ChunkJobData, ChunkJobResult> } {
  const connection = redisConnection(options.url);
  const eventsConnection = redisConnection(options.url);
  const queue = new Queue<ChunkJobData, ChunkJobResult>(options.queue, { connection });
  const queueEvents = new QueueEvents(options.queue, { connection: eventsConnection });
  // Each job being waited for adds a listener to the queue's 'closing' event (BullMQ's waitUntilFinished).
  queue.setMaxListeners(0);
  queue.on('error', (error) => options.logger.error({ err: error }, 'BullMQ queue error'));
  queueEvents.on('error', (error) => options.logger.error({ err: error }, 'BullMQ queue events error'));
  /** Job ids this app queued, per run (removed when the run ends). */
  const jobsOfRun = new Map<string, Set<string>>();

  async function runBatch(request: ExecuteRequest, batch: number, chunks: number[]): Promise<BatchDone> {
    const jobId = jobIdOf(request.runId, batch);
    let ids = jobsOfRun.get(request.runId);
    if (!ids) jobsOfRun.set(request.runId, (ids = new Set()));
    ids.add(jobId);
    const job: Job<ChunkJobData, ChunkJobResult> = await queue.add(
      'chunks',
      { runId: request.runId, batch, chunks, scenario: request.scenario, ...(request.points ? { points: request.points } : {}) },
      {
        jobId,
        attempts: BATCH_RETRIES + 1,
        backoff: { type: 'fixed', delay: 500 },
        removeOnComplete: { age: DAY_S },
        removeOnFail: { age: DAY_S },
      },
    );
    let result: ChunkJobResult;
    try {
      result = (await job.waitUntilFinished(queueEvents)) as ChunkJobResult;
    } catch (error) {
      if (request.signal.aborted) throw new RunAbortedError(request.signal.reason);
      throw new BatchFailedError(chunks, BATCH_RETRIES + 1, error);
    }
    const pointTallies = result.packed ? decodePackedTallies(result.packed) : result.tallies ? packTallies(result.tallies) : undefined;
    return { batch, chunks: result.chunks, tally: result.tally, ...(pointTallies ? { pointTallies } : {}) };
  }

  async function* execute(request: ExecuteRequest): AsyncGenerator<BatchDone> {
    const { signal } = request;
    if (signal.aborted) throw new RunAbortedError(signal.reason);
    await queueEvents.waitUntilReady();
    const batches = pendingBatches(request.pending, options.batchChunks);
    const aborted = watchAbort(signal);
    const inFlight = new FinishedBatches<BatchDone>();
    let next = 0;
    while (next < batches.length || inFlight.size > 0) {
      while (inFlight.size < options.jobsPerRun && next < batches.length) {
        const { batch, chunks } = batches[next++];
        inFlight.add(runBatch(request, batch, chunks));
      }
      yield await inFlight.next(aborted);
    }
  }

  async function removeWaitingJobs(runId: string): Promise<number> {
    let removed = 0;
    const waiting = await queue.getJobs(['wait', 'delayed', 'prioritized'], 0, -1);
    for (const job of waiting) {
      if (job?.data?.runId === runId) removed += await queue.remove(job.id!);
    }
    return removed;
  }

  return {
    kind: 'redis',
    queue,
    execute,

    async cancel(runId: string) {
      // Workers check this key before starting a job and abort the run's running jobs on the notice.
      await connection.set(cancelledKey(options.queue, runId), '1', 'EX', DAY_S);
      await connection.publish(cancelChannel(options.queue), runId);
      const removed = await removeWaitingJobs(runId);
      options.logger.info({ runId, removed }, 'removed the cancelled run\'s waiting jobs');
    },

    async forget(runId: string) {
      const ids = jobsOfRun.get(runId);
      jobsOfRun.delete(runId);
      await removeWaitingJobs(runId);
      for (const id of ids ?? []) await queue.remove(id).catch(() => 0);
    },

    async workers() {
      const prefix = workerKeyPrefix(options.queue);
      const keys: string[] = [];
      let cursor = '0';
      do {
        const [nextCursor, found] = await connection.scan(cursor, 'MATCH', `${prefix}*`, 'COUNT', 200);
        keys.push(...found);
        cursor = nextCursor;
      } while (cursor !== '0');
      if (keys.length === 0) return [];
      const values = await connection.mget(keys);
      return values
        .filter((v): v is string => v !== null)
        .map((v) => JSON.parse(v) as WorkerHeartbeat)
        .sort((a, b) => a.startedAt.localeCompare(b.startedAt) || a.id.localeCompare(b.id));
    },

    async close() {
      await queueEvents.close();
      await queue.close();
      connection.disconnect();
      eventsConnection.disconnect();
    },
  };
}
