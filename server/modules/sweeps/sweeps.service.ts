import { and, desc, eq } from 'drizzle-orm';
import { SWEEPABLE_PARAMETERS, ScenarioValidationError, withParameter, type Scenario } from '../../../shared/contracts/scenario.ts';
import type { Sample } from '../../../shared/contracts/samples.ts';
import { gridPoints } from '../../../shared/contracts/sweep-point.ts';
import type { CreateSweepBody, SweepDetail, SweepSummary } from '../../../shared/contracts/sweeps.ts';
import { binomialTestTwoSided } from '../../../shared/engine/stats/binomial-test.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { AppError, conflict, notFound } from '../../lib/errors.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import type { RunScheduler } from '../runs/run-scheduler.ts';
import { predictedFor } from '../runs/comparison.ts';
import { loadResult, runsOfSweep } from '../runs/runs.repository.ts';
import type { ScenarioResult } from '../../../shared/contracts/result.ts';
import type { RunsService } from '../runs/runs.service.ts';
import type { SamplesService } from '../samples/samples.service.ts';
import type { ScenariosService } from '../scenarios/scenarios.service.ts';
import { sweeps } from './sweeps.table.ts';

type SweepRow = typeof sweeps.$inferSelect;
type RunRow = Awaited<ReturnType<typeof runsOfSweep>>[number];

export const sweepNotFound = () => notFound('That sweep');


function sweepStatus(points: RunRow[]): SweepSummary['status'] {
  if (points.some((p) => p.status === 'running')) return 'running';
  if (points.some((p) => p.status === 'queued')) return 'queued';
  if (points.length > 0 && points.every((p) => p.status === 'cancelled')) return 'cancelled';
  return 'finished';
}

function summary(row: SweepRow, points: RunRow[]): SweepSummary {
  return {
    id: row.id,
    name: row.name,
    scenarioId: row.scenarioId,
    scenarioVersion: row.scenarioVersion,
    axes: row.axes.map((a) => {
      const known = SWEEPABLE_PARAMETERS.find((p) => p.path === a.path);
      return { ...a, label: known?.label ?? a.path, unit: known?.unit ?? '' };
    }),
    seed: row.seed,
    systems: row.systems,
    pointCount: row.pointCount,
    pointsDone: points.filter((p) => p.status === 'succeeded' || p.status === 'failed' || p.status === 'cancelled').length,
    status: sweepStatus(points),
    createdAt: row.createdAt.toISOString(),
  };
}

/** The smallest and largest axis values whose points the sample does not reject. */
function allowedRange(values: number[], consistent: (boolean | null)[]): [number, number] | null {
  const okValues = values.filter((_, i) => consistent[i] === true);
  if (okValues.length === 0) return null;
  return [Math.min(...okValues), Math.max(...okValues)];
}

