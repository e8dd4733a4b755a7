import { double, index, int, json, mysqlTable, primaryKey, text, varchar } from 'drizzle-orm/mysql-core';
import type { CompanionRow } from '../../../shared/contracts/occurrence-table.ts';
import { idColumn, timestamp } from '../../db/columns.ts';

/** A department's stored table of companion occurrence rows. */
export const occurrenceTables = mysqlTable(
  'occurrence_tables',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    ownerUserId: idColumn('owner_user_id').notNull(),
    name: varchar('name', { length: 160 }).notNull(),
    description: text('description'),
    rowCount: int('row_count').notNull(),
    createdAt: timestamp('created_at').notNull(),
    updatedAt: timestamp('updated_at').notNull(),
  },
  (t) => [index('occurrence_tables_department_idx').on(t.departmentId, t.updatedAt)],
);

/**
 * One row per companion row. The searchable numbers have their own columns; the whole row
 * (shape, provenance) is kept as the validated document in `row` so nothing is lost.
 */
export const occurrenceRows = mysqlTable(
  'occurrence_rows',
  {
    tableId: idColumn('table_id')
      .notNull()
      .references(() => occurrenceTables.id, { onDelete: 'cascade' }),
    position: int('position').notNull(),
    companionClass: varchar('companion_class', { length: 16 }).notNull(),
    occurrence: double('occurrence').notNull(),
    periodMinDays: double('period_min_days').notNull(),
    periodMaxDays: double('period_max_days').notNull(),
    row: json('row').$type<CompanionRow>().notNull(),
  },
  (t) => [primaryKey({ columns: [t.tableId, t.position] })],
);
