import { randomBytes } from 'node:crypto';
import os from 'node:os';
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import type { Logger } from 'pino';
import type { Piscina } from 'piscina';
import type { Scenario } from '../../shared/contracts/scenario.ts';
import { engulfmentGridInputFor, type EngulfmentGrid } from '../../shared/engine/kernel/engulfment.ts';
import { prepareScenario, type PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { scenarioHash } from '../../shared/engine/kernel/scenario-hash.ts';
import { unpackTally, type PackedTallies } from '../../shared/engine/kernel/packed-tally.ts';
import type { ChunkTally } from '../../shared/engine/kernel/tally.ts';
import { engulfmentGridKey } from '../../shared/engine/physics/engulfment-grid.ts';
import { preparePointPasses, type PointPass } from '../engine-pool/point-passes.ts';
import { poolThreads } from '../engine-pool/pool-executor.ts';
import { cancelChannel, cancelledKey, encodePackedTallies, redisConnection, workerKeyPrefix, type ChunkJobData, type ChunkJobResult, type WorkerHeartbeat } from './queue-names.ts';

export interface ChunkWorkerOptions {
  url: string;
  queue: string;
  pool: Piscina;
  logger: Logger;
  /** How often the heartbeat is written (it lives three times as long). */
  heartbeatMs?: number;
  /** BullMQ's lock on a running job and the stalled-job check (lower only in tests). */
  lockDurationMs?: number;
  stalledIntervalMs?: number;
}

/** Prepared scenarios kept per worker (a sweep's points differ; a run's batches share one). */
const PREPARED_CACHE = 16;

/**
 * A BullMQ worker for chunk jobs, computing on its own piscina pool (one job per thread at a
 * time). The `track` giant's engulfment grid is built once per physics key on the pool and kept:
 * it is a pure function of the scenario, so every machine builds the same grid bit for bit.
 * A job of a cancelled run is refused before it starts, and the run's running jobs are aborted
 * (their threads stop) when the app publishes the cancel notice.
 */
export function createChunkWorker(options: ChunkWorkerOptions) {
  const { pool, logger } = options;
  const id = `${os.hostname()}-${process.pid}-${randomBytes(3).toString('hex')}`;
  const threads = poolThreads(pool);
  const heartbeatMs = options.heartbeatMs ?? 5000;
  const commands = redisConnection(options.url);
  const subscriber = redisConnection(options.url);
  const grids = new Map<string, Promise<EngulfmentGrid>>();
  const prepared = new Map<string, Promise<PreparedScenario>>();
  /** Prepared points of the multi-point jobs seen last (a job's batches share them). */
  const passesOfRun = new Map<string, Promise<PointPass[]>>();
  const startedAt = new Date().toISOString();
  let jobsDone = 0;
  let activeJobs = 0;
  /** Ids of the jobs this worker is computing. */
  const running = new Set<string>();

  async function gridFor(scenario: Scenario): Promise<EngulfmentGrid | undefined> {
    if (scenario.giant.kind !== 'track') return undefined;
    const input = engulfmentGridInputFor(scenario);
    const key = engulfmentGridKey(input);
    let grid = grids.get(key);
    if (!grid) {
      grid = pool.run({ input }, { name: 'buildEngulfmentGrid' }) as Promise<EngulfmentGrid>;
      grid.catch(() => grids.delete(key));
      grids.set(key, grid);
    }
    return grid;
  }

  function preparedFor(scenario: Scenario): Promise<PreparedScenario> {
    const key = scenarioHash(scenario);
    let entry = prepared.get(key);
    if (!entry) {
      entry = gridFor(scenario).then((engulfmentGrid) => prepareScenario(scenario, { engulfmentGrid }));
      entry.catch(() => prepared.delete(key));
      prepared.set(key, entry);
      if (prepared.size > PREPARED_CACHE) prepared.delete(prepared.keys().next().value!);
    }
    return entry;
  }

  async function heartbeat(): Promise<void> {
    const record: WorkerHeartbeat = { id, host: os.hostname(), pid: process.pid, threads, jobsDone, activeJobs, startedAt, lastSeenAt: new Date().toISOString() };
    await commands.set(`${workerKeyPrefix(options.queue)}${id}`, JSON.stringify(record), 'PX', heartbeatMs * 3);
  }
  const beat = () => heartbeat().catch((error: unknown) => logger.warn({ err: error }, 'worker heartbeat failed'));

  async function processJob(job: Job<ChunkJobData, ChunkJobResult>, _token?: string, signal?: AbortSignal): Promise<ChunkJobResult> {
    const { runId, chunks, scenario, points } = job.data;
    if (await commands.exists(cancelledKey(options.queue, runId))) throw new UnrecoverableError('the run was cancelled');
    activeJobs++;
    running.add(job.id!);
    try {
      const base = await preparedFor(scenario);
      if (points) {
        let passes = passesOfRun.get(runId);
        if (!passes) {
          passes = preparePointPasses(scenario, points, preparedFor);
          passes.catch(() => passesOfRun.delete(runId));
          passesOfRun.set(runId, passes);
          if (passesOfRun.size > PREPARED_CACHE) passesOfRun.delete(passesOfRun.keys().next().value!);
        }
        const packed = (await pool.run({ prepared: base, chunks, passes: await passes, packed: true }, { signal })) as PackedTallies;
        jobsDone++;
        return { chunks, tally: unpackTally(packed, 0), packed: encodePackedTallies(packed) };
      }
      const tally = (await pool.run({ prepared: base, chunks }, { signal })) as ChunkTally;
      jobsDone++;
      return { chunks, tally };
    } catch (error) {
      if (signal?.aborted) throw new UnrecoverableError('the run was cancelled');
      throw error;
    } finally {
      running.delete(job.id!);
      activeJobs--;
      void beat();
    }
  }

  const worker = new Worker<ChunkJobData, ChunkJobResult>(options.queue, processJob, {
    connection: redisConnection(options.url),
    concurrency: threads,
    autorun: false,
    ...(options.lockDurationMs ? { lockDuration: options.lockDurationMs } : {}),
    ...(options.stalledIntervalMs ? { stalledInterval: options.stalledIntervalMs } : {}),
  });
  worker.on('error', (error) => logger.error({ err: error }, 'BullMQ worker error'));
  worker.on('failed', (job, error) => logger.warn({ jobId: job?.id, err: error }, 'chunk job failed'));

  subscriber.on('message', (_channel, runId: string) => {
    // Abort this worker's running jobs of the cancelled run (their ids start with the run id).
    for (const jobId of running) if (jobId.startsWith(`${runId}-`)) worker.cancelJob(jobId, 'the run was cancelled');
  });

  let timer: NodeJS.Timeout | undefined;
  return {
    id,
    worker,
    stats: () => ({ jobsDone, activeJobs }),
    async start(): Promise<void> {
      await subscriber.subscribe(cancelChannel(options.queue));
      await heartbeat();
      timer = setInterval(beat, heartbeatMs);
      void worker.run().catch((error: unknown) => logger.error({ err: error }, 'BullMQ worker stopped'));
      await worker.waitUntilReady();
      logger.info({ id, threads, queue: options.queue }, 'chunk worker ready');
    },
    /** Finishes the jobs in hand (no new ones), then leaves: for SIGTERM. */
    async close(): Promise<void> {
      if (timer) clearInterval(timer);
      await worker.close();
      await commands.del(`${workerKeyPrefix(options.queue)}${id}`).catch(() => 0);
      subscriber.disconnect();
      commands.disconnect();
    },
  };
}
