/**
 * Vitest global setup for the API and browser suites: a throwaway MariaDB server and a private
 * Redis on free ports in a temporary folder, removed afterwards. Each test file creates its own database on
 * it (see test-app.ts), so files can run in parallel without seeing each other's rows.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { ensureMariaDb, findFreePort, stopMariaDb, type DbConnection } from '../../scripts/mariadb.ts';
import { ensureRedis, stopRedis } from '../../scripts/redis.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    testDb: DbConnection;
    /** A private Redis (no persistence) for the scale-out tests; each test file uses its own queue name. */
    testRedisUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const stateDir = mkdtempSync(path.join(os.tmpdir(), 'tidefield-test-db-'));
  const port = await findFreePort();
  const conn = await ensureMariaDb({
    stateDir,
    port,
    database: 'tidefield_test',
    appUser: 'tidefield_test',
    grantAll: true,
    log: () => {},
  });
  project.provide('testDb', conn);
  const redisUrl = await ensureRedis({ stateDir, port: await findFreePort(), log: () => {} });
  project.provide('testRedisUrl', redisUrl);
  return async () => {
    await stopRedis(stateDir, () => {});
    await stopMariaDb(stateDir, () => {});
    rmSync(stateDir, { recursive: true, force: true });
  };
}
