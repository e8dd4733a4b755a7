/**
 * Debian's Chromium driven by playwright-core against a running Tidefield: fresh contexts, the
 * demo users' sign-in through the form, full-page screenshots. Used by the browser suite
 * (browser.ts, which also starts the server in-process) and by `npm run bench:fit-browser`
 * (which runs the server in a child process of its own), so neither imports vitest here.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { CHROMIUM_ARGS } from '../../scripts/chromium.ts';
import { DEMO_USERS } from '../../server/seed/demo.ts';
import type { Role } from '../../shared/contracts/roles.ts';
import type { Config } from '../../server/config.ts';
import { PROJECT_ROOT } from '../../scripts/mariadb.ts';

export interface BrowserDriver {
  browser: Browser;
  /** A fresh browser context (own cookies) at the given viewport width. */
  newPage(options?: { width?: number; height?: number }): Promise<{ context: BrowserContext; page: Page }>;
  /** Signs in as one of the demo users through the sign-in form. */
  signIn(page: Page, role: Role): Promise<void>;
  /** A full-page PNG in the driver's artifacts folder; returns its path. */
  screenshot(page: Page, name: string): Promise<string>;
  close(): Promise<void>;
}

/** The app as the browser suite serves it: the built client, two pool threads, on a free loopback port. */
export function builtAppConfig(demoPassword: string): Partial<Config> {
  return {
    NODE_ENV: 'production',
    PORT: 0,
    HOST: '127.0.0.1',
    CLIENT_DIST: path.join(PROJECT_ROOT, 'dist/client'),
    WORKER_THREADS: 2,
    LOG_LEVEL: 'warn',
    DEMO_PASSWORD: demoPassword,
  };
}

export async function launchBrowserDriver(options: { chromiumPath: string; baseUrl: string; artifacts: string; demoPassword: string }): Promise<BrowserDriver> {
  const browser = await chromium.launch({ executablePath: options.chromiumPath, args: CHROMIUM_ARGS, headless: true });
  mkdirSync(options.artifacts, { recursive: true });
  return {
    browser,
    async newPage({ width = 1280, height = 900 } = {}) {
      const context = await browser.newContext({ viewport: { width, height }, baseURL: options.baseUrl });
      const page = await context.newPage();
      return { context, page };
    },
    async signIn(page, role) {
      const user = DEMO_USERS.find((u) => u.role === role)!;
      await page.goto('/sign-in');
      await page.getByLabel(/e-?mail/i).fill(user.email);
      await page.getByLabel(/password/i).fill(options.demoPassword);
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    },
    async screenshot(page, name) {
      const file = path.join(options.artifacts, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    close: () => browser.close(),
  };
}

/** Picks the option of a <select> whose text contains `text` (labels may carry extra detail such as counts). */
export async function chooseOption(select: import('playwright-core').Locator, text: string): Promise<void> {
  const option = select.locator('option', { hasText: text }).first();
  await option.waitFor({ state: 'attached', timeout: 30_000 });
  const value = await option.getAttribute('value');
  await select.selectOption(value ?? text);
}

/** One parameter row of the Fits page's form. */
export interface FitFormParameter {
  path: string;
  from: number;
  to: number;
  points: number;
  spacing?: 'linear' | 'log';
  prior?: 'uniform' | 'logUniform';
}

/** Opens the Fits page and fills its "New fit" form (without starting it); returns the form. */
export async function fillFitForm(
  page: Page,
  fit: { scenario: string; constraintSet: string; systems: number; parameters: readonly FitFormParameter[] },
): Promise<import('playwright-core').Locator> {
  await page.goto('/fits');
  const form = page.getByRole('form', { name: 'New fit' });
  await form.waitFor({ timeout: 30_000 });
  await chooseOption(form.getByLabel('Scenario'), fit.scenario);
  await chooseOption(form.getByLabel('Constraint set'), fit.constraintSet);
  await form.getByLabel('Systems per grid point').fill(String(fit.systems));
  for (const [i, p] of fit.parameters.entries()) {
    if (i > 0) await form.getByRole('button', { name: 'Add a parameter' }).click();
    const group = form.getByRole('group', { name: `Parameter ${i + 1}` });
    await group.getByLabel(`Parameter ${i + 1}`).selectOption(p.path);
    await group.getByLabel('From').fill(String(p.from));
    await group.getByLabel('To').fill(String(p.to));
    await group.getByLabel('Points').fill(String(p.points));
    if (p.spacing) await group.getByLabel('Spacing').selectOption(p.spacing);
    if (p.prior) await group.getByLabel('Prior').selectOption(p.prior);
  }
  return form;
}
