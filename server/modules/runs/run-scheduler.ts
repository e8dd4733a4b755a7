import type { Logger } from 'pino';
import type { RunProgressEvent, RunStatus } from '../../../shared/contracts/runs.ts';
import { scenarioAtPoint } from '../../../shared/contracts/point-scenario.ts';
import type { Scenario } from '../../../shared/contracts/scenario.ts';
import { scenarioHash } from '../../../shared/engine/kernel/scenario-hash.ts';
import { addPackedIntoAll } from '../../../shared/engine/kernel/packed-tally.ts';
import { addTallyInto, emptyTallyFor, type ChunkTally } from '../../../shared/engine/kernel/tally.ts';
import { buildResult } from '../../../shared/engine/result/build-result.ts';
import { RunAbortedError, type ChunkExecutor } from '../../engine-pool/chunk-executor.ts';
import type { Db } from '../../db/client.ts';
import { ChunkSet } from './chunk-set.ts';
import { isDatabaseUnavailable, retryWhileDatabaseDown } from './database-retry.ts';
import { resultBinRows } from './result-bins.ts';
import type { RunEvents } from './run-events.ts';
import {
  claimQueuedRun,
  deleteCheckpoint,
  loadCheckpoint,
  loadCheckpointTallies,
  loadRun,
  queuedRuns,
  releaseLeases,
  renewLeases,
  requeueOrphans,
  saveCheckpoint,
  saveJobCheckpoint,
  saveResult,
  updateRun,
  updateRuns,
  type RunRow,
} from './runs.repository.ts';

export interface SchedulerOptions {
  /** Runs executing at once over all departments (they share the pool's threads or the workers). */
  maxConcurrentRuns: number;
  /** Runs one department may have executing at once. */
  maxRunsPerDepartment: number;
  /** Shortest interval between checkpoint writes of one run. */
  checkpointIntervalMs: number;
  /** How often the queue is looked at (and leases renewed, orphans re-queued) even when nothing woke the scheduler. */
  pollIntervalMs: number;
  /** How long a claim on a running run lasts without renewal; a lapsed one marks the run orphaned. */
  leaseMs: number;
  /** Back-off of the final save and settlement while the database is down. */
  saveRetry: { firstDelayMs: number; maxDelayMs: number };
}

export const DEFAULT_SCHEDULER_TIMING = {
  pollIntervalMs: 2000,
  leaseMs: 30_000,
  saveRetry: { firstDelayMs: 200, maxDelayMs: 10_000 },
} as const;

/**
 * Told when a multi-point job has computed every point, after the points with runs of their own
 * have their results saved and before the job settles (a fit computes its posterior here). It
 * must not throw: what it stores on failure is its own business.
 */
export type JobFinishedHook = (run: RunRow, tallies: ChunkTally[], scenarios: Scenario[]) => Promise<void>;

/** Told when a run reaches a final state (billing settles or refunds, e-mail notices go out). */
export type RunSettledHook = (run: RunRow, outcome: 'succeeded' | 'failed' | 'cancelled') => Promise<void>;

interface ActiveRun {
  controller: AbortController;
  /** Why the run is being aborted: a user's cancel, or the server stopping (then it resumes on the next start). */
  reason: 'cancel' | 'stop' | null;
  done: Promise<void>;
  chunkCount: number;
  chunksDone: number;
  startedMs: number;
  chunksAtStart: number;
}

const PUBLISH_INTERVAL_MS = 250;

/**
 * The run queue. Runs wait in MariaDB (status queued); the scheduler starts them on the chunk
 * executor (the app's own pool, or BullMQ workers) with fair share between departments (the
 * department with the fewest executing runs goes first, oldest run first within it) and a
 * per-department limit. The scheduler owns each run's one running total: every finished batch is
 * added to it once and it is checkpointed, so a run interrupted by a stopping server, a crash or
 * a failed batch continues from its checkpoint and ends with exactly the counts of an
 * uninterrupted run. Executing runs hold a lease that the scheduler renews; a watchdog re-queues
 * running runs whose lease lapsed (no live executor). The final save and settlement retry with
 * back-off while the database is down.
 */
