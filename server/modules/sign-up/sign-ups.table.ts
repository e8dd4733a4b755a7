import { char, index, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/**
 * A sign-up waiting for its e-mailed confirmation link: the account and its department are
 * created only when the link is opened. Only the token's SHA-256 is stored; the password only
 * as its argon2id hash. Single use, valid for SIGN_UP_VALID_HOURS.
 */
export const signUps = mysqlTable(
  'sign_ups',
  {
    id: idColumn().primaryKey(),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    departmentName: varchar('department_name', { length: 160 }).notNull(),
    passwordHash: varchar('password_hash', { length: 255 }).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull().unique(),
    createdAt: timestamp('created_at').notNull(),
    expiresAt: timestamp('expires_at').notNull(),
    usedAt: timestamp('used_at'),
  },
  (t) => [index('sign_ups_email_idx').on(t.email)],
);
