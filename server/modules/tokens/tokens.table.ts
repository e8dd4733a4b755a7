import { char, index, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';
import { users } from '../users/users.table.ts';

/** Personal API tokens. Only a sha256 of the secret is stored; the secret is shown once. */
export const apiTokens = mysqlTable(
  'api_tokens',
  {
    id: idColumn().primaryKey(),
    userId: idColumn('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** The department the token acts in (tokens do not switch departments). */
    departmentId: idColumn('department_id').notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    /** What the token may do (shared/contracts/tokens.ts): read, or read and start/cancel runs and sweeps. */
    scope: mysqlEnum('scope', ['read', 'run']).notNull().default('read'),
    secretHash: char('secret_hash', { length: 64 }).notNull().unique(),
    /** The first characters of the token, to recognise it in a list. */
    prefix: varchar('prefix', { length: 16 }).notNull(),
    createdAt: timestamp('created_at').notNull(),
    lastUsedAt: timestamp('last_used_at'),
    expiresAt: timestamp('expires_at'),
    revokedAt: timestamp('revoked_at'),
  },
  (t) => [index('api_tokens_user_idx').on(t.userId)],
);
