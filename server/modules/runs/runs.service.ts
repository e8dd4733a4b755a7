import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { CreateRunBody, RunListQuery, RunSummary } from '../../../shared/contracts/runs.ts';
import { parseScenario, type Scenario } from '../../../shared/contracts/scenario.ts';
import { listPriceCredits, OBSERVER_MAX_SYSTEMS } from '../../../shared/contracts/pricing.ts';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import type { Db, Tx } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { planChunks } from '../../../shared/engine/kernel/chunks.ts';
import { scenarioHash } from '../../../shared/engine/kernel/scenario-hash.ts';
import { ENGINE_VERSION } from '../../../shared/engine/version.ts';
import { AppError, conflict, forbidden, notFound } from '../../lib/errors.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import type { OccurrenceTablesService } from '../occurrence-tables/occurrence-tables.service.ts';
import type { SamplesService } from '../samples/samples.service.ts';
import { invalidDocument } from '../scenarios/scenarios.errors.ts';
import type { ScenariosService } from '../scenarios/scenarios.service.ts';
import { compareRunWithSample } from './comparison.ts';
import { methodsParagraph, resultCsv } from './run-exports.ts';
import type { RunScheduler } from './run-scheduler.ts';
import { eq } from 'drizzle-orm';
import { sweepPointText, sweepPointValues } from '../../../shared/contracts/sweep-point.ts';
import { sweeps } from '../sweeps/sweeps.table.ts';
import { deleteRun, moveCheckpoint, findRun, findRunsByIds, insertRun, listRuns, loadResult, loadRun, type RunRow } from './runs.repository.ts';

export const runNotFound = () => notFound('That run');
const notFinished = (status: string) =>
  new AppError({ code: 'run_not_finished', status: 409, message: `The run has no result yet (it is ${status}); results exist once it has succeeded.` });

/**
 * Charging for runs (server/modules/billing). Reserve is called before a run is queued, inside
 * its transaction: it reserves the cost (free systems first, shared/contracts/pricing.ts) and
 * returns the credits reserved, or throws a 402 so that nothing is queued.
 */
export interface RunBilling {
  reserve(tx: Tx, run: { id: string; departmentId: string; userId: string; systems: number }): Promise<{ costCredits: number }>;
}

/** Charges nothing; records the list price (tests that inject their own billing). */
export const noBilling: RunBilling = { reserve: async (_tx, run) => ({ costCredits: listPriceCredits(run.systems) }) };

export function toRunSummary(run: RunRow, ownerName: string, live?: { chunksDone: number; etaSeconds: number | null } | null): RunSummary {
  const chunksDone = live?.chunksDone ?? run.chunksDone;
  return {
    id: run.id,
    scenarioId: run.scenarioId,
    scenarioName: run.scenarioName,
    scenarioVersion: run.scenarioVersion,
    scenarioHash: run.scenarioHash,
    status: run.status,
    progress: run.status === 'succeeded' ? 1 : run.chunkCount > 0 ? chunksDone / run.chunkCount : 0,
    chunksDone,
    chunkCount: run.chunkCount,
    systems: run.systems,
    seed: run.seed,
    engineVersion: run.engineVersion,
    costCredits: run.costCredits,
    whiteDwarfs: run.whiteDwarfs,
    magnetic: run.magnetic,
    fraction: run.fraction,
    fractionSe: run.fractionSe,
    ownerUserId: run.ownerUserId,
    ownerName,
    sweepId: run.sweepId,
    sweepPointIndex: run.sweepPointIndex,
    error: run.error,
    createdAt: run.createdAt.toISOString(),
    startedAt: run.startedAt?.toISOString() ?? null,
    finishedAt: run.finishedAt?.toISOString() ?? null,
    computeMs: run.computeMs,
    resumes: run.resumes,
    etaSeconds: run.status === 'running' ? (live?.etaSeconds ?? null) : null,
  };
}

export interface RunsServiceDeps {
  db: Db;
  scheduler: RunScheduler;
  scenarios: ScenariosService;
  tables: OccurrenceTablesService;
  samples: SamplesService;
  billing: RunBilling;
}

