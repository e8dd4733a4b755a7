import { and, desc, eq, inArray } from 'drizzle-orm';
import { SWEEPABLE_PARAMETERS, ScenarioValidationError, withParameter, type Scenario } from '../../../shared/contracts/scenario.ts';
import type { CreateFitBody, FitDetail, FitParameter, FitPosterior, FitSummary } from '../../../shared/contracts/fits.ts';
import type { ImpliedFitQuestion } from '../../../shared/contracts/implied-occurrence.ts';
import type { RunStatus } from '../../../shared/contracts/runs.ts';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { scenarioAtPoint } from '../../../shared/contracts/point-scenario.ts';
import { multiplierMaxFor } from '../../../shared/engine/kernel/scenario-physics.ts';
import type { ChunkTally } from '../../../shared/engine/kernel/tally.ts';
import { ENGINE_VERSION } from '../../../shared/engine/version.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { AppError, conflict, forbidden, notFound } from '../../lib/errors.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import type { Logger } from 'pino';
import { recordAudit } from '../audit/audit.service.ts';
import { resolveConstraints, type ConstraintSetsService } from '../constraints/constraint-sets.service.ts';
import type { ResolvedConstraint } from '../constraints/evaluate.ts';
import type { RunScheduler } from '../runs/run-scheduler.ts';
import { runs } from '../runs/runs.table.ts';
import type { RunRow } from '../runs/runs.repository.ts';
import type { RunsService } from '../runs/runs.service.ts';
import type { ScenariosService } from '../scenarios/scenarios.service.ts';
import { analyseFit, bestNodeIndex, fitMethodsParagraph, fitPoints, nodeResult, parameterWords, type FitDefinition } from './fit-analysis.ts';
import { fits, type FitRow } from './fits.table.ts';

export const fitNotFound = () => notFound('That fit');

const invalid = (field: string, message: string) => new AppError({ code: 'invalid_input', status: 400, field, message });

/** The fit's state: its computing run's, except that a finished grid is "running" until the posterior is stored, and "failed" when none could be computed. */
function fitStatus(fit: FitRow, run: Pick<RunRow, 'status'> | undefined): RunStatus {
  const status = run?.status ?? 'failed';
  if (status !== 'succeeded') return status;
  if (fit.error) return 'failed';
  return fit.posterior ? 'succeeded' : 'running';
}

export function definitionOf(fit: FitRow, scenario: Scenario): FitDefinition {
  return {
    scenario,
    parameters: fit.parameters,
    constraints: fit.constraints,
    constraintSet: { id: fit.constraintSetId, name: fit.constraintSetName, version: fit.constraintSetVersion },
  };
}

/** A fit ready to queue: the scenario as run, the grid and the constraints (from a set, or an implied-occurrence sample). */
export interface FitSpec {
  source: { scenarioId: string; version: number; name: string };
  base: Scenario;
  parameters: FitParameter[];
  constraints: ResolvedConstraint[];
  constraintSet: { id: string; name: string; version: number | null };
  name: string;
  implied?: ImpliedFitQuestion;
}

