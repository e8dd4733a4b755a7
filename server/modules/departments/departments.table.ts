import { mysqlEnum, mysqlTable, primaryKey, index, varchar } from 'drizzle-orm/mysql-core';
import { ROLES } from '../../../shared/contracts/roles.ts';
import { idColumn, timestamp } from '../../db/columns.ts';
import { users } from '../users/users.table.ts';

export const departments = mysqlTable('departments', {
  id: idColumn().primaryKey(),
  name: varchar('name', { length: 160 }).notNull(),
  createdAt: timestamp('created_at').notNull(),
});

export const memberships = mysqlTable(
  'memberships',
  {
    userId: idColumn('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    departmentId: idColumn('department_id')
      .notNull()
      .references(() => departments.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', ROLES).notNull(),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.departmentId] }), index('memberships_department_idx').on(t.departmentId)],
);

export type DepartmentRow = typeof departments.$inferSelect;
export type MembershipRow = typeof memberships.$inferSelect;