export function createRunsService({ db, scheduler, scenarios, tables, samples, billing }: RunsServiceDeps) {
  /** The scenario as it will run: stored table rows inlined, seed and systems overridden, validated again. */
  async function snapshotOf(departmentId: string, scenario: Scenario, overrides: { systems?: number; seed?: string }): Promise<Scenario> {
    const doc: Record<string, unknown> = structuredClone(scenario) as unknown as Record<string, unknown>;
    if (overrides.systems !== undefined) doc.systems = overrides.systems;
    if (overrides.seed !== undefined) doc.seed = overrides.seed;
    const companions = doc.companions as { tableId?: string; rows?: unknown[]; multiplier: number };
    if (companions.tableId) {
      const rows = await tables.rowsFor(departmentId, companions.tableId).catch(() => {
        throw invalidDocument([{ field: 'companions.tableId', message: `companions.tableId names no occurrence table of this department (got "${companions.tableId}")` }]);
      });
      doc.companions = { multiplier: companions.multiplier, rows };
    }
    try {
      return parseScenario(doc);
    } catch (error) {
      const issues = (error as { issues?: { field: string; message: string }[] }).issues;
      if (issues) throw invalidDocument(issues);
      throw error;
    }
  }

  function checkSize(auth: RequestAuth, systems: number) {
    if (!roleAtLeast(auth.role!, 'modeller') && systems > OBSERVER_MAX_SYSTEMS) {
      throw new AppError({
        code: 'forbidden',
        status: 403,
        field: 'systems',
        message: `Observers may start runs of at most ${OBSERVER_MAX_SYSTEMS.toLocaleString('en-US')} systems (this one has ${systems.toLocaleString('en-US')}); ask a modeller for a larger run.`,
      });
    }
  }

  /** Queues one run of a fully resolved scenario (used by runs, sweeps and fits). */
  async function enqueue(
    auth: RequestAuth,
    source: { scenarioId: string; scenarioVersion: number; scenarioName: string },
    snapshot: Scenario,
    extra: {
      sweepId?: string;
      sweepPointIndex?: number;
      tx?: Tx;
      /** The run's id, when the caller needs it before queueing (the points of a multi-point job name each other). */
      id?: string;
      /** This run computes a multi-point job: every point's values and the run receiving each point's result. */
      jobPoints?: { values: Record<string, number>[]; runIds: (string | null)[] };
      /** This run is a point computed by another run's multi-point job. */
      jobRunId?: string;
      fitId?: string;
      /** Systems to reserve credit for (default: the snapshot's); a fit reserves every grid point, like a sweep. */
      chargedSystems?: number;
    } = {},
  ): Promise<string> {
    const department = departmentOf(auth);
    // The observer's cap is on the systems of one population (what they choose); a fit's
    // reservation covers all of its grid points.
    checkSize(auth, snapshot.systems);
    const id = extra.id ?? newId();
    const insert = async (tx: Tx) => {
      const { costCredits } = await billing.reserve(tx, { id, departmentId: department.id, userId: auth.user.id, systems: extra.chargedSystems ?? snapshot.systems });
      await insertRun(tx, {
        id,
        departmentId: department.id,
        ownerUserId: auth.user.id,
        scenarioId: source.scenarioId,
        scenarioVersion: source.scenarioVersion,
        scenarioName: source.scenarioName,
        snapshot,
        scenarioHash: scenarioHash(snapshot),
        seed: snapshot.seed,
        systems: snapshot.systems,
        engineVersion: ENGINE_VERSION,
        status: 'queued',
        chunkCount: planChunks(snapshot.systems).chunkCount,
        costCredits,
        sweepId: extra.sweepId ?? null,
        sweepPointIndex: extra.sweepPointIndex ?? null,
        jobPoints: extra.jobPoints ?? null,
        jobRunId: extra.jobRunId ?? null,
        fitId: extra.fitId ?? null,
        createdAt: new Date(),
      });
      await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'run.queued', target: id, detail: { systems: snapshot.systems, costCredits } });
    };
    if (extra.tx) await insert(extra.tx);
    else await db.transaction(insert);
    return id;
  }

  async function finishedResult(departmentId: string, id: string): Promise<{ run: RunRow; result: ScenarioResult }> {
    const found = await findRun(db, departmentId, id);
    if (!found) throw runNotFound();
    if (found.run.status !== 'succeeded') throw notFinished(found.run.status);
    const text = await loadResult(db, id);
    if (!text) throw notFinished(found.run.status);
    return { run: found.run, result: JSON.parse(text) as ScenarioResult };
  }

  /** For a sweep's grid point: the sweep's name, the point's number and its parameter values (null for other runs). */
  async function sweepPointOf(run: RunRow) {
    if (!run.sweepId || run.sweepPointIndex === null) return null;
    const [sweep] = await db.select().from(sweeps).where(eq(sweeps.id, run.sweepId)).limit(1);
    const values = sweep ? sweepPointValues(sweep.axes, run.sweepPointIndex) : null;
    if (!sweep || !values) return null;
    return { sweepId: sweep.id, sweepName: sweep.name, number: run.sweepPointIndex + 1, pointCount: sweep.pointCount, values };
  }

  /**
   * Resumes a failed run or multi-point job (a sweep's or a fit's computing run) from its
   * checkpoint: a new run for the job and one for each point that had a run of its own (same
   * snapshots, sweep places and fit) that takes over the checkpoint, so the chunks done are not
   * recomputed (and the failed run cannot be resumed twice). Each new run reserves its own credit (the failed ones were refunded when
   * they failed), so a resumed job is charged once, for the job. Returns the new job run's id.
   */
  async function resumeJob(auth: RequestAuth, job: RunRow, alsoInTransaction?: (tx: Tx, jobId: string) => Promise<void>): Promise<{ id: string }> {
    const department = departmentOf(auth);
    if (job.departmentId !== department.id) throw runNotFound();
    if (job.ownerUserId !== auth.user.id && !roleAtLeast(auth.role!, 'modeller')) throw forbidden('Only the run\'s owner or a modeller can resume it.');
    if (job.status !== 'failed') throw conflict(`The run is ${job.status}; only a failed run can be resumed.`);
    const points = job.jobPoints;
    const oldIds = points ? points.runIds : [job.id];
    const passengers = await findRunsByIds(db, department.id, oldIds.filter((old): old is string => old !== null && old !== job.id));
    const byId = new Map(passengers.map((p) => [p.run.id, p.run]));
    const jobId = newId();
    // A point keeps a run of its own if it had one (a deleted point's result has nowhere to go).
    const newIds = oldIds.map((old) => (old === job.id ? jobId : old !== null && byId.has(old) ? newId() : null));
    // The job's run reserves its own systems and those of every point without a run (a fit's nodes), as when it was queued.
    const chargedSystems = job.systems * (1 + (points ? points.runIds.filter((r) => r === null).length : 0));
    const source = (r: RunRow) => ({ scenarioId: r.scenarioId, scenarioVersion: r.scenarioVersion, scenarioName: r.scenarioName });
    const place = (r: RunRow) => ({ ...(r.sweepId ? { sweepId: r.sweepId } : {}), ...(r.sweepPointIndex !== null ? { sweepPointIndex: r.sweepPointIndex } : {}) });
    await db.transaction(async (tx) => {
      await enqueue(auth, source(job), job.snapshot, {
        tx, id: jobId, chargedSystems, ...place(job), ...(job.fitId ? { fitId: job.fitId } : {}),
        ...(points ? { jobPoints: { values: points.values, runIds: newIds } } : {}),
      });
      for (const [p, old] of oldIds.entries()) {
        const passenger = old === null ? undefined : byId.get(old);
        const id = newIds[p];
        if (passenger && id) await enqueue(auth, source(passenger), passenger.snapshot, { tx, id, jobRunId: jobId, ...place(passenger) });
      }
      // After the new runs exist (the checkpoint rows reference them); no checkpoint rolls everything back.
      if (!(await moveCheckpoint(tx, job.id, jobId))) throw conflict('The run kept no computed chunks to continue from; start it again instead.');
      await alsoInTransaction?.(tx, jobId);
      await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'run.resumed', target: jobId, detail: { from: job.id, points: oldIds.length } });
    });
    scheduler.wake();
    return { id: jobId };
  }

  return {
    snapshotOf,
    enqueue,
    finishedResult,

    async create(auth: RequestAuth, body: CreateRunBody): Promise<{ id: string }> {
      const department = departmentOf(auth);
      const source = await scenarios.resolve(department.id, body.scenarioId, body.version);
      const snapshot = await snapshotOf(department.id, source.scenario, { systems: body.systems, seed: body.seed });
      const id = await enqueue(auth, { scenarioId: body.scenarioId, scenarioVersion: source.version, scenarioName: source.name }, snapshot);
      scheduler.wake();
      return { id };
    },

    async list(auth: RequestAuth, query: RunListQuery) {
      const { rows, total } = await listRuns(db, departmentOf(auth).id, auth.user.id, query);
      return {
        runs: rows.map((r) => toRunSummary(r.run, r.ownerName, scheduler.live(r.run.id))),
        page: { page: query.page, pageSize: query.pageSize, total },
      };
    },

    async detail(auth: RequestAuth, id: string): Promise<RunSummary> {
      const found = await findRun(db, departmentOf(auth).id, id);
      if (!found) throw runNotFound();
      return { ...toRunSummary(found.run, found.ownerName, scheduler.live(id)), sweepPoint: await sweepPointOf(found.run) };
    },

    /** The owner or any modeller may cancel a queued or running run. */
    async cancel(auth: RequestAuth, id: string): Promise<RunSummary> {
      const department = departmentOf(auth);
      const found = await findRun(db, department.id, id);
      if (!found) throw runNotFound();
      if (found.run.ownerUserId !== auth.user.id && !roleAtLeast(auth.role!, 'modeller')) throw forbidden('Only the run\'s owner or a modeller can cancel it.');
      if (found.run.status !== 'queued' && found.run.status !== 'running') throw conflict(`The run has already ${found.run.status === 'succeeded' ? 'succeeded' : `been ${found.run.status}`}; only queued or running runs can be cancelled.`);
      await scheduler.cancel(id);
      await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'run.cancelled', target: id });
      const after = await findRun(db, department.id, id);
      return toRunSummary(after!.run, after!.ownerName);
    },

    /**
     * Continues a failed run from the chunks it had computed: a new run of the same snapshot that
     * starts from the failed run's checkpoint (chunk i depends only on (seed, i), so it ends with
     * the counts of an uninterrupted run). It reserves its own credit; the failed run was refunded.
     * A point of a sweep computed in one pass resumes the whole sweep (resumeJob); a fit's run is
     * resumed through its fit.
     */
    async resume(auth: RequestAuth, id: string): Promise<{ id: string }> {
      const found = await findRun(db, departmentOf(auth).id, id);
      if (!found) throw runNotFound();
      if (found.run.fitId) throw conflict(`The run computes the grid of fit ${found.run.fitId}; resume the fit instead (POST /api/fits/${found.run.fitId}/resume).`);
      const job = found.run.jobRunId ? await loadRun(db, found.run.jobRunId) : found.run;
      if (!job) throw runNotFound();
      return resumeJob(auth, job);
    },

    resumeJob,

    /** Owners delete their own finished runs (admins any); a queued or running run is cancelled first. */
    async remove(auth: RequestAuth, id: string): Promise<void> {
      const department = departmentOf(auth);
      const found = await findRun(db, department.id, id);
      if (!found) throw runNotFound();
      if (found.run.ownerUserId !== auth.user.id && auth.role !== 'admin') throw forbidden('You can delete only your own runs.');
      if (found.run.status === 'queued' || found.run.status === 'running') await scheduler.cancel(id);
      await db.transaction(async (tx) => {
        await deleteRun(tx, id);
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'run.deleted', target: id });
      });
    },

    async result(auth: RequestAuth, id: string): Promise<ScenarioResult> {
      return (await finishedResult(departmentOf(auth).id, id)).result;
    },

    async comparison(auth: RequestAuth, id: string, sampleId: string) {
      const department = departmentOf(auth);
      const { run, result } = await finishedResult(department.id, id);
      const sample = await samples.visible(department.id, sampleId);
      return compareRunWithSample(result, sample, run.snapshot.field.thresholdMG);
    },

    async compare(auth: RequestAuth, ids: string[]) {
      const department = departmentOf(auth);
      const found = await findRunsByIds(db, department.id, ids);
      const byId = new Map(found.map((f) => [f.run.id, f]));
      const missing = ids.find((i) => !byId.has(i));
      if (missing) throw notFound(`Run ${missing}`);
      const entries = await Promise.all(
        ids.map(async (id) => {
          const { run, result } = await finishedResult(department.id, id);
          return { summary: toRunSummary(run, byId.get(id)!.ownerName), result };
        }),
      );
      const pairs = [];
      for (let i = 0; i < entries.length; i++) {
        for (let j = i + 1; j < entries.length; j++) {
          const a = entries[i].result.fraction;
          const b = entries[j].result.fraction;
          if (a.value === null || b.value === null || a.se === null || b.se === null) continue;
          const combined = Math.hypot(a.se, b.se);
          pairs.push({ a: entries[i].summary.id, b: entries[j].summary.id, difference: a.value - b.value, sigma: combined > 0 ? Math.abs(a.value - b.value) / combined : null });
        }
      }
      return {
        runs: entries.map(({ summary, result }) => ({
          run: summary,
          fraction: result.fraction,
          fractionBySetting: result.fractionBySetting,
          fractionByChannel: result.fractionByChannel,
          counts: result.counts,
          bins: { wdMass: result.bins.wdMass, logField: result.bins.logField },
        })),
        differences: pairs,
        method: 'Differences of predicted fractions in units of their combined Monte Carlo standard error (Gaussian, independent runs; runs sharing a seed are correlated, so this overstates the error for them).',
      };
    },

    async exportCsv(auth: RequestAuth, id: string) {
      return resultCsv((await finishedResult(departmentOf(auth).id, id)).result);
    },

    /**
     * The methods paragraph of the run's own scenario document (for a sweep's point, the point's
     * document: the base scenario with the point's values set), opened for a point by a sentence
     * naming its values, so that a copied paragraph describes the model that was run.
     */
    async methods(auth: RequestAuth, id: string) {
      const { run, result } = await finishedResult(departmentOf(auth).id, id);
      const paragraph = methodsParagraph(run.snapshot, result, id);
      const point = await sweepPointOf(run);
      if (!point) return paragraph;
      return `This run is grid point ${point.number} of ${point.pointCount} of the parameter sweep "${point.sweepName}", with ${sweepPointText(point.values)}; everything below describes the scenario at these values. ${paragraph}`;
    },

    /**
     * Runs a finished or stopped run's own scenario document again (a sweep's point keeps its
     * values), optionally with another size or seed. The new run stands alone, outside any sweep;
     * its name carries the point's values.
     */
    async again(auth: RequestAuth, id: string, overrides: { systems?: number; seed?: string }): Promise<{ id: string }> {
      const department = departmentOf(auth);
      const found = await findRun(db, department.id, id);
      if (!found) throw runNotFound();
      const { run } = found;
      const snapshot = await snapshotOf(department.id, run.snapshot, overrides);
      const point = await sweepPointOf(run);
      const scenarioName = (point ? `${run.scenarioName} · ${sweepPointText(point.values)}` : run.scenarioName).slice(0, 160);
      const newId = await enqueue(auth, { scenarioId: run.scenarioId, scenarioVersion: run.scenarioVersion, scenarioName }, snapshot);
      scheduler.wake();
      return { id: newId };
    },
  };
}

export type RunsService = ReturnType<typeof createRunsService>;
