import { mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

export const users = mysqlTable('users', {
  id: idColumn().primaryKey(),
  email: varchar('email', { length: 254 }).notNull().unique(),
  name: varchar('name', { length: 120 }).notNull(),
  passwordHash: varchar('password_hash', { length: 255 }).notNull(),
  createdAt: timestamp('created_at').notNull(),
});

export type UserRow = typeof users.$inferSelect;
