/**
 * The observer's question in the browser: choose a scenario and a sample, start the run, and
 * read the range of companion occurrence the sample allows, in words and drawn.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chooseOption, startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

describe('observer', () => {
  it('asks what occurrence the demo pilot sample implies', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/implied-occurrence');
      await chooseOption(page.getByLabel('Scenario'), 'Baseline, fixed engulfment reach');
      await chooseOption(page.getByLabel('Observed sample'), 'Harrowgate 40 pc pilot survey (illustrative)');
      await page.getByLabel('Systems').fill('200000');
      await page.getByRole('button', { name: 'Find the implied occurrence' }).click();
      const answer = page.getByText(/times the table’s companion occurrence|no multiplier/i).first();
      await answer.waitFor({ timeout: 90_000 });
      await page.locator('figure svg').first().waitFor({ timeout: 30_000 });
      expect(await answer.textContent()).toMatch(/68%|95%/);
      await stack.screenshot(page, 'observer-implied-occurrence');
    } finally {
      await context.close();
    }
  });
});
