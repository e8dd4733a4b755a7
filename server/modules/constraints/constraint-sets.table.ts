import { index, int, json, mysqlTable, primaryKey, text, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/** A named constraint set of a department; its contents live in constraint_set_versions. */
export const constraintSets = mysqlTable(
  'constraint_sets',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    ownerUserId: idColumn('owner_user_id').notNull(),
    name: varchar('name', { length: 160 }).notNull(),
    /** The newest version number (versions count up from 1). */
    currentVersion: int('current_version').notNull(),
    createdAt: timestamp('created_at').notNull(),
    updatedAt: timestamp('updated_at').notNull(),
    /** Soft delete: an evaluation quoted elsewhere can still name the set. */
    deletedAt: timestamp('deleted_at'),
  },
  (t) => [index('constraint_sets_department_idx').on(t.departmentId, t.updatedAt)],
);

/** Every saved version of a set (the constraints as parsed, CSV already turned into lists), never changed once written. */
export const constraintSetVersions = mysqlTable(
  'constraint_set_versions',
  {
    setId: idColumn('set_id')
      .notNull()
      .references(() => constraintSets.id, { onDelete: 'cascade' }),
    version: int('version').notNull(),
    constraints: json('constraints').$type<Record<string, unknown>[]>().notNull(),
    note: text('note'),
    createdByUserId: idColumn('created_by_user_id').notNull(),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.setId, t.version] })],
);
