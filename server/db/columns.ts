import { datetime, varchar } from 'drizzle-orm/mysql-core';
import { randomBytes } from 'node:crypto';

/** Ids are 16 random URL-safe characters (96 bits): unguessable, so ids leak nothing. */
export function newId(): string {
  return randomBytes(12).toString('base64url');
}

export const idColumn = (name = 'id') => varchar(name, { length: 32 });

/** Millisecond timestamps (MariaDB drops milliseconds unless fsp is set). */
export const timestamp = (name: string) => datetime(name, { mode: 'date', fsp: 3 });
