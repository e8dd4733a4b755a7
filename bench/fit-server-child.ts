import { createInterface } from 'node:readline';
import type { DbConnection } from '../scripts/mariadb.ts';
import { testConfig } from '../server/config.ts';
import { startFakesOnFreePorts } from '../server/fakes/local-fakes.ts';
import { startServer } from '../server/index.ts';
import { seedDemo } from '../server/seed/demo.ts';
import { builtAppConfig } from '../tests/support/browser-driver.ts';

/**
 * Child process of `npm run bench:fit-browser`: the app as the browser tests run it (built
 * client, API, scheduler, two pool threads, the payment and mail stand-ins) on the database
 * named by BENCH_DB, with the demo department seeded. It prints one JSON line with its address;
 * when its standard input closes it stops and prints one JSON line with the peak resident set
 * size of the whole process (pool threads included), so the server is measured without the
 * benchmark's own browser driver.
 */
const conn = JSON.parse(process.env.BENCH_DB ?? '') as DbConnection;
const demoPassword = process.env.BENCH_DEMO_PASSWORD ?? 'tidefield-demo';
const fakes = await startFakesOnFreePorts({ apiKey: 'sk_test_tidefield_bench', webhookSecret: 'whsec_tidefield_bench' });
const server = await startServer(
  testConfig({
    DB_HOST: conn.host,
    DB_PORT: conn.port,
    DB_USER: conn.user,
    DB_PASSWORD: conn.password,
    DB_NAME: conn.database,
    ...fakes.config,
    ...builtAppConfig(demoPassword),
  }),
);
await seedDemo(server.database.db, demoPassword);
process.stdout.write(`${JSON.stringify({ url: server.url })}\n`);

// The parent closes our standard input to stop us (no signal handling differs between platforms).
createInterface({ input: process.stdin }).on('close', () => {
  void (async () => {
    await server.stop();
    await fakes.close();
    process.stdout.write(`${JSON.stringify({ maxRssMB: process.resourceUsage().maxRSS / 1024 })}\n`);
    process.exit(0);
  })();
});