export function createFitsService(deps: { db: Db; runs: RunsService; scenarios: ScenariosService; constraintSets: ConstraintSetsService; scheduler: RunScheduler; logger: Logger }) {
  const { db, runs: runsService, scenarios, constraintSets, scheduler, logger } = deps;

  async function load(departmentId: string, id: string) {
    const rows = await db.select().from(fits).where(and(eq(fits.departmentId, departmentId), eq(fits.id, id))).limit(1);
    if (!rows[0]) throw fitNotFound();
    return rows[0];
  }

  async function runsOf(ids: string[]) {
    if (ids.length === 0) return new Map<string, RunRow>();
    const rows = await db.select().from(runs).where(inArray(runs.id, ids));
    return new Map(rows.map((r) => [r.id, r]));
  }

  function summary(fit: FitRow, run: RunRow | undefined): FitSummary {
    const status = fitStatus(fit, run);
    const live = run ? scheduler.live(run.id) : null;
    const chunkCount = run?.chunkCount ?? 0;
    const chunksDone = status === 'succeeded' ? chunkCount : (live?.chunksDone ?? run?.chunksDone ?? 0);
    return {
      id: fit.id,
      name: fit.name,
      status,
      progress: status === 'succeeded' ? 1 : chunkCount > 0 ? chunksDone / chunkCount : 0,
      chunksDone,
      chunkCount,
      etaSeconds: status === 'running' ? (live?.etaSeconds ?? null) : null,
      createdAt: fit.createdAt.toISOString(),
      scenarioName: fit.scenarioName,
      constraintSetName: fit.constraintSetName,
      parameters: fit.parameters.map((p) => p.path),
      ownerUserId: fit.ownerUserId,
      implied: fit.implied ?? null,
    };
  }

  /** Called by the scheduler when the fit's run has computed every grid point: scores each point and stores the posterior (or why there is none). */
  async function onJobFinished(run: RunRow, tallies: ChunkTally[], scenarios: Scenario[]): Promise<void> {
    if (!run.fitId) return;
    const [fit] = await db.select().from(fits).where(eq(fits.id, run.fitId)).limit(1);
    if (!fit || fit.posterior) return;
    let posterior: FitPosterior | null = null;
    let error: string | null = null;
    let methods: string | null = null;
    try {
      const definition = definitionOf(fit, scenarios[0]);
      posterior = analyseFit(definition, tallies.length, (i) => nodeResult(scenarios[i], tallies[i]));
      const best = bestNodeIndex(fit.parameters, posterior);
      const bestModel = best >= 0 ? { scenario: scenarios[best], result: nodeResult(scenarios[best], tallies[best]) } : undefined;
      methods = fitMethodsParagraph(definition, posterior, { engineVersion: fit.engineVersion, fitId: fit.id, scenarioName: fit.scenarioName, best: bestModel });
    } catch (e) {
      error = e instanceof Error ? e.message : String(e);
      logger.warn({ fitId: fit.id, err: e }, 'fit posterior failed');
    }
    await db
      .update(fits)
      .set({ posterior: posterior ? JSON.stringify(posterior) : null, methods, error: error?.slice(0, 4000) ?? null, finishedAt: new Date() })
      .where(eq(fits.id, fit.id));
  }

  scheduler.onJobFinished(onJobFinished);

  /** Every parameter's range must be allowed by the scenario's schema (both ends; the fields are independent), and a multiplier by its rows. */
  function checkRanges(base: Scenario, parameters: readonly FitParameter[]) {
    parameters.forEach((p, i) => {
      for (const end of ['min', 'max'] as const) {
        try {
          withParameter(base, p.path, p[end]);
        } catch (error) {
          if (!(error instanceof ScenarioValidationError)) throw error;
          throw invalid(`parameters[${i}].${end}`, `parameters[${i}].${end} = ${p[end]}: ${error.issues[0]?.message ?? 'invalid'}`);
        }
      }
      if (p.path === 'companions.multiplier') {
        const mMax = multiplierMaxFor(base.companions.rows ?? []);
        if (p.max > mMax * (1 + 1e-12)) throw invalid(`parameters[${i}].max`, `parameters[${i}].max = ${p.max} is above the largest multiplier this scenario's rows allow (${mMax}, 1 / the largest row occurrence)`);
      }
    });
  }

  /**
   * Queues a checked fit: the grid's first point as a run whose multi-point job computes every
   * grid point from the same draws. Credit is reserved for every grid point (systems × points),
   * as a sweep reserves each point.
   */
  async function queue(auth: RequestAuth, spec: FitSpec): Promise<{ id: string; runId: string }> {
    const department = departmentOf(auth);
    const { source, base, parameters, constraints, constraintSet, name } = spec;
    checkRanges(base, parameters);
    const points = fitPoints(parameters);
    const first = scenarioAtPoint(base, points[0]);
    const id = newId();
    const runId = newId();
    await db.transaction(async (tx) => {
      await tx.insert(fits).values({
        id, departmentId: department.id, ownerUserId: auth.user.id, name, scenarioId: source.scenarioId, scenarioVersion: source.version, scenarioName: source.name,
        constraintSetId: constraintSet.id, constraintSetVersion: constraintSet.version, constraintSetName: constraintSet.name, constraints,
        parameters, seed: base.seed, systems: base.systems, pointCount: points.length, runId, engineVersion: ENGINE_VERSION, implied: spec.implied ?? null, createdAt: new Date(),
      });
      await runsService.enqueue(auth, { scenarioId: source.scenarioId, scenarioVersion: source.version, scenarioName: `Fit: ${name}`.slice(0, 160) }, first, {
        tx, id: runId, fitId: id, chargedSystems: base.systems * points.length,
        jobPoints: { values: points.map((p) => ({ ...p })), runIds: points.map((_, i) => (i === 0 ? runId : null)) },
      });
      await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'fit.created', target: id, detail: { points: points.length, systems: base.systems, ...(spec.implied ? { sampleId: spec.implied.sample.id } : {}) } });
    });
    scheduler.wake();
    return { id, runId };
  }

  return {
    queue,

    /** POST /api/fits: a grid over 1–4 sweepable parameters given a constraint set. */
    async create(auth: RequestAuth, body: CreateFitBody): Promise<{ id: string }> {
      const department = departmentOf(auth);
      body.parameters.forEach((p, i) => {
        if (!SWEEPABLE_PARAMETERS.some((known) => known.path === p.path)) {
          throw invalid(`parameters[${i}].path`, `parameters[${i}].path must be one of ${SWEEPABLE_PARAMETERS.map((k) => k.path).join(', ')} (got "${p.path}")`);
        }
      });
      const source = await scenarios.resolve(department.id, body.scenarioId);
      const base = await runsService.snapshotOf(department.id, source.scenario, { systems: body.systems, seed: body.seed });
      checkRanges(base, body.parameters);
      const set = await constraintSets.detail(auth, body.constraintSetId);
      const words = body.parameters.map((p) => parameterWords(p.path).label).join(' × ');
      const { id } = await queue(auth, {
        source: { scenarioId: body.scenarioId, version: source.version, name: source.name },
        base,
        parameters: body.parameters,
        constraints: resolveConstraints(set.constraints),
        constraintSet: { id: set.id, name: set.name, version: set.library ? null : set.currentVersion },
        name: (body.name ?? `${source.name}: ${words} given ${set.name}`).slice(0, 160),
      });
      return { id };
    },

    async list(auth: RequestAuth): Promise<FitSummary[]> {
      const department = departmentOf(auth);
      const rows = await db.select().from(fits).where(eq(fits.departmentId, department.id)).orderBy(desc(fits.createdAt)).limit(200);
      const byRun = await runsOf(rows.map((r) => r.runId));
      return rows.map((row) => summary(row, byRun.get(row.runId)));
    },

    async detail(auth: RequestAuth, id: string): Promise<FitDetail> {
      const fit = await load(departmentOf(auth).id, id);
      const run = (await runsOf([fit.runId])).get(fit.runId);
      return {
        ...summary(fit, run),
        scenarioId: fit.scenarioId,
        scenarioVersion: fit.scenarioVersion,
        // An implied-occurrence fit is scored against its sample, not a constraint set.
        constraintSetId: fit.implied ? null : fit.constraintSetId,
        constraintSetVersion: fit.constraintSetVersion,
        grid: fit.parameters.map((p) => ({ ...p, ...parameterWords(p.path) })),
        pointCount: fit.pointCount,
        systems: fit.systems,
        seed: fit.seed,
        engineVersion: fit.engineVersion,
        costCredits: run?.costCredits ?? null,
        runId: fit.runId,
        error: fit.error ?? (run?.status === 'failed' ? run.error : null),
        finishedAt: fit.finishedAt?.toISOString() ?? run?.finishedAt?.toISOString() ?? null,
        posterior: fit.posterior ? (JSON.parse(fit.posterior) as FitPosterior) : null,
        methods: fit.methods,
      };
    },

    async methods(auth: RequestAuth, id: string): Promise<string> {
      const fit = await load(departmentOf(auth).id, id);
      if (!fit.methods) throw new AppError({ code: 'fit_not_finished', status: 409, message: 'The fit has no posterior yet; its methods paragraph exists once it has succeeded.' });
      return fit.methods;
    },

    /**
     * Continues a failed fit from the grid chunks its run computed: a new computing run takes over
     * the checkpoint (runs.resumeJob) and becomes the fit's run. It reserves credit for every grid
     * point again; the failed run's reservation was refunded when it failed.
     */
    async resume(auth: RequestAuth, id: string): Promise<FitSummary> {
      const department = departmentOf(auth);
      const fit = await load(department.id, id);
      const run = (await runsOf([fit.runId])).get(fit.runId);
      if (!run || fitStatus(fit, run) !== 'failed' || run.status !== 'failed') {
        throw conflict(`The fit is ${fitStatus(fit, run)}${run?.status === 'succeeded' ? ' (its grid was computed; the posterior could not be)' : ''}; only a fit whose computation failed can be resumed.`);
      }
      const { id: runId } = await runsService.resumeJob(auth, run, async (tx, jobId) => {
        await tx.update(fits).set({ runId: jobId, error: null, finishedAt: null }).where(eq(fits.id, fit.id));
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'fit.resumed', target: id, detail: { from: fit.runId, runId: jobId } });
      });
      return summary({ ...fit, runId }, (await runsOf([runId])).get(runId));
    },

    /**
     * The owner or any modeller may cancel a queued or running fit (an observer's implied-occurrence
     * question is a fit of their own). The scheduler refunds the whole reservation (billing's settleRun:
     * credits, and free systems of the month they were taken from) and deletes the checkpoint, so the
     * chunks computed so far are discarded: a cancelled fit has no posterior and cannot be resumed.
     */
    async cancel(auth: RequestAuth, id: string): Promise<FitSummary> {
      const department = departmentOf(auth);
      const fit = await load(department.id, id);
      if (fit.ownerUserId !== auth.user.id && !roleAtLeast(auth.role!, 'modeller')) throw forbidden("Only the fit's owner or a modeller can cancel it.");
      const run = (await runsOf([fit.runId])).get(fit.runId);
      const notLive = () => {
        const status = fitStatus(fit, run);
        const state = status === 'running' ? 'computed its grid (the posterior is being worked out)' : status === 'succeeded' ? 'succeeded' : `been ${status}`;
        return conflict(`The fit has already ${state}; only a queued or running fit can be cancelled.`);
      };
      if (!run || (run.status !== 'queued' && run.status !== 'running')) throw notLive();
      // false: it finished between the check and the cancel.
      if (!(await scheduler.cancel(fit.runId))) throw notLive();
      await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'fit.cancelled', target: id });
      return summary(fit, (await runsOf([fit.runId])).get(fit.runId));
    },
  };
}

export type FitsService = ReturnType<typeof createFitsService>;
