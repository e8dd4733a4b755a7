import { boolean, char, index, mysqlTable } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';
import { users } from '../users/users.table.ts';

/** A password-reset link; only the token's SHA-256 is stored. Single use, valid for an hour. */
export const passwordResets = mysqlTable(
  'password_resets',
  {
    id: idColumn().primaryKey(),
    userId: idColumn('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: char('token_hash', { length: 64 }).notNull().unique(),
    createdAt: timestamp('created_at').notNull(),
    expiresAt: timestamp('expires_at').notNull(),
    usedAt: timestamp('used_at'),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);

/** Which e-mail notices a user gets; no row means the defaults (all on). */
export const notificationSettings = mysqlTable('notification_settings', {
  userId: idColumn('user_id')
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  runFinished: boolean('run_finished').notNull().default(true),
  runFailed: boolean('run_failed').notNull().default(true),
  updatedAt: timestamp('updated_at').notNull(),
});
