import type { Server } from 'node:http';
import { createApp, type TidefieldApp } from './app.ts';
import type { Config } from './config.ts';
import { connectDatabase, migrateDatabase, type Database } from './db/client.ts';
import { createLogger } from './logger.ts';
import { ensurePublishedLibrary } from './modules/samples/samples.service.ts';

export interface RunningServer {
  url: string;
  server: Server;
  database: Database;
  /** The wired app (tests reach the credit ledger's operator calls through it, as ctx.tidefield in the API tests). */
  tidefield: TidefieldApp;
  stop(): Promise<void>;
}

/** Connects to the database, applies migrations, and listens. Stops cleanly on stop(). */
export async function startServer(config: Config): Promise<RunningServer> {
  const logger = createLogger(config);
  const database = connectDatabase(config);
  await migrateDatabase(database);
  await ensurePublishedLibrary(database.db);
  const tidefield = createApp({ config, database, logger });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = tidefield.app.listen(config.PORT, config.HOST, () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  const url = `http://${config.HOST}:${port}`;
  await tidefield.scheduler.start();
  logger.info({ url }, 'Tidefield is listening');
  let stopping: Promise<void> | undefined;
  return {
    url,
    server,
    database,
    tidefield,
    stop() {
      stopping ??= (async () => {
        const closed = new Promise<void>((resolve) => server.close(() => resolve()));
        server.closeAllConnections();
        // Runs in progress write a checkpoint and resume from it on the next start.
        await tidefield.close();
        await closed;
        await database.close();
      })();
      return stopping;
    },
  };
}
