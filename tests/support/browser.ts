/**
 * The browser-test harness: the real server (built client, API, scheduler and pool) on a
 * throwaway database seeded with the demo department, and Debian's Chromium driven by
 * playwright-core. Every test saves a screenshot to tests/artifacts/.
 */
import path from 'node:path';
import { inject } from 'vitest';
import { PROJECT_ROOT } from '../../scripts/mariadb.ts';
import { startServer, type RunningServer } from '../../server/index.ts';
import { seedDemo } from '../../server/seed/demo.ts';
import type { Config } from '../../server/config.ts';
import { startFakesOnFreePorts } from '../../server/fakes/local-fakes.ts';
import { builtAppConfig, launchBrowserDriver, type BrowserDriver } from './browser-driver.ts';
import { TEST_STRIPE_SECRETS, createTestDatabase } from './test-app.ts';

export { chooseOption, fillFitForm } from './browser-driver.ts';

export const ARTIFACTS = path.join(PROJECT_ROOT, 'tests/artifacts');
export const DEMO_PASSWORD = 'tidefield-demo';

export interface BrowserStack extends Omit<BrowserDriver, 'close'> {
  baseUrl: string;
  server: RunningServer;
  stop(): Promise<void>;
}

/** `overrides` go last into the server's configuration (e.g. a fixed PORT and the payment and mail stand-ins). */
export async function startBrowserStack(overrides: Partial<Config> = {}): Promise<BrowserStack> {
  // Mail goes to a stand-in SMTP server on a free port unless the caller brings its own fakes.
  const ownFakes = overrides.SMTP_PORT === undefined ? await startFakesOnFreePorts(TEST_STRIPE_SECRETS) : null;
  if (ownFakes) overrides = { ...ownFakes.config, ...overrides };
  const { config: dbConfig, database, drop } = await createTestDatabase();
  await seedDemo(database.db, DEMO_PASSWORD);
  const server = await startServer({ ...dbConfig, ...builtAppConfig(DEMO_PASSWORD), ...overrides });
  const driver = await launchBrowserDriver({ chromiumPath: inject('chromiumPath'), baseUrl: server.url, artifacts: ARTIFACTS, demoPassword: DEMO_PASSWORD });
  return {
    ...driver,
    baseUrl: server.url,
    server,
    async stop() {
      await driver.close();
      await server.stop();
      await drop();
      await ownFakes?.close();
    },
  };
}
