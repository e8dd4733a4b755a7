/**
 * A MariaDB server of one test file's own, for tests that stop and restart the database
 * (the shared throwaway server of global-setup.ts must keep running for the other files).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureMariaDb, findFreePort, stopMariaDb } from '../../scripts/mariadb.ts';
import { testConfig, type Config } from '../../server/config.ts';

export interface PrivateMariaDb {
  config: Config;
  /** Stops the server (SIGTERM) and waits until it is gone. */
  stop(): Promise<void>;
  /** Starts it again on the same port and data. */
  start(): Promise<void>;
  /** Stops it and removes its data. */
  remove(): Promise<void>;
}

export async function startPrivateMariaDb(): Promise<PrivateMariaDb> {
  const stateDir = mkdtempSync(path.join(os.tmpdir(), 'tidefield-private-db-'));
  const port = await findFreePort();
  const options = { stateDir, port, database: 'tidefield_outage', appUser: 'tidefield_outage', grantAll: true, log: () => {} };
  const conn = await ensureMariaDb(options);
  const config = testConfig({ DB_HOST: conn.host, DB_PORT: conn.port, DB_USER: conn.user, DB_PASSWORD: conn.password, DB_NAME: conn.database });
  return {
    config,
    stop: async () => {
      await stopMariaDb(stateDir, () => {});
    },
    start: async () => {
      await ensureMariaDb(options);
    },
    remove: async () => {
      await stopMariaDb(stateDir, () => {});
      rmSync(stateDir, { recursive: true, force: true });
    },
  };
}
