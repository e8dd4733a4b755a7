import { index, int, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/** Append-only record of who did what to which object. Never updated or deleted by the app. */
export const auditLog = mysqlTable(
  'audit_log',
  {
    id: int('id').autoincrement().primaryKey(),
    at: timestamp('at').notNull(),
    departmentId: idColumn('department_id'),
    actorUserId: idColumn('actor_user_id'),
    action: varchar('action', { length: 64 }).notNull(),
    target: varchar('target', { length: 255 }),
    detail: json('detail').$type<Record<string, unknown>>(),
  },
  (t) => [index('audit_department_idx').on(t.departmentId, t.at)],
);
