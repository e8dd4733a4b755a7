import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';
import type { Config } from '../config.ts';
import * as schema from './schema.ts';

export type Db = MySql2Database<typeof schema>;
/** A transaction handle, as passed to db.transaction's callback. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export interface Database {
  db: Db;
  pool: mysql.Pool;
  close(): Promise<void>;
}

const MIGRATIONS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

export function connectDatabase(config: Pick<Config, 'DB_HOST' | 'DB_PORT' | 'DB_USER' | 'DB_PASSWORD' | 'DB_NAME'>): Database {
  const pool = mysql.createPool({
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
    connectionLimit: 10,
    // Store and read every DATETIME as UTC so Date values round-trip exactly.
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
    bigNumberStrings: false,
  });
  // mode 'planetscale' keeps drizzle from emitting LATERAL joins, which MariaDB lacks.
  const db = drizzle(pool, { schema, mode: 'planetscale' });
  return { db, pool, close: () => pool.end() };
}

/** Applies the committed drizzle-kit migrations in ./drizzle (idempotent). */
export async function migrateDatabase(database: Database): Promise<void> {
  await migrate(database.db, { migrationsFolder: MIGRATIONS_DIR });
}
