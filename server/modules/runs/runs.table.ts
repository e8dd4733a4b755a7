import { bigint, char, customType, double, index, int, json, longtext, mediumtext, mysqlEnum, mysqlTable, primaryKey, text, varchar } from 'drizzle-orm/mysql-core';
import { parseScenario, type Scenario } from '../../../shared/contracts/scenario.ts';
import { RUN_STATUSES } from '../../../shared/contracts/runs.ts';
import { idColumn, timestamp } from '../../db/columns.ts';

/**
 * A run's scenario as a JSON column that reads back as a typed `Scenario`: the stored document
 * (perhaps written by an older version) is parsed once, when the row is loaded, so that code
 * using a run never parses it again.
 */
const scenarioJson = customType<{ data: Scenario; driverData: string }>({
  dataType: () => 'json',
  toDriver: (scenario) => JSON.stringify(scenario),
  fromDriver: (stored) => parseScenario(typeof stored === 'string' ? JSON.parse(stored) : stored),
});

/** One seeded Monte Carlo run of a scenario snapshot. */
export const runs = mysqlTable(
  'runs',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    ownerUserId: idColumn('owner_user_id').notNull(),
    scenarioId: idColumn('scenario_id').notNull(),
    scenarioVersion: int('scenario_version').notNull(),
    scenarioName: varchar('scenario_name', { length: 160 }).notNull(),
    /** The parsed scenario exactly as run (stored table rows inlined, seed and systems set). */
    snapshot: scenarioJson('snapshot').notNull(),
    scenarioHash: char('scenario_hash', { length: 64 }).notNull(),
    seed: varchar('seed', { length: 200 }).notNull(),
    systems: bigint('systems', { mode: 'number' }).notNull(),
    engineVersion: varchar('engine_version', { length: 40 }).notNull(),
    status: mysqlEnum('status', RUN_STATUSES).notNull(),
    chunkCount: int('chunk_count').notNull(),
    chunksDone: int('chunks_done').notNull().default(0),
    /** Fraction of chunks done, 0–1. */
    progress: double('progress').notNull().default(0),
    costCredits: int('cost_credits').notNull(),
    /** Headline numbers copied from the result so lists can sort and filter on them. */
    whiteDwarfs: bigint('white_dwarfs', { mode: 'number' }),
    magnetic: bigint('magnetic', { mode: 'number' }),
    fraction: double('fraction'),
    fractionSe: double('fraction_se'),
    error: text('error'),
    sweepId: idColumn('sweep_id'),
    sweepPointIndex: int('sweep_point_index'),
    /**
     * A multi-point job (a sweep or a fit computed in one pass over the same draws): every point's
     * parameter values and the run that receives each point's result (null: the point has no run of
     * its own, e.g. a fit's grid node). This run is the first point: its snapshot is that point's.
     */
    jobPoints: json('job_points').$type<{ values: Record<string, number>[]; runIds: (string | null)[] }>(),
    /** A point of another run's multi-point job: that run computes it, so the scheduler never starts this one. */
    jobRunId: idColumn('job_run_id'),
    /** The fit whose grid this run computes. */
    fitId: idColumn('fit_id'),
    /** How many times the run was resumed after the server stopped. */
    resumes: int('resumes').notNull().default(0),
    createdAt: timestamp('created_at').notNull(),
    startedAt: timestamp('started_at'),
    finishedAt: timestamp('finished_at'),
    /** Wall time spent computing, summed over resumes (ms). */
    computeMs: bigint('compute_ms', { mode: 'number' }).notNull().default(0),
    /**
     * While running: until when the scheduler executing it vouches for it (renewed every few
     * seconds). A running run whose lease has lapsed has no live executor and is re-queued.
     */
    leaseUntil: timestamp('lease_until'),
  },
  (t) => [
    index('runs_department_idx').on(t.departmentId, t.createdAt),
    index('runs_status_idx').on(t.status, t.createdAt),
    index('runs_sweep_idx').on(t.sweepId, t.sweepPointIndex),
    index('runs_job_idx').on(t.jobRunId),
  ],
);

/**
 * Running totals of a run in progress: the summed tally of the chunks listed in
 * `doneChunks`, written together in one statement so that they always agree. A resumed run
 * starts from here and recomputes only the other chunks (chunk i is a pure function of
 * (seed, i)), so it ends with exactly the counts of an uninterrupted run.
 */
export const runCheckpoints = mysqlTable('run_checkpoints', {
  runId: idColumn('run_id')
    .primaryKey()
    .references(() => runs.id, { onDelete: 'cascade' }),
  /** The summed tally (JSON); empty for a multi-point job, whose tallies are in run_checkpoint_points. */
  tally: longtext('tally').notNull(),
  /** Sorted, merged [first, last] index ranges of finished chunks. */
  doneChunks: json('done_chunks').$type<[number, number][]>().notNull(),
  updatedAt: timestamp('updated_at').notNull(),
});

/**
 * The running totals of a multi-point job, one row per point (a fit may have 10^4 points of
 * ≈ 10 kB each: one document would outgrow MariaDB's max_allowed_packet). Written in batches in
 * the same transaction as the job's `run_checkpoints` row, whose `done_chunks` they cover.
 */
export const runCheckpointPoints = mysqlTable(
  'run_checkpoint_points',
  {
    runId: idColumn('run_id')
      .notNull()
      .references(() => runs.id, { onDelete: 'cascade' }),
    point: int('point').notNull(),
    tally: mediumtext('tally').notNull(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.point] })],
);

/** The finished result document (same fields the CLI prints). */
export const runResults = mysqlTable('run_results', {
  runId: idColumn('run_id')
    .primaryKey()
    .references(() => runs.id, { onDelete: 'cascade' }),
  result: longtext('result').notNull(),
  createdAt: timestamp('created_at').notNull(),
});

/**
 * The result's histograms as rows, so SQL can aggregate them across runs (e.g. summing
 * the white-dwarf mass histogram of magnetic white dwarfs over a sweep).
 * histogram: wdMass | logField | fateMap; series: magnetic | nonMagnetic | all | a fate name.
 * For the 2-D fate map, bin is the mass bin and bin2 the period bin.
 */
export const runBins = mysqlTable(
  'run_bins',
  {
    runId: idColumn('run_id')
      .notNull()
      .references(() => runs.id, { onDelete: 'cascade' }),
    histogram: varchar('histogram', { length: 16 }).notNull(),
    series: varchar('series', { length: 16 }).notNull(),
    bin: int('bin').notNull(),
    bin2: int('bin2').notNull().default(0),
    lo: double('lo').notNull(),
    hi: double('hi').notNull(),
    lo2: double('lo2'),
    hi2: double('hi2'),
    count: bigint('count', { mode: 'number' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.histogram, t.series, t.bin, t.bin2] })],
);

/** Engulfment grids of the `track` giant option, built once per physics hash. */
export const engulfmentGrids = mysqlTable('engulfment_grids', {
  key: char('grid_key', { length: 64 }).primaryKey(),
  grid: longtext('grid').notNull(),
  buildMs: int('build_ms').notNull(),
  createdAt: timestamp('created_at').notNull(),
});

export type RunRow = typeof runs.$inferSelect;
