/**
 * Judging a prediction by every observable at once, in the browser: the demo modeller runs the
 * baseline track scenario and reads its scorecard against the published library (the
 * detached-companion zero rejects it at σ > 5, the overall ≈10% is consistent); an observer
 * uploads a CSV of magnetic white-dwarf masses (a bad file first: nothing stored) and gets a test;
 * the two-sample page answers 149 of 1500 against 0 of 1200.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chooseOption, startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
let runPath = '';

beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

/** The text of the scorecard line whose constraint label contains `label`. */
async function lineText(page: import('playwright-core').Page, label: string): Promise<string> {
  const row = page.locator('tr', { hasText: label }).first();
  await row.waitFor({ timeout: 60_000 });
  return (await row.textContent()) ?? '';
}

const sigmaOf = (text: string) => Number(/(\d+(?:\.\d+)?)σ/.exec(text)?.[1] ?? Number.NaN);

describe('constraint sets and scorecards', () => {
  it('shows the modeller at once that the detached-companion zero rejects the baseline track while the overall fraction is at most in mild tension', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios');
      await page.getByRole('link', { name: 'Baseline, analytic giant track' }).click();
      await page.waitForURL(/\/scenarios\/[A-Za-z0-9_-]{8,}$/);
      await page.getByRole('link', { name: 'Run this scenario' }).click();
      await page.waitForURL(/\/runs\/new/);
      const runForm = page.getByRole('form', { name: 'Start a run' });
      const systems = runForm.getByLabel('Systems');
      await expect.poll(() => systems.inputValue(), { timeout: 20_000 }).not.toBe('');
      await systems.fill('300000');
      await runForm.getByRole('button', { name: 'Start the run' }).click();
      await page.waitForURL(/\/runs\/[A-Za-z0-9_-]{8,}$/);
      runPath = new URL(page.url()).pathname;

      // The scorecard opens on the library set.
      const combined = page.getByTestId('scorecard-combined');
      await combined.waitFor({ timeout: 180_000 });
      const zero = await lineText(page, 'No magnetic white dwarf among 1,253');
      expect(zero).toMatch(/rejected/);
      expect(sigmaOf(zero)).toBeGreaterThan(5);
      // The overall incidence is not what rejects the model: engine 2's baseline track predicts
      // ≈ 15% against Jordan et al. (2007)'s ≈ 10% (± 2% as the library reads it), a mild tension
      // at most, far from the detached-companion zero's > 5σ.
      const overall = await lineText(page, 'About 10% of white dwarfs');
      expect(overall).not.toMatch(/rejected/);
      expect(sigmaOf(overall)).toBeLessThan(3);
      expect(await combined.textContent()).toMatch(/Jointly over \d+ constraints/);
      await stack.screenshot(page, 'modeller-scorecard');
    } finally {
      await context.close();
    }
  }, 300_000);

  it('lets an observer upload a CSV of magnetic masses (bad rows first: nothing stored) and get a test', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/constraint-sets');
      await page.getByLabel('Name of the set').fill('Harrowgate magnetic masses (illustrative)');
      await chooseOption(page.getByLabel('What the list holds'), 'Masses of magnetic white dwarfs');
      await page.getByLabel('CSV file').setInputFiles({ name: 'masses.csv', mimeType: 'text/csv', buffer: Buffer.from('star,massMsun\nH-1,0.81\nH-2,heavy\nH-3,0.92\n') });
      await expect.poll(() => page.getByLabel('CSV text').inputValue()).toMatch(/heavy/);
      await page.getByRole('button', { name: 'Save the set' }).click();
      const problems = page.getByTestId('csv-problems');
      await problems.waitFor({ timeout: 20_000 });
      expect(await problems.textContent()).toMatch(/Line 3, column massMsun: massMsun must be a number \(got "heavy"\)/);
      expect(await page.locator('tr', { hasText: 'Harrowgate magnetic masses' }).count()).toBe(0);
      await stack.screenshot(page, 'observer-csv-problems');

      await page.getByLabel('CSV text').fill('star,massMsun\nH-1,0.81\nH-2,1.02\nH-3,0.92\nH-4,0.77\nH-5,0.88\nH-6,1.10\nH-7,0.70\nH-8,0.95\n');
      await page.getByRole('button', { name: 'Save the set' }).click();
      await page.getByText(/Saved “Harrowgate magnetic masses/).waitFor({ timeout: 20_000 });

      expect(runPath).not.toBe('');
      await page.goto(runPath);
      await page.getByTestId('scorecard-combined').waitFor({ timeout: 60_000 });
      await chooseOption(page.getByLabel('Constraint set'), 'Harrowgate magnetic masses');
      const line = await lineText(page, 'Masses of magnetic white dwarfs');
      expect(line).toMatch(/\d+(\.\d+)?σ/);
      expect(line).toMatch(/p = /);
      await page.getByText(/observed over predicted/).first().waitFor({ timeout: 30_000 });
      await stack.screenshot(page, 'observer-mass-test');
    } finally {
      await context.close();
    }
  }, 120_000);

  it('answers the two-sample example: 149 of 1500 against 0 of 1200 at 13.2σ', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/two-sample');
      await page.getByLabel('A: magnetic white dwarfs').fill('149');
      await page.getByLabel('A: white dwarfs in total').fill('1500');
      await page.getByLabel('B: magnetic white dwarfs').fill('0');
      await page.getByLabel('B: white dwarfs in total').fill('1200');
      await page.getByRole('button', { name: 'Test' }).click();
      const result = page.getByTestId('two-sample-result');
      await result.waitFor({ timeout: 20_000 });
      const text = (await result.textContent()) ?? '';
      // scipy.stats.fisher_exact: p = 5.687e-40, 13.23σ.
      expect(text).toMatch(/cannot share one magnetic fraction/);
      expect(text).toMatch(/13\.2σ/);
      expect(text).toMatch(/5\.7 × 10⁻⁴⁰/);
      await stack.screenshot(page, 'observer-two-sample');
    } finally {
      await context.close();
    }
  });
});
