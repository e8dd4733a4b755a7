/**
 * The modeller's whole job in the browser: build a scenario from a preset, save it, run it,
 * see the result charts and download the CSV. And a server-only rule: its message lands at
 * the field that caused it (values the builder can check itself hold Save back: see
 * builder-overview-charts.test.ts).
 */
import { readFileSync } from 'node:fs';
import type { Locator } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
const EXAMPLE = JSON.parse(readFileSync(new URL('../../shared/scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8'));

/** The text of everything an input's aria-describedby points at (its hint and its error). */
async function describedText(input: Locator): Promise<string> {
  const ids = ((await input.getAttribute('aria-describedby')) ?? '').split(/\s+/).filter(Boolean);
  const texts = await Promise.all(ids.map((id) => input.page().locator(`[id="${id}"]`).textContent()));
  return texts.join(' ');
}
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

describe('modeller', () => {
  it('builds a scenario from a preset, runs it, sees the charts and exports CSV', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios/new');
      await page.getByRole('navigation', { name: 'Start from' }).getByRole('link', { name: /Baseline, fixed engulfment reach/ }).click();
      // The address changes at once, but the example's builder replaces the blank one only when its
      // render is done (a router transition: 0.3–0.6 s here, longer under load), and until then the blank
      // builder still takes typing that the swap then throws away. Type once the example is open.
      await page.getByText('Started from the example “Baseline, fixed engulfment reach”').waitFor({ timeout: 30_000 });
      await page.getByLabel('Scenario name').fill('Browser test baseline');
      await page.getByLabel('Efficiency α_CE').fill('0.5');
      await page.getByRole('button', { name: 'Save scenario' }).click();
      await page.waitForURL(/\/scenarios\/[A-Za-z0-9_-]{8,}$/);
      // What was saved is the example with the one change (the blank builder has no companion rows).
      const saved = await (await page.request.get(`/api/scenarios/${new URL(page.url()).pathname.split('/').pop()}`)).json();
      expect(saved.document.companions.rows).toHaveLength(EXAMPLE.companions.rows.length);
      expect(saved.document.envelope.alpha).toBe(0.5);
      await stack.screenshot(page, 'modeller-scenario-saved');

      await page.getByRole('link', { name: 'Run this scenario' }).click();
      await page.waitForURL(/\/runs\/new/);
      // Scope to the run form: the URL changes before the lazily loaded page replaces the builder,
      // whose own "Systems" field is still on screen for a moment. The form fills systems and
      // seed from the scenario once that has loaded; type after that.
      const runForm = page.getByRole('form', { name: 'Start a run' });
      const systems = runForm.getByLabel('Systems');
      await expect.poll(() => systems.inputValue(), { timeout: 20_000 }).not.toBe('');
      await systems.fill('300000');
      await runForm.getByRole('button', { name: 'Start the run' }).click();
      await page.waitForURL(/\/runs\/[A-Za-z0-9_-]{8,}$/);

      // The finished run: at least four charts drawn from the run's data.
      const exportLink = page.getByRole('link', { name: 'Download CSV' });
      await exportLink.waitFor({ timeout: 120_000 });
      await expect.poll(() => page.locator('figure svg').count(), { timeout: 60_000 }).toBeGreaterThanOrEqual(4);
      await stack.screenshot(page, 'modeller-run-result');

      const [download] = await Promise.all([page.waitForEvent('download'), exportLink.click()]);
      const csv = readFileSync((await download.path())!, 'utf8');
      expect(csv.split('\n')[0]).toBe('section,key,value,se,lo,hi,extra');
      // Every record has the header's seven fields (RFC 4180 §2.4), empty ones left blank.
      expect(csv).toMatch(/^counts,primaries,300000,,,,$/m);
    } finally {
      await context.close();
    }
  });

  it("shows a server-only rule at the field: an observer's run size", async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/runs/new');
      const runForm = page.getByRole('form', { name: 'Start a run' });
      await runForm.getByLabel('Scenario').selectOption({ index: 1 });
      const systems = runForm.getByLabel('Systems');
      await expect.poll(() => systems.inputValue(), { timeout: 20_000 }).not.toBe('');
      await systems.fill('5000000');
      await runForm.getByRole('button', { name: 'Start the run' }).click();
      await expect.poll(() => describedText(systems), { timeout: 20_000 }).toMatch(/Observers may start runs of at most 1,000,000 systems/);
      expect(await systems.getAttribute('aria-invalid')).toBe('true');
      await stack.screenshot(page, 'observer-systems-limit-at-field');
    } finally {
      await context.close();
    }
  });
});
