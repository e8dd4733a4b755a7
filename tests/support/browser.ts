/**
 * The browser-test harness: the real server (built client, API, scheduler and pool) on a
 * throwaway database seeded with the demo department, and Debian's Chromium driven by
 * playwright-core. Every test saves a screenshot to tests/artifacts/.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { inject } from 'vitest';
import { CHROMIUM_ARGS } from '../../scripts/chromium.ts';
import { PROJECT_ROOT } from '../../scripts/mariadb.ts';
import { startServer, type RunningServer } from '../../server/index.ts';
import { DEMO_USERS, seedDemo } from '../../server/seed/demo.ts';
import type { Config } from '../../server/config.ts';
import { startFakesOnFreePorts } from '../../server/fakes/local-fakes.ts';
import { TEST_STRIPE_SECRETS, createTestDatabase } from './test-app.ts';

export const ARTIFACTS = path.join(PROJECT_ROOT, 'tests/artifacts');
export const DEMO_PASSWORD = 'tidefield-demo';

export interface BrowserStack {
  baseUrl: string;
  server: RunningServer;
  browser: Browser;
  /** A fresh browser context (own cookies) at the given viewport width. */
  newPage(options?: { width?: number; height?: number }): Promise<{ context: BrowserContext; page: Page }>;
  /** Signs in as one of the demo users through the sign-in form. */
  signIn(page: Page, role: 'admin' | 'modeller' | 'observer'): Promise<void>;
  screenshot(page: Page, name: string): Promise<string>;
  stop(): Promise<void>;
}

/** `overrides` go last into the server's configuration (e.g. a fixed PORT and the payment and mail stand-ins). */
export async function startBrowserStack(overrides: Partial<Config> = {}): Promise<BrowserStack> {
  // Mail goes to a stand-in SMTP server on a free port unless the caller brings its own fakes.
  const ownFakes = overrides.SMTP_PORT === undefined ? await startFakesOnFreePorts(TEST_STRIPE_SECRETS) : null;
  if (ownFakes) overrides = { ...ownFakes.config, ...overrides };
  const { config: dbConfig, database, drop } = await createTestDatabase();
  await seedDemo(database.db, DEMO_PASSWORD);
  const server = await startServer({
    ...dbConfig,
    NODE_ENV: 'production',
    PORT: 0,
    HOST: '127.0.0.1',
    CLIENT_DIST: path.join(PROJECT_ROOT, 'dist/client'),
    WORKER_THREADS: 2,
    LOG_LEVEL: 'warn',
    DEMO_PASSWORD,
    ...overrides,
  });
  const browser = await chromium.launch({ executablePath: inject('chromiumPath'), args: CHROMIUM_ARGS, headless: true });
  mkdirSync(ARTIFACTS, { recursive: true });
  return {
    baseUrl: server.url,
    server,
    browser,
    async newPage({ width = 1280, height = 900 } = {}) {
      const context = await browser.newContext({ viewport: { width, height }, baseURL: server.url });
      const page = await context.newPage();
      return { context, page };
    },
    async signIn(page, role) {
      const user = DEMO_USERS.find((u) => u.role === role)!;
      await page.goto('/sign-in');
      await page.getByLabel(/e-?mail/i).fill(user.email);
      await page.getByLabel(/password/i).fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    },
    async screenshot(page, name) {
      const file = path.join(ARTIFACTS, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    async stop() {
      await browser.close();
      await server.stop();
      await drop();
      await ownFakes?.close();
    },
  };
}

/** Picks the option of a <select> whose text contains `text` (labels may carry extra detail such as counts). */
export async function chooseOption(select: import('playwright-core').Locator, text: string): Promise<void> {
  const option = select.locator('option', { hasText: text }).first();
  await option.waitFor({ state: 'attached', timeout: 30_000 });
  const value = await option.getAttribute('value');
  await select.selectOption(value ?? text);
}
