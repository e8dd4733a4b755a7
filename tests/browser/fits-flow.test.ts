/**
 * A small two-parameter fit from the browser: the demo modeller fits α_CE × engulfment reach of the
 * fixed-reach baseline against the published library, sees the cost before starting, then the
 * intervals, the corner plot (two marginals and one joint heat map) and the sentence.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { ARTIFACTS, fillFitForm, startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
}, 240_000);
afterAll(() => stack?.stop());

describe('fits', () => {
  it('runs a 3 × 3 fit and shows the corner plot and intervals', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      const form = await fillFitForm(page, {
        scenario: 'Baseline, fixed engulfment reach',
        constraintSet: 'library',
        systems: 20_000,
        parameters: [
          { path: 'envelope.alpha', from: 0.1, to: 1, points: 3 },
          { path: 'giant.reachAU', from: 1, to: 4, points: 3, spacing: 'log' },
        ],
      });
      // The cost comes first: 9 points × 20,000 systems.
      await expect.poll(() => page.getByTestId('fit-cost').textContent(), { timeout: 20_000 }).toMatch(/9 grid points × 20,000 systems, reserved at once as 180,000 systems/);
      await stack.screenshot(page, 'fit-form');
      await form.getByRole('button', { name: 'Start the fit' }).click();
      await page.waitForURL(/\/fits\/[A-Za-z0-9_-]{8,}$/);
      const intervals = page.getByTestId('fit-intervals');
      await intervals.waitFor({ timeout: 180_000 });
      const rows = intervals.locator('tbody tr');
      expect(await rows.count()).toBe(2);
      expect(await rows.nth(0).textContent()).toMatch(/Common-envelope efficiency/);
      const corner = page.getByTestId('fit-corner');
      // Two marginals and one joint panel render as SVG charts.
      await expect.poll(() => corner.locator('svg').count(), { timeout: 60_000 }).toBeGreaterThanOrEqual(3);
      expect(await page.getByTestId('fit-sentence').textContent()).toMatch(/^We find Common-envelope efficiency α_CE between .* \(68%/);
      await stack.screenshot(page, 'fit-corner-plot');
      await corner.screenshot({ path: path.join(ARTIFACTS, 'fit-corner-panels.png') });
    } finally {
      await context.close();
    }
  }, 400_000);
});
