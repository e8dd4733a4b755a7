import { bigint, index, int, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/** A 1-D or 2-D grid over named scenario parameters; every grid point is a run. */
export const sweeps = mysqlTable(
  'sweeps',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    ownerUserId: idColumn('owner_user_id').notNull(),
    scenarioId: idColumn('scenario_id').notNull(),
    scenarioVersion: int('scenario_version').notNull(),
    name: varchar('name', { length: 160 }).notNull(),
    /** [{ path, values }] — one entry for a 1-D sweep, two for a 2-D grid (row-major: the last axis varies fastest). */
    axes: json('axes').$type<{ path: string; values: number[] }[]>().notNull(),
    seed: varchar('seed', { length: 200 }).notNull(),
    systems: bigint('systems', { mode: 'number' }).notNull(),
    pointCount: int('point_count').notNull(),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [index('sweeps_department_idx').on(t.departmentId, t.createdAt)],
);
