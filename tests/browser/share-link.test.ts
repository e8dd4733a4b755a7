/**
 * A read-only link in the browser: a modeller creates it on the run page's Exports section; a
 * fresh browser context (no cookies, never signed in) opens it and sees the run; after the
 * modeller revokes it, the same link shows "not found" and its API answers 404.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

describe('share link', () => {
  it('shows the run to a fresh browser context, and 404 once revoked', async () => {
    const modeller = await stack.newPage();
    const visitor = await stack.newPage();
    try {
      const { page } = modeller;
      await stack.signIn(page, 'modeller');
      // A finished run to share: a small run of the first demo scenario, started through the API with the page's session.
      const scenarios = (await (await page.request.get('/api/scenarios')).json()) as { scenarios: { id: string; name: string }[] };
      const scenario = scenarios.scenarios[0];
      const created = await page.request.post('/api/runs', { data: { scenarioId: scenario.id, systems: 20_000 } });
      expect(created.status()).toBe(201);
      const runId = ((await created.json()) as { id: string }).id;
      await expect.poll(async () => ((await (await page.request.get(`/api/runs/${runId}`)).json()) as { status: string }).status, { timeout: 90_000, interval: 250 }).toBe('succeeded');

      await page.goto(`/runs/${runId}`);
      const exportsSection = page.getByRole('region', { name: 'Exports' });
      await exportsSection.getByRole('link', { name: 'White-dwarf masses as ECSV' }).waitFor({ timeout: 30_000 });
      await exportsSection.getByRole('button', { name: 'Create a read-only link' }).click();
      const link = exportsSection.getByLabel('Read-only link', { exact: true });
      await link.waitFor();
      const url = (await link.textContent())!.trim();
      expect(url).toMatch(/\/shared\/tfs_[A-Za-z0-9_-]{32}$/);
      await stack.screenshot(page, 'share-link-created');

      // A fresh context: no session cookie.
      const fresh = visitor.page;
      expect(await visitor.context.cookies()).toEqual([]);
      await fresh.goto(url);
      await fresh.getByRole('heading', { level: 1, name: scenario.name }).waitFor({ timeout: 30_000 });
      await fresh.getByText('read-only link', { exact: false }).first().waitFor();
      expect(await fresh.getByRole('region', { name: 'Methods paragraph text' }).textContent()).toContain(`Tidefield run ${runId}`);
      await fresh.locator('figure svg').first().waitFor({ timeout: 30_000 });
      // Read-only: no sign-in redirect, no navigation of the app, no exports of the department.
      expect(new URL(fresh.url()).pathname).toBe(new URL(url).pathname);
      expect(await fresh.getByRole('button', { name: 'Create a read-only link' }).count()).toBe(0);
      await stack.screenshot(fresh, 'share-link-opened');

      await exportsSection.getByRole('button', { name: /^Revoke tfs_/ }).click();
      await exportsSection.getByRole('button', { name: /^Revoke tfs_/ }).waitFor({ state: 'detached' });

      await fresh.reload();
      await fresh.getByRole('heading', { name: 'This link does not exist or was revoked' }).waitFor({ timeout: 30_000 });
      const api = await fresh.request.get(`/api/shared/${url.split('/shared/')[1]}`);
      expect(api.status()).toBe(404);
      await stack.screenshot(fresh, 'share-link-revoked');

      // The department's list shows the link as revoked.
      await page.goto('/api-tokens');
      const list = page.getByRole('region', { name: 'Read-only links' });
      await list.getByText(/^revoked /).first().waitFor({ timeout: 30_000 });
    } finally {
      await modeller.context.close();
      await visitor.context.close();
    }
  });
});
