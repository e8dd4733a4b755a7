import { char, index, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';
import { users } from '../users/users.table.ts';

/** A requested change of a user's e-mail address, confirmed by a link sent to the new address; only the token's SHA-256 is stored. */
export const emailChanges = mysqlTable(
  'email_changes',
  {
    id: idColumn().primaryKey(),
    userId: idColumn('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    newEmail: varchar('new_email', { length: 254 }).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull().unique(),
    createdAt: timestamp('created_at').notNull(),
    expiresAt: timestamp('expires_at').notNull(),
    usedAt: timestamp('used_at'),
  },
  (t) => [index('email_changes_user_idx').on(t.userId)],
);
