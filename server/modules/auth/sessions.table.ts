import { index, mysqlTable, datetime, varchar } from 'drizzle-orm/mysql-core';
import { idColumn } from '../../db/columns.ts';
import { users } from '../users/users.table.ts';
import { departments } from '../departments/departments.table.ts';

/** Lucia's session table: id, userId and expiresAt are required by its Drizzle adapter. */
export const sessions = mysqlTable(
  'sessions',
  {
    id: varchar('id', { length: 255 }).primaryKey(),
    userId: idColumn('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: datetime('expires_at', { mode: 'date' }).notNull(),
    /** The department the session is working in (a user may belong to several). */
    activeDepartmentId: idColumn('active_department_id').references(() => departments.id, { onDelete: 'set null' }),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);
