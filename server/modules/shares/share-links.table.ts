import { char, index, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/**
 * Read-only links to one run or sweep, for citing it. Only a sha256 of the link's secret is
 * stored (the secret is shown once); a revoked link answers 404.
 */
export const shareLinks = mysqlTable(
  'share_links',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    createdByUserId: idColumn('created_by_user_id').notNull(),
    /** "run" or "sweep". */
    kind: varchar('kind', { length: 16 }).notNull(),
    objectId: idColumn('object_id').notNull(),
    secretHash: char('secret_hash', { length: 64 }).notNull().unique(),
    /** The first characters of the secret, to recognise a link in the list. */
    prefix: varchar('prefix', { length: 16 }).notNull(),
    createdAt: timestamp('created_at').notNull(),
    lastOpenedAt: timestamp('last_opened_at'),
    revokedAt: timestamp('revoked_at'),
  },
  (t) => [index('share_links_department_idx').on(t.departmentId, t.createdAt)],
);
