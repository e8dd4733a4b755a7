import type { Logger } from 'pino';
import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { RunProgressEvent, RunStatus } from '../../../shared/contracts/runs.ts';
import { parseScenario, type Scenario } from '../../../shared/contracts/scenario.ts';
import type { Db } from '../../db/client.ts';
import { addTally, type ChunkTally } from '../../../shared/engine/kernel/tally.ts';
import { ChunkSet } from './chunk-set.ts';
import { resultBinRows } from './result-bins.ts';
import type { RunEvents } from './run-events.ts';
import {
  claimQueuedRun,
  deleteCheckpoint,
  loadCheckpoint,
  loadRun,
  queuedRuns,
  requeueInterrupted,
  saveCheckpoint,
  saveResult,
  updateRun,
  type RunRow,
} from './runs.repository.ts';

/** Runs a scenario on the worker pool (server/engine-pool's runScenario, bound to the server's pool). */
export type RunEngine = (
  scenario: Scenario,
  options: {
    signal: AbortSignal;
    skipChunks: Set<number>;
    initialTally?: ChunkTally;
    onChunk: (chunkIndex: number, tally: ChunkTally) => void;
  },
) => Promise<ScenarioResult>;

export interface SchedulerOptions {
  /** Runs executing at once over all departments (they share the pool's threads). */
  maxConcurrentRuns: number;
  /** Runs one department may have executing at once. */
  maxRunsPerDepartment: number;
  /** Shortest interval between checkpoint writes of one run. */
  checkpointIntervalMs: number;
  /** How often the queue is looked at even when nothing woke the scheduler. */
  pollIntervalMs: number;
}

/** Told when a run reaches a final state (billing settles or refunds, e-mail notices go out). */
export type RunSettledHook = (run: RunRow, outcome: 'succeeded' | 'failed' | 'cancelled') => Promise<void>;

interface ActiveRun {
  controller: AbortController;
  /** Why the run is being aborted: a user's cancel, or the server stopping (then it resumes on the next boot). */
  reason: 'cancel' | 'stop' | null;
  done: Promise<void>;
  chunkCount: number;
  chunksDone: number;
  startedMs: number;
  chunksAtStart: number;
}

const PUBLISH_INTERVAL_MS = 250;

/**
 * The run queue. Runs wait in MariaDB (status queued); the scheduler starts them on the worker
 * pool with fair share between departments (the department with the fewest executing runs goes
 * first, oldest run first within it) and a per-department limit. Every finished chunk is added
 * to running totals that are checkpointed, so a run interrupted by a stopping server resumes on
 * the next start from its last checkpoint and ends with exactly the counts of an uninterrupted run.
 */