export function createSweepsService(deps: { db: Db; runs: RunsService; scenarios: ScenariosService; samples: SamplesService; scheduler: RunScheduler }) {
  const { db, runs, scenarios, samples, scheduler } = deps;

  async function load(departmentId: string, id: string) {
    const rows = await db.select().from(sweeps).where(and(eq(sweeps.departmentId, departmentId), eq(sweeps.id, id))).limit(1);
    if (!rows[0]) throw sweepNotFound();
    return { row: rows[0], points: await runsOfSweep(db, id) };
  }

  return {
    /**
     * Queues the sweep as one job: a run per grid point (each holds its point's scenario and gets
     * its own result and credit reservation), all computed by the first point's run in one pass over
     * the same draws (common random numbers), so the points equal separate runs with the same seed.
     */
    async create(auth: RequestAuth, body: CreateSweepBody): Promise<{ id: string }> {
      const department = departmentOf(auth);
      body.axes.forEach((axis, i) => {
        if (!SWEEPABLE_PARAMETERS.some((p) => p.path === axis.path)) {
          throw new AppError({ code: 'invalid_input', status: 400, field: `axes[${i}].path`, message: `axes[${i}].path must be one of ${SWEEPABLE_PARAMETERS.map((p) => p.path).join(', ')} (got "${axis.path}")` });
        }
      });
      const source = await scenarios.resolve(department.id, body.scenarioId);
      const base = await runs.snapshotOf(department.id, source.scenario, { systems: body.systems, seed: body.seed });
      const points = gridPoints(body.axes);
      const snapshots: Scenario[] = points.map((values, index) =>
        values.reduce((scenario, value, axisIndex) => {
          try {
            return withParameter(scenario, body.axes[axisIndex].path, value);
          } catch (error) {
            if (!(error instanceof ScenarioValidationError)) throw error;
            const valueIndex = body.axes[axisIndex].values.indexOf(value);
            throw new AppError({
              code: 'invalid_input', status: 400, field: `axes[${axisIndex}].values[${valueIndex}]`,
              message: `axes[${axisIndex}].values[${valueIndex}] = ${value} at grid point ${index}: ${error.issues[0]?.message ?? 'invalid'}`,
            });
          }
        }, base),
      );
      const id = newId();
      const name = body.name ?? `${source.name}: ${body.axes.map((a) => a.path).join(' × ')}`;
      await db.transaction(async (tx) => {
        await tx.insert(sweeps).values({
          id, departmentId: department.id, ownerUserId: auth.user.id, scenarioId: body.scenarioId, scenarioVersion: source.version,
          name: name.slice(0, 160), axes: body.axes, seed: base.seed, systems: base.systems, pointCount: points.length, createdAt: new Date(),
        });
        const runIds = snapshots.map(() => newId());
        const values = points.map((point) => Object.fromEntries(point.map((value, axisIndex) => [body.axes[axisIndex].path, value])));
        for (const [index, snapshot] of snapshots.entries()) {
          await runs.enqueue(auth, { scenarioId: body.scenarioId, scenarioVersion: source.version, scenarioName: source.name }, snapshot, {
            sweepId: id, sweepPointIndex: index, tx, id: runIds[index],
            ...(index === 0 ? { jobPoints: { values, runIds } } : { jobRunId: runIds[0] }),
          });
        }
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'sweep.created', target: id, detail: { points: points.length } });
      });
      scheduler.wake();
      return { id };
    },

    async list(auth: RequestAuth): Promise<SweepSummary[]> {
      const department = departmentOf(auth);
      const rows = await db.select().from(sweeps).where(eq(sweeps.departmentId, department.id)).orderBy(desc(sweeps.createdAt)).limit(200);
      return Promise.all(rows.map(async (row) => summary(row, await runsOfSweep(db, row.id))));
    },

    async detail(auth: RequestAuth, id: string, sampleId?: string): Promise<SweepDetail> {
      return this.detailIn(departmentOf(auth).id, id, sampleId);
    },

    /** A sweep of the given department (also read through a share link, which names its department). */
    async detailIn(departmentId: string, id: string, sampleId?: string): Promise<SweepDetail> {
      const department = { id: departmentId };
      const { row, points } = await load(department.id, id);
      const sample: Sample | null = sampleId ? await samples.visible(department.id, sampleId) : null;
      const counts = sample?.kind === 'counts' && sample.magnetic !== null && sample.total !== null ? { k: sample.magnetic, n: sample.total } : null;
      const grid = gridPoints(row.axes);
      // A sample of one setting (e.g. white dwarfs with a detached companion) is tested against
      // the predicted fraction of that setting, read from each point's stored result.
      const settingFraction = new Map<string, number | null>();
      if (counts && sample && sample.setting !== 'all') {
        for (const run of points) {
          if (run.status !== 'succeeded') continue;
          const text = await loadResult(db, run.id);
          const predicted = text ? predictedFor(JSON.parse(text) as ScenarioResult, sample.setting) : null;
          settingFraction.set(run.id, predicted && predicted.whiteDwarfs > 0 ? predicted.magnetic / predicted.whiteDwarfs : null);
        }
      }
      const testedFraction = (run: RunRow) => (settingFraction.size > 0 ? (settingFraction.get(run.id) ?? null) : run.fraction);
      const pointRows = points.map((run) => {
        const tested = testedFraction(run);
        const pValue = counts && run.status === 'succeeded' && tested !== null ? binomialTestTwoSided(counts.k, counts.n, tested) : null;
        return {
          index: run.sweepPointIndex ?? 0,
          values: grid[run.sweepPointIndex ?? 0] ?? [],
          runId: run.id,
          status: run.status,
          fraction: run.fraction,
          fractionSe: run.fractionSe,
          whiteDwarfs: run.whiteDwarfs,
          magnetic: run.magnetic,
          pValue,
          consistent68: pValue === null ? null : pValue >= 1 - 0.6827,
          consistent95: pValue === null ? null : pValue >= 0.05,
        };
      });
      const oneD = row.axes.length === 1;
      return {
        ...summary(row, points),
        points: pointRows,
        band: sample
          ? { sampleId: sample.id, name: sample.name, fraction: sample.fraction ?? 0, interval68: sample.interval68, interval95: sample.interval95 }
          : null,
        allowedRange:
          counts && oneD
            ? {
                level68: allowedRange(pointRows.map((p) => p.values[0]), pointRows.map((p) => p.consistent68)),
                level95: allowedRange(pointRows.map((p) => p.values[0]), pointRows.map((p) => p.consistent95)),
                note: 'The smallest and largest grid values whose prediction the sample does not reject (exact two-sided binomial test); the true limits lie between grid values, and each point carries its own Monte Carlo error.',
              }
            : null,
        method: `Every point is computed from the same draws in one pass (common random numbers), so each point equals a separate run with the same seed and the curve is smooth; p-values are exact two-sided binomial tests of the sample against each point's predicted fraction${sample && sample.setting !== 'all' ? ` among ${sample.setting === 'single' ? 'single white dwarfs' : 'white dwarfs with a detached companion'} (the sample's setting)` : ' among all white dwarfs'}.`,
      };
    },

    /** Continues a failed sweep from its job's checkpoint (runs.resumeJob: new runs for its points, in the same places). */
    async resume(auth: RequestAuth, id: string): Promise<SweepSummary> {
      const department = departmentOf(auth);
      const { points } = await load(department.id, id);
      const job = points.find((run) => run.jobPoints !== null) ?? points[0];
      if (!job || job.status !== 'failed') throw conflict(`The sweep is ${sweepStatus(points)}; only a sweep whose computation failed can be resumed.`);
      await runs.resumeJob(auth, job);
      const after = await load(department.id, id);
      return summary(after.row, after.points);
    },

    async cancel(auth: RequestAuth, id: string): Promise<SweepSummary> {
      const department = departmentOf(auth);
      const { points } = await load(department.id, id);
      const live = points.filter((run) => run.status === 'queued' || run.status === 'running');
      if (live.length === 0) throw conflict(`The sweep is already ${sweepStatus(points)}; only a queued or running sweep can be cancelled.`);
      // The points are one job: cancelling any cancels them all.
      for (const run of live) await scheduler.cancel(run.id);
      await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'sweep.cancelled', target: id });
      const after = await load(department.id, id);
      return summary(after.row, after.points);
    },
  };
}

export type SweepsService = ReturnType<typeof createSweepsService>;
