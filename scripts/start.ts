/**
 * `npm start`: the whole app on this machine. Starts Tidefield's private MariaDB (installing
 * it when missing), builds the client when its sources changed, applies migrations, seeds the
 * demo department into an empty database, and serves everything on http://127.0.0.1:3000.
 */
import { loadConfig } from '../server/config.ts';
import { startServer } from '../server/index.ts';
import { countDepartments } from '../server/modules/departments/departments.repository.ts';
import { DEMO_DEPARTMENT, DEMO_USERS, seedDemo } from '../server/seed/demo.ts';
import { buildClientIfStale } from './client-build.ts';
import { DEFAULT_STATE_DIR, devDbPort, ensureMariaDb } from './mariadb.ts';

async function main() {
  const dbPort = devDbPort();
  const conn = await ensureMariaDb({ stateDir: DEFAULT_STATE_DIR, port: dbPort, database: 'tidefield', appUser: 'tidefield' });
  if (process.env.SKIP_CLIENT_BUILD !== '1') buildClientIfStale();

  const config = loadConfig({
    NODE_ENV: 'production',
    ...process.env,
    DB_HOST: conn.host,
    DB_PORT: String(conn.port),
    DB_USER: conn.user,
    DB_PASSWORD: conn.password,
    DB_NAME: conn.database,
  });
  const running = await startServer(config);

  const empty = (await countDepartments(running.database.db)) === 0;
  if (empty) await seedDemo(running.database.db, config.DEMO_PASSWORD);

  const lines = [
    '',
    `  Tidefield is running at ${running.url}`,
    `  Database: private MariaDB on 127.0.0.1:${conn.port} (data in .data/mariadb; stop it with npm run db:stop)`,
    '',
    `  Demo department: ${DEMO_DEPARTMENT}${empty ? ' (seeded just now)' : ''}`,
    ...DEMO_USERS.map((u) => `    ${u.role.padEnd(9)} ${u.email}`),
    `  Demo password: ${config.DEMO_PASSWORD}  (for the local demo only; set DEMO_PASSWORD to change it before the first start)`,
    '',
    '  Press Ctrl+C to stop the app (MariaDB keeps running for the next start).',
    '',
  ];
  console.log(lines.join('\n'));

  const shutdown = async (signal: string) => {
    console.log(`\n${signal}: stopping Tidefield …`);
    await running.stop();
    process.exit(0);
  };
  process.once('SIGINT', () => void shutdown('SIGINT'));
  process.once('SIGTERM', () => void shutdown('SIGTERM'));
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