export function createRunScheduler(deps: {
  db: Db;
  engine: RunEngine;
  events: RunEvents;
  logger: Logger;
  options: SchedulerOptions;
  onSettled?: RunSettledHook;
}) {
  const { db, engine, events, logger, options } = deps;
  const active = new Map<string, ActiveRun>();
  /** Department of each executing run, for fair share. */
  const activeDepartments = new Map<string, string>();
  let timer: NodeJS.Timeout | undefined;
  let ticking: Promise<void> | null = null;
  let again = false;
  let stopped = true;

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

  async function settle(runId: string, outcome: 'succeeded' | 'failed' | 'cancelled') {
    if (!deps.onSettled) return;
    const run = await loadRun(db, runId);
    if (run) await deps.onSettled(run, outcome).catch((error: unknown) => logger.error({ err: error, runId }, 'run settlement hook failed'));
  }

  async function execute(runId: string, entry: ActiveRun): Promise<void> {
    const run = await loadRun(db, runId);
    if (!run) return;
    const scenario = parseScenario(run.snapshot);
    const checkpoint = await loadCheckpoint(db, runId);
    const done = new ChunkSet(checkpoint?.doneChunks ?? []);
    let tally: ChunkTally | undefined = checkpoint ? (JSON.parse(checkpoint.tally) as ChunkTally) : undefined;
    entry.chunkCount = run.chunkCount;
    entry.chunksDone = done.size;
    entry.chunksAtStart = done.size;

    // Checkpoint writes are chained so they land in order; each writes a consistent snapshot.
    let writes: Promise<unknown> = Promise.resolve();
    let lastWrite = 0;
    let lastPublish = 0;
    const persist = (force: boolean) => {
      const now = Date.now();
      if (!force && now - lastWrite < options.checkpointIntervalMs) return;
      lastWrite = now;
      if (!tally) return;
      const snapshot = { tally: JSON.stringify(tally), ranges: done.ranges(), chunksDone: done.size };
      writes = writes
        .then(async () => {
          await saveCheckpoint(db, runId, snapshot.tally, snapshot.ranges);
          await updateRun(db, runId, { chunksDone: snapshot.chunksDone, progress: snapshot.chunksDone / run.chunkCount }, ['running']);
        })
        .catch((error: unknown) => logger.error({ err: error, runId }, 'checkpoint write failed'));
    };

    publish(runId, 'running', done.size, run.chunkCount);
    try {
      const result = await engine(scenario, {
        signal: entry.controller.signal,
        skipChunks: done.toSet(),
        initialTally: tally,
        onChunk: (chunkIndex, chunkTally) => {
          if (done.has(chunkIndex)) return;
          tally = tally ? addTally(tally, chunkTally) : chunkTally;
          done.add(chunkIndex);
          entry.chunksDone = done.size;
          persist(false);
          const now = Date.now();
          if (now - lastPublish >= PUBLISH_INTERVAL_MS) {
            lastPublish = now;
            publish(runId, 'running', done.size, run.chunkCount);
          }
        },
      });
      await writes;
      const computeMs = run.computeMs + (Date.now() - entry.startedMs);
      await db.transaction(async (tx) => {
        await saveResult(tx, runId, JSON.stringify(result), resultBinRows(runId, result));
        await updateRun(tx, runId, {
          status: 'succeeded',
          progress: 1,
          chunksDone: run.chunkCount,
          whiteDwarfs: result.counts.whiteDwarfs,
          magnetic: result.counts.magnetic,
          fraction: result.fraction.value,
          fractionSe: result.fraction.se,
          finishedAt: new Date(),
          computeMs,
          error: null,
        });
        await deleteCheckpoint(tx, runId);
      });
      publish(runId, 'succeeded', run.chunkCount, run.chunkCount);
      logger.info({ runId, systems: run.systems, computeMs }, 'run succeeded');
      await settle(runId, 'succeeded');
    } catch (error) {
      await writes;
      const computeMs = run.computeMs + (Date.now() - entry.startedMs);
      if (entry.reason === 'stop') {
        // Keep status 'running' and the newest checkpoint: the next start resumes from it.
        persist(true);
        await writes;
        await updateRun(db, runId, { computeMs });
        logger.info({ runId, chunksDone: done.size }, 'run interrupted by shutdown; it resumes on the next start');
        return;
      }
      if (entry.reason === 'cancel') {
        await updateRun(db, runId, { status: 'cancelled', finishedAt: new Date(), computeMs, chunksDone: done.size, progress: done.size / run.chunkCount });
        await deleteCheckpoint(db, runId);
        publish(runId, 'cancelled', done.size, run.chunkCount);
        await settle(runId, 'cancelled');
        return;
      }
      const message = error instanceof Error ? error.message : String(error);
      logger.warn({ runId, err: error }, 'run failed');
      await updateRun(db, runId, { status: 'failed', error: message.slice(0, 4000), finishedAt: new Date(), computeMs, chunksDone: done.size, progress: done.size / run.chunkCount });
      await deleteCheckpoint(db, runId);
      publish(runId, 'failed', done.size, run.chunkCount, message);
      await settle(runId, 'failed');
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

  /** One look at the queue: starts as many runs as the limits allow, fairly across departments. */
  async function tick(): Promise<void> {
    if (stopped) return;
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
      if (!(await claimQueuedRun(db, pick.id, new Date()))) continue;
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
      .catch((error: unknown) => logger.error({ err: error }, 'scheduler tick failed'))
      .finally(() => {
        ticking = null;
        if (again) {
          again = false;
          wake();
        }
      });
  }

  return {
    /** Puts runs a stopped server left running back in the queue, then starts taking runs. */
    async start(): Promise<void> {
      const resumed = await requeueInterrupted(db);
      if (resumed > 0) logger.info({ resumed }, 'resuming runs interrupted by the last shutdown');
      stopped = false;
      timer = setInterval(wake, options.pollIntervalMs);
      timer.unref();
      wake();
    },

    wake,

    /** Cancels a queued or running run. Returns false if it had already finished. */
    async cancel(runId: string): Promise<boolean> {
      if (await updateRun(db, runId, { status: 'cancelled', finishedAt: new Date() }, ['queued'])) {
        const run = await loadRun(db, runId);
        if (run) publish(runId, 'cancelled', run.chunksDone, run.chunkCount);
        await settle(runId, 'cancelled');
        return true;
      }
      const entry = active.get(runId);
      if (entry) {
        entry.reason = 'cancel';
        entry.controller.abort();
        await entry.done;
        return true;
      }
      // Running but not here (claimed by a process that died without a restart): end it.
      if (await updateRun(db, runId, { status: 'cancelled', finishedAt: new Date() }, ['running'])) {
        await deleteCheckpoint(db, runId);
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
      const entries = [...active.values()];
      for (const entry of entries) {
        entry.reason = 'stop';
        entry.controller.abort();
      }
      await Promise.all(entries.map((e) => e.done));
    },
  };
}

export type RunScheduler = ReturnType<typeof createRunScheduler>;
