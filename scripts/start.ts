/**
 * `npm start`: the whole app on this machine. Starts Tidefield's private MariaDB (installing
 * it when missing), builds the client when its sources changed, applies migrations, seeds the
 * demo department into an empty database, and serves everything on http://127.0.0.1:3000.
 * Beside it run the local stand-ins for payments and e-mail (server/fakes) whenever the
 * configuration points at loopback addresses, as it does by default.
 */
import { isLocalDemo, loadConfig, publicBaseUrl } from '../server/config.ts';
import { startLocalFakes } from '../server/fakes/local-fakes.ts';
import { startServer } from '../server/index.ts';
import { countDepartments } from '../server/modules/departments/departments.repository.ts';
import { DEMO_DEPARTMENT, DEMO_USERS, seedDemo } from '../server/seed/demo.ts';
import { buildClientIfStale } from './client-build.ts';
import { ensureDevDatabase } from './mariadb.ts';

async function main() {
  const { conn, env: dbEnv } = await ensureDevDatabase();
  if (process.env.SKIP_CLIENT_BUILD !== '1') buildClientIfStale();

  const config = loadConfig({
    NODE_ENV: 'production',
    ...process.env,
    ...dbEnv,
  });
  const fakes = await startLocalFakes(config, `${publicBaseUrl(config)}/api/billing/webhook`);
  const running = await startServer(config).catch(async (error: unknown) => {
    await fakes.close();
    throw error;
  });

  // Demo accounts share a published password: they exist only in the local demo mode.
  const localDemo = isLocalDemo(config);
  const empty = (await countDepartments(running.database.db)) === 0;
  if (empty && localDemo) await seedDemo(running.database.db, config.DEMO_PASSWORD);

  const lines = [
    '',
    `  Tidefield is running at ${running.url}`,
    `  Database: private MariaDB on 127.0.0.1:${conn.port} (data in .data/mariadb; stop it with npm run db:stop)`,
    '',
    ...(localDemo
      ? [
          '  Local demo mode: the app, payments and e-mail are on this machine (local stand-ins).',
          `  Demo department: ${DEMO_DEPARTMENT}${empty ? ' (seeded just now)' : ''}`,
          ...DEMO_USERS.map((u) => `    ${u.role.padEnd(9)} ${u.email}`),
          `  Demo password: ${config.DEMO_PASSWORD}  (for the local demo only; set DEMO_PASSWORD to change it before the first start)`,
        ]
      : ['  Hosted mode: payments, e-mail or the app are not on this machine alone, so no demo accounts are seeded.']),
    '',
    fakes.payment
      ? `  Payments: local stand-in at ${fakes.payment.url} (test cards 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)`
      : `  Payments: ${config.STRIPE_API_PROTOCOL}://${config.STRIPE_API_HOST}:${config.STRIPE_API_PORT}`,
    fakes.mail
      ? `  E-mail: local SMTP stand-in on ${fakes.mail.host}:${fakes.mail.smtpPort}; each user reads their own mail at ${running.url}/outbox`
      : `  E-mail: SMTP ${config.SMTP_HOST}:${config.SMTP_PORT}`,
    '',
    '  Press Ctrl+C to stop the app (MariaDB keeps running for the next start).',
    '',
  ];
  console.log(lines.join('\n'));

  const shutdown = async (signal: string) => {
    console.log(`\n${signal}: stopping Tidefield …`);
    await running.stop();
    await fakes.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void shutdown('SIGINT'));
  process.once('SIGTERM', () => void shutdown('SIGTERM'));
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
