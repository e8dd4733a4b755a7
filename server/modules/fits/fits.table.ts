import { bigint, index, int, json, longtext, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core';
import type { FitParameter } from '../../../shared/contracts/fits.ts';
import type { ImpliedFitQuestion } from '../../../shared/contracts/implied-occurrence.ts';
import { idColumn, timestamp } from '../../db/columns.ts';
import type { ResolvedConstraint } from '../constraints/evaluate.ts';

/**
 * A fit: the posterior over 1–4 scenario parameters on a grid, given a constraint set. One run
 * (`run_id`, its multi-point job) computes every grid point from the same draws; the posterior is
 * stored here when it ends.
 */
export const fits = mysqlTable(
  'fits',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    ownerUserId: idColumn('owner_user_id').notNull(),
    name: varchar('name', { length: 160 }).notNull(),
    scenarioId: idColumn('scenario_id').notNull(),
    scenarioVersion: int('scenario_version').notNull(),
    scenarioName: varchar('scenario_name', { length: 160 }).notNull(),
    /** A constraint set of the department, or "library"; for an implied-occurrence fit, the sample's id. */
    constraintSetId: varchar('constraint_set_id', { length: 32 }).notNull(),
    /** The set's version when the fit was queued (null for the library). */
    constraintSetVersion: int('constraint_set_version'),
    constraintSetName: varchar('constraint_set_name', { length: 160 }).notNull(),
    /** The constraints as scored (library references resolved), so later edits of the set do not change the fit. */
    constraints: json('constraints').$type<ResolvedConstraint[]>().notNull(),
    parameters: json('parameters').$type<FitParameter[]>().notNull(),
    seed: varchar('seed', { length: 200 }).notNull(),
    /** Systems per grid point. */
    systems: bigint('systems', { mode: 'number' }).notNull(),
    pointCount: int('point_count').notNull(),
    /** The run computing the grid (its multi-point job). */
    runId: idColumn('run_id').notNull(),
    engineVersion: varchar('engine_version', { length: 40 }).notNull(),
    /** The posterior document (shared/contracts/fits.ts FitPosterior), once computed. */
    posterior: longtext('posterior'),
    methods: text('methods'),
    /** Why no posterior could be computed from a finished grid. */
    error: text('error'),
    /** Set for an implied-occurrence fit (POST /api/implied-occurrence): the sample asked about and the scenario's own multiplier. */
    implied: json('implied').$type<ImpliedFitQuestion>(),
    createdAt: timestamp('created_at').notNull(),
    finishedAt: timestamp('finished_at'),
  },
  (t) => [index('fits_department_idx').on(t.departmentId, t.createdAt), index('fits_run_idx').on(t.runId)],
);

export type FitRow = typeof fits.$inferSelect;
