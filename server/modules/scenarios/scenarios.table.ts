import { char, index, int, json, mysqlTable, primaryKey, text, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/** A named scenario of a department; its documents live in scenario_versions. */
export const scenarios = mysqlTable(
  'scenarios',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    ownerUserId: idColumn('owner_user_id').notNull(),
    name: varchar('name', { length: 160 }).notNull(),
    /** The newest version number (versions count up from 1). */
    currentVersion: int('current_version').notNull(),
    createdAt: timestamp('created_at').notNull(),
    updatedAt: timestamp('updated_at').notNull(),
    /** Soft delete: runs keep pointing at a deleted scenario's snapshot. */
    deletedAt: timestamp('deleted_at'),
  },
  (t) => [index('scenarios_department_idx').on(t.departmentId, t.updatedAt)],
);

/** Every saved document of a scenario, never changed once written. */
export const scenarioVersions = mysqlTable(
  'scenario_versions',
  {
    scenarioId: idColumn('scenario_id')
      .notNull()
      .references(() => scenarios.id, { onDelete: 'cascade' }),
    version: int('version').notNull(),
    /** The document as the user wrote it (defaults not filled in). */
    document: json('document').$type<Record<string, unknown>>().notNull(),
    /** sha256 of the parsed document's RFC 8785 form (engine scenarioHash). */
    documentHash: char('document_hash', { length: 64 }).notNull(),
    note: text('note'),
    createdByUserId: idColumn('created_by_user_id').notNull(),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.scenarioId, t.version] })],
);
