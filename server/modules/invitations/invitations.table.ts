import { char, index, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { ROLES } from '../../../shared/contracts/roles.ts';
import { idColumn, timestamp } from '../../db/columns.ts';
import { departments } from '../departments/departments.table.ts';

/** An e-mailed invitation to join a department with a role. Only the link token's SHA-256 is stored. */
export const invitations = mysqlTable(
  'invitations',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id')
      .notNull()
      .references(() => departments.id, { onDelete: 'cascade' }),
    email: varchar('email', { length: 254 }).notNull(),
    role: mysqlEnum('role', ROLES).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull().unique(),
    invitedByUserId: idColumn('invited_by_user_id').notNull(),
    createdAt: timestamp('created_at').notNull(),
    expiresAt: timestamp('expires_at').notNull(),
    acceptedAt: timestamp('accepted_at'),
    acceptedByUserId: idColumn('accepted_by_user_id'),
    revokedAt: timestamp('revoked_at'),
  },
  (t) => [index('invitations_department_idx').on(t.departmentId, t.email)],
);

export type InvitationRow = typeof invitations.$inferSelect;