export function createRunScheduler(deps: {
  db: Db;
  executor: ChunkExecutor;
  events: RunEvents;
  logger: Logger;
  options: SchedulerOptions;
  onSettled?: RunSettledHook;
}) {
  const { db, executor, events, logger, options } = deps;
  let onJobFinished: JobFinishedHook | undefined;
  const active = new Map<string, ActiveRun>();
  /** Department of each executing run, for fair share. */
  const activeDepartments = new Map<string, string>();
  let timer: NodeJS.Timeout | undefined;
  let ticking: Promise<void> | null = null;
  let again = false;
  let stopped = true;

  const leaseUntil = () => new Date(Date.now() + options.leaseMs);

  function etaSeconds(run: ActiveRun): number | null {
    const doneHere = run.chunksDone - run.chunksAtStart;
    const elapsed = (Date.now() - run.startedMs) / 1000;
    if (doneHere < 2 || elapsed < 1) return null;
    return Math.round(((run.chunkCount - run.chunksDone) / doneHere) * elapsed);
  }

  function publish(id: string, status: RunStatus, chunksDone: number, chunkCount: number, error: string | null = null) {
    const entry = active.get(id);
    const event: RunProgressEvent = {
      id,
      status,
      chunksDone,
      chunkCount,
      progress: chunkCount > 0 ? chunksDone / chunkCount : 0,
      etaSeconds: status === 'running' && entry ? etaSeconds(entry) : null,
      error,
    };
    events.publish(event);
  }

  /** Retries `work` while the database is down; gives up only when the scheduler stops. */
  function untilDatabase<T>(runId: string, what: string, work: () => Promise<T>, signal?: AbortSignal): Promise<T> {
    return retryWhileDatabaseDown(work, {
      ...options.saveRetry,
      signal,
      onRetry: (error, delayMs, attempt) => logger.warn({ runId, err: error, delayMs, attempt }, `${what}: database unavailable, retrying`),
    });
  }

  async function settle(runId: string, outcome: 'succeeded' | 'failed' | 'cancelled', signal?: AbortSignal) {
    if (!deps.onSettled) return;
    const hook = deps.onSettled;
    try {
      // Settlement is idempotent (one ledger key per run), so retrying after an outage settles once.
      await untilDatabase(runId, 'settling the run', async () => {
        const run = await loadRun(db, runId);
        if (run) await hook(run, outcome);
      }, signal);
    } catch (error) {
      logger.error({ err: error, runId }, 'run settlement hook failed');
    }
  }

  async function execute(runId: string, entry: ActiveRun): Promise<void> {
    const run = await loadRun(db, runId);
    if (!run) return;
    const scenario = run.snapshot;
    const checkpoint = await loadCheckpoint(db, runId);
    const done = new ChunkSet(checkpoint?.doneChunks ?? []);
    // A multi-point job computes every point from the same draws; the run itself is its first point.
    const job = run.jobPoints;
    const pointScenarios: Scenario[] = job ? job.values.map((values, p) => (p === 0 ? scenario : scenarioAtPoint(scenario, values))) : [scenario];
    const pointRunIds: string[] = job ? [...new Set(job.runIds.filter((id): id is string => id !== null))] : [runId];
    const passengers = pointRunIds.filter((id) => id !== runId);
    // The running totals, one per point: the checkpoint's, or the engine's empty tallies.
    const totals: ChunkTally[] = checkpoint
      ? await loadCheckpointTallies(db, checkpoint, job ? job.values.length : null)
      : pointScenarios.map((s, p) => emptyTallyFor(p === 0 ? run.scenarioHash : scenarioHash(s)));
    const total = totals[0];
    if (passengers.length > 0) await updateRuns(db, passengers, { status: 'running', startedAt: new Date() }, ['queued', 'running']);
    entry.chunkCount = run.chunkCount;
    entry.chunksDone = done.size;
    entry.chunksAtStart = done.size;
    const pending: number[] = [];
    for (let i = 0; i < run.chunkCount; i++) if (!done.has(i)) pending.push(i);

    // Checkpoint writes are chained so they land in order; each writes a consistent snapshot. A
    // single run's snapshot is one string taken at once; a job's tallies are serialised point by
    // point while the write runs, so the batch loop waits for it (and the next write is due only
    // after nine times the last one's duration: writing a 10^4-point job costs ≤ 10% of the time).
    let writes: Promise<unknown> = Promise.resolve();
    let lastWrite = 0;
    let lastWriteMs = 0;
    let lastPublish = 0;
    let dirty = false;
    const persist = (force: boolean): Promise<unknown> => {
      const now = Date.now();
      if (!dirty || (!force && now - lastWrite < Math.max(options.checkpointIntervalMs, 9 * lastWriteMs))) return writes;
      lastWrite = now;
      dirty = false;
      const snapshot = { tally: job ? null : JSON.stringify(total), ranges: done.ranges(), chunksDone: done.size };
      writes = writes
        .then(async () => {
          const began = Date.now();
          if (snapshot.tally === null) await saveJobCheckpoint(db, runId, totals, snapshot.ranges);
          else await saveCheckpoint(db, runId, snapshot.tally, snapshot.ranges);
          lastWriteMs = Date.now() - began;
          await updateRun(db, runId, { chunksDone: snapshot.chunksDone, progress: snapshot.chunksDone / run.chunkCount }, ['running']);
          await updateRuns(db, passengers, { chunksDone: snapshot.chunksDone, progress: snapshot.chunksDone / run.chunkCount }, ['running']);
        })
        .catch((error: unknown) => {
          dirty = true;
          logger.error({ err: error, runId }, 'checkpoint write failed');
        });
      return writes;
    };

    publish(runId, 'running', done.size, run.chunkCount);
    try {
      const points = job ? job.values : undefined;
      for await (const batch of executor.execute({ runId, scenario, pending, signal: entry.controller.signal, ...(points ? { points } : {}) })) {
        // A batch delivered twice (a replayed job) is counted once.
        if (batch.chunks.some((chunk) => done.has(chunk))) continue;
        if (job) {
          if (!batch.pointTallies) throw new Error(`a batch of a ${totals.length}-point job came back without its point tallies`);
          addPackedIntoAll(totals, batch.pointTallies);
        } else addTallyInto(total, batch.tally);
        for (const chunk of batch.chunks) done.add(chunk);
        dirty = true;
        entry.chunksDone = done.size;
        if (job) await persist(false);
        else void persist(false);
        const now = Date.now();
        if (now - lastPublish >= PUBLISH_INTERVAL_MS) {
          lastPublish = now;
          publish(runId, 'running', done.size, run.chunkCount);
          for (const id of passengers) publish(id, 'running', done.size, run.chunkCount);
        }
      }
      if (entry.controller.signal.aborted) throw new RunAbortedError(entry.controller.signal.reason);
      if (done.size !== run.chunkCount) throw new Error(`the executor finished with ${run.chunkCount - done.size} of ${run.chunkCount} chunks missing`);
      await writes;
      const computeMs = run.computeMs + (Date.now() - entry.startedMs);
      // Every point with a run of its own gets its result (passengers first: the job's own run
      // succeeding last means a retry after an outage saves whatever is still missing).
      const saves = job ? job.runIds.map((id, p) => ({ id, p })).filter((x): x is { id: string; p: number } => x.id !== null) : [{ id: runId, p: 0 }];
      saves.sort((a, b) => Number(a.id === runId) - Number(b.id === runId));
      for (const { id, p } of saves) {
        const result = buildResult(pointScenarios[p], totals[p]);
        const resultJson = JSON.stringify(result);
        const bins = resultBinRows(id, result);
        // Saved once: a retry after a commit whose answer was lost finds the run already succeeded.
        await untilDatabase(runId, 'saving the result', async () => {
          await db.transaction(async (tx) => {
            const current = await loadRun(tx, id);
            if (!current || current.status === 'succeeded') return;
            await saveResult(tx, id, resultJson, bins);
            await updateRun(tx, id, {
              status: 'succeeded',
              progress: 1,
              chunksDone: run.chunkCount,
              whiteDwarfs: result.counts.whiteDwarfs,
              magnetic: result.counts.magnetic,
              fraction: result.fraction.value,
              fractionSe: result.fraction.se,
              finishedAt: new Date(),
              computeMs: id === runId ? computeMs : 0,
              error: null,
              leaseUntil: null,
            });
            if (id === runId) await deleteCheckpoint(tx, runId);
          });
        }, entry.controller.signal);
      }
      if (job) await onJobFinished?.((await loadRun(db, runId)) ?? run, totals, pointScenarios);
      for (const id of pointRunIds) publish(id, 'succeeded', run.chunkCount, run.chunkCount);
      logger.info({ runId, systems: run.systems, points: totals.length, computeMs }, 'run succeeded');
      for (const id of passengers) await settle(id, 'succeeded', entry.controller.signal);
      await settle(runId, 'succeeded', entry.controller.signal);
    } catch (error) {
      await writes;
      const computeMs = run.computeMs + (Date.now() - entry.startedMs);
      if (entry.reason === 'stop') {
        // Keep status 'running' and the newest checkpoint: the next start resumes from it.
        await persist(true);
        await updateRun(db, runId, { computeMs }).catch((e: unknown) => logger.error({ err: e, runId }, 'could not record compute time'));
        logger.info({ runId, chunksDone: done.size }, 'run interrupted by shutdown; it resumes on the next start');
        return;
      }
      if (entry.reason === 'cancel') {
        await untilDatabase(runId, 'cancelling the run', async () => {
          await updateRun(db, runId, { status: 'cancelled', finishedAt: new Date(), computeMs, chunksDone: done.size, progress: done.size / run.chunkCount, leaseUntil: null });
          await updateRuns(db, passengers, { status: 'cancelled', finishedAt: new Date() }, ['queued', 'running']);
          await deleteCheckpoint(db, runId);
        });
        for (const id of pointRunIds) publish(id, 'cancelled', done.size, run.chunkCount);
        for (const id of passengers) await settle(id, 'cancelled');
        await settle(runId, 'cancelled');
        return;
      }
      // A failure keeps the checkpoint, so that resuming continues from what was computed.
      const message = error instanceof Error ? error.message : String(error);
      logger.warn({ runId, err: error }, 'run failed');
      await persist(true);
      await untilDatabase(runId, 'recording the failure', async () => {
        await updateRun(db, runId, { status: 'failed', error: message.slice(0, 4000), finishedAt: new Date(), computeMs, chunksDone: done.size, progress: done.size / run.chunkCount, leaseUntil: null });
        await updateRuns(db, passengers, { status: 'failed', error: message.slice(0, 4000), finishedAt: new Date() }, ['queued', 'running']);
      });
      for (const id of pointRunIds) publish(id, 'failed', done.size, run.chunkCount, message);
      for (const id of passengers) await settle(id, 'failed');
      await settle(runId, 'failed');
    } finally {
      if (entry.reason !== 'stop') await executor.forget?.(runId).catch((e: unknown) => logger.warn({ err: e, runId }, 'executor cleanup failed'));
    }
  }

  function start(runId: string) {
    const entry: ActiveRun = {
      controller: new AbortController(),
      reason: null,
      done: Promise.resolve(),
      chunkCount: 0,
      chunksDone: 0,
      startedMs: Date.now(),
      chunksAtStart: 0,
    };
    active.set(runId, entry);
    entry.done = execute(runId, entry)
      .catch((error: unknown) => logger.error({ err: error, runId }, 'run execution crashed'))
      .finally(() => {
        active.delete(runId);
        activeDepartments.delete(runId);
        wake();
      });
  }

  /** The watchdog: renews this scheduler's leases, then re-queues running runs that nobody vouches for. */
  async function watchdog(): Promise<void> {
    const own = [...active.keys()];
    await renewLeases(db, own, leaseUntil());
    const orphans = await requeueOrphans(db, new Date(), own);
    if (orphans > 0) logger.info({ orphans }, 're-queued running runs without a live executor; they resume from their checkpoints');
  }

  /** One look at the queue: starts as many runs as the limits allow, fairly across departments. */
  async function tick(): Promise<void> {
    if (stopped) return;
    await watchdog();
    const free = options.maxConcurrentRuns - active.size;
    if (free <= 0) return;
    const queued = await queuedRuns(db, 500);
    const executing = new Map<string, number>();
    for (const id of active.keys()) {
      const dept = activeDepartments.get(id);
      if (dept) executing.set(dept, (executing.get(dept) ?? 0) + 1);
    }
    const taken = new Set<string>();
    for (let slot = 0; slot < free && !stopped; ) {
      let pick: (typeof queued)[number] | undefined;
      for (const candidate of queued) {
        if (taken.has(candidate.id)) continue;
        const running = executing.get(candidate.departmentId) ?? 0;
        if (running >= options.maxRunsPerDepartment) continue;
        if (!pick || running < (executing.get(pick.departmentId) ?? 0)) pick = candidate;
      }
      if (!pick) break;
      taken.add(pick.id);
      if (!(await claimQueuedRun(db, pick.id, new Date(), leaseUntil()))) continue;
      activeDepartments.set(pick.id, pick.departmentId);
      executing.set(pick.departmentId, (executing.get(pick.departmentId) ?? 0) + 1);
      start(pick.id);
      slot += 1;
    }
  }

  function wake(): void {
    if (stopped) return;
    if (ticking) {
      again = true;
      return;
    }
    ticking = tick()
      .catch((error: unknown) =>
        // A deadlock or a dropped connection (e.g. the lease renewal against a concurrent cancel) is
        // transient: the next tick does the same work again, well inside the lease.
        isDatabaseUnavailable(error)
          ? logger.warn({ err: error }, 'scheduler tick hit a transient database error; the next tick retries')
          : logger.error({ err: error }, 'scheduler tick failed'),
      )
      .finally(() => {
        ticking = null;
        if (again) {
          again = false;
          wake();
        }
      });
  }

  return {
    /** Puts runs that no live scheduler executes back in the queue, then starts taking runs. */
    async start(): Promise<void> {
      const resumed = await requeueOrphans(db, new Date(), [...active.keys()]);
      if (resumed > 0) logger.info({ resumed }, 'resuming runs interrupted by the last shutdown');
      stopped = false;
      timer = setInterval(wake, options.pollIntervalMs);
      timer.unref();
      wake();
    },

    wake,

    /** Registers the hook told when a multi-point job has computed every point (the fits module's). */
    onJobFinished(hook: JobFinishedHook): void {
      onJobFinished = hook;
    },

    /** Cancels a queued or running run (a point of a multi-point job cancels the whole job). Returns false if it had already finished. */
    async cancel(runId: string): Promise<boolean> {
      const own = await loadRun(db, runId);
      if (own?.jobRunId) return this.cancel(own.jobRunId);
      const passengersOf = (run: RunRow | undefined) => (run?.jobPoints?.runIds ?? []).filter((id): id is string => id !== null && id !== runId);
      if (await updateRun(db, runId, { status: 'cancelled', finishedAt: new Date() }, ['queued'])) {
        const run = await loadRun(db, runId);
        const passengers = [...new Set(passengersOf(run))];
        await updateRuns(db, passengers, { status: 'cancelled', finishedAt: new Date() }, ['queued', 'running']);
        if (run) for (const id of [runId, ...passengers]) publish(id, 'cancelled', run.chunksDone, run.chunkCount);
        await executor.cancel?.(runId);
        for (const id of passengers) await settle(id, 'cancelled');
        await settle(runId, 'cancelled');
        return true;
      }
      const entry = active.get(runId);
      if (entry) {
        entry.reason = 'cancel';
        entry.controller.abort();
        await executor.cancel?.(runId);
        await entry.done;
        return true;
      }
      // Running but not here (claimed by a process that died without a restart): end it.
      if (await updateRun(db, runId, { status: 'cancelled', finishedAt: new Date(), leaseUntil: null }, ['running'])) {
        const passengers = [...new Set(passengersOf(own))];
        await updateRuns(db, passengers, { status: 'cancelled', finishedAt: new Date() }, ['queued', 'running']);
        await executor.cancel?.(runId);
        await deleteCheckpoint(db, runId);
        for (const id of passengers) await settle(id, 'cancelled');
        await settle(runId, 'cancelled');
        return true;
      }
      return false;
    },

    /** Live progress of an executing run (for the detail endpoint's ETA). */
    live(runId: string): { chunksDone: number; etaSeconds: number | null } | null {
      const entry = active.get(runId);
      return entry ? { chunksDone: entry.chunksDone, etaSeconds: etaSeconds(entry) } : null;
    },

    activeRunIds(): string[] {
      return [...active.keys()];
    },

    /** Stops taking runs and interrupts the executing ones, checkpointing them for the next start. */
    async stop(): Promise<void> {
      stopped = true;
      if (timer) clearInterval(timer);
      await ticking;
      const entries = [...active.entries()];
      for (const [, entry] of entries) {
        entry.reason = 'stop';
        entry.controller.abort(new RunAbortedError('the server is stopping'));
      }
      await Promise.all(entries.map(([, e]) => e.done));
      await releaseLeases(db, entries.map(([id]) => id)).catch((error: unknown) => logger.warn({ err: error }, 'could not release run leases'));
    },
  };
}

export type RunScheduler = ReturnType<typeof createRunScheduler>;
