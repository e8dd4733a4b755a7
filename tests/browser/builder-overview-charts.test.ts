/**
 * What a modeller sees in the scenario builder (every problem at once in plain words, Save
 * held back with its reason, unreadable JSON said as such), on the Overview of a department
 * with no runs yet and after one, and on a run page at phone width (log-axis labels apart, no
 * charting-library warnings).
 */
import type { ConsoleMessage, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

/** The text of everything an element's aria-describedby points at. */
async function describedText(element: Locator): Promise<string> {
  const ids = ((await element.getAttribute('aria-describedby')) ?? '').split(/\s+/).filter(Boolean);
  const texts = await Promise.all(ids.map((id) => element.page().locator(`[id="${id}"]`).textContent()));
  return texts.join(' ');
}

/** Console warnings and errors of the page (vega logs its own as console warnings). */
function consoleProblems(page: Page): string[] {
  const seen: string[] = [];
  page.on('console', (message: ConsoleMessage) => {
    if (message.type() === 'warning' || message.type() === 'error') seen.push(`${message.type()}: ${message.text()}`);
  });
  return seen;
}

let runId = '';

describe('scenario builder', () => {
  it('lists every problem at once in plain words and keeps Save disabled, saying why', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios/new?preset=baseline-fixed-reach');
      const name = page.getByLabel('Scenario name');
      // The example's name is not taken over silently: the field is empty and says where the scenario started.
      await expect.poll(() => describedText(name), { timeout: 20_000 }).toMatch(/Started from the example “Baseline, fixed engulfment reach”/);
      expect(await name.inputValue()).toBe('');
      expect(await page.getByLabel('Title', { exact: true }).count()).toBe(0);

      await page.getByLabel('Efficiency α_CE').fill('50');
      await page.getByLabel('Age of the population').fill('20');
      // A reversed range, found although other values are out of range too.
      await page.getByLabel('Initial masses drawn, From', { exact: true }).fill('5');
      await page.getByLabel('Initial masses drawn, To', { exact: true }).fill('2');

      const check = page.getByRole('region', { name: /^Check/ });
      await expect.poll(() => check.getByRole('heading').textContent()).toBe('Check: 4 problems');
      const items = (await check.getByRole('listitem').allTextContents()).map((t) => t.trim());
      expect(items).toEqual(
        expect.arrayContaining([
          'Scenario name: needs a name',
          'Efficiency α_CE: must be between 0.01 and 10 (got 50)',
          'Age of the population: must be between 0.01 and 13.8 (got 20)',
          'Initial masses drawn: must be a range [low, high] with low below high (got [5, 2])',
        ]),
      );
      // No schema path in what the user reads (common practice: labels, not code names).
      for (const item of items) expect(item).not.toMatch(/[a-z]\.[a-z]|\[\d\]|Msun\b|Gyr\b/i);

      const save = page.getByRole('button', { name: 'Save scenario' });
      expect(await save.isDisabled()).toBe(true);
      expect(await describedText(save)).toBe('Saving waits until the 4 problems under Check are fixed.');
      // Each problem is also at its own input.
      expect(await describedText(page.getByLabel('Efficiency α_CE'))).toMatch(/between 0\.01 and 10 \(got 50\)/);
      await stack.screenshot(page, 'builder-all-problems-plain-words');

      await page.getByLabel('Efficiency α_CE').fill('0.5');
      await page.getByLabel('Age of the population').fill('10');
      await page.getByLabel('Initial masses drawn, From', { exact: true }).fill('0.8');
      await page.getByLabel('Initial masses drawn, To', { exact: true }).fill('8');
      await name.fill('Builder test, α_CE 0.5');
      await expect.poll(() => check.getByRole('heading').textContent()).toBe('Check: no problems');
      expect(await save.isDisabled()).toBe(false);
      await save.click();
      await page.waitForURL(/\/scenarios\/[A-Za-z0-9_-]{8,}$/, { timeout: 20_000 });
    } finally {
      await context.close();
    }
  });

  it('says once that unreadable JSON cannot be read, and shows it as unsaved', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios/new?preset=baseline-fixed-reach');
      await page.getByLabel('Scenario name').fill('JSON test');
      await page.getByRole('button', { name: 'JSON', exact: true }).click();
      await page.getByLabel('Scenario document (JSON)').fill('{ "seed": ');
      const check = page.getByRole('region', { name: /^Check/ });
      await expect.poll(() => check.getByRole('heading').textContent()).toBe('Check: the JSON cannot be read');
      expect(await page.getByText(/^The JSON cannot be read:/).count()).toBe(1);
      expect(await page.getByText('Check: no problems').count()).toBe(0);
      expect(await page.getByText('Unsaved changes', { exact: true }).isVisible()).toBe(true);
      const save = page.getByRole('button', { name: 'Save scenario' });
      expect(await save.isDisabled()).toBe(true);
      expect(await describedText(save)).toBe('Saving waits until the JSON text can be read.');
      await stack.screenshot(page, 'builder-unreadable-json');
    } finally {
      await context.close();
    }
  });

  it('edits the inline companion rows in the shared row editor: plain words at the cell, rows moved, no crash on text in a number cell', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios/new?preset=baseline-fixed-reach');
      await page.getByLabel('Scenario name').fill('Rows test');
      const rows = page.getByRole('region', { name: /rows of at most 32/ });
      await expect.poll(() => page.getByLabel('Label, row 2').inputValue(), { timeout: 20_000 }).toMatch(/^Giant planets, 2000/);

      // Text in a number cell is named as such at the cell; the page keeps working.
      const periodFrom = page.getByLabel('Period from, row 2');
      await periodFrom.fill('abc');
      await expect.poll(() => describedText(periodFrom)).toMatch(/Must be a number \(got "abc"\)/);
      const check = page.getByRole('region', { name: /^Check/ });
      await expect.poll(() => check.getByRole('heading').textContent()).toBe('Check: 1 problem');
      await periodFrom.fill('2000');
      // A probability lies between 0 and 1 (common practice, no source).
      const occurrence = page.getByLabel('Occurrence, row 1');
      await occurrence.fill('1.5');
      await expect.poll(() => describedText(occurrence)).toMatch(/Must be between 0 and 1 \(got 1\.5\)/);
      await occurrence.fill('0.105');
      await expect.poll(() => check.getByRole('heading').textContent()).toBe('Check: no problems');

      // Row 1 moved down: the document's rows follow.
      await rows.getByRole('button', { name: 'Move down row 1' }).click();
      await expect.poll(() => page.getByLabel('Label, row 1').inputValue()).toMatch(/^Giant planets, 2000/);
      expect(await page.getByLabel('Label, row 2').inputValue()).toMatch(/^Giant planets, 2–2000/);
      expect(await rows.getByRole('button', { name: 'Move up row 1' }).isDisabled()).toBe(true);
      await stack.screenshot(page, 'builder-companion-rows');
      await page.getByRole('button', { name: 'JSON', exact: true }).click();
      const json = JSON.parse(await page.getByLabel('Scenario document (JSON)').inputValue());
      expect(json.companions.rows.map((r: { label: string }) => r.label.slice(0, 18))).toEqual(['Giant planets, 200', 'Giant planets, 2–2', expect.any(String), expect.any(String)]);
    } finally {
      await context.close();
    }
  });
});

describe('overview', () => {
  it('asks before another example replaces a builder with unsaved changes, keeps them on "Stay", and does not ask without changes', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios/new');
      const examples = page.getByRole('navigation', { name: 'Start from' });
      const example = examples.getByRole('link', { name: /Baseline, fixed engulfment reach/ });
      await page.getByLabel('Scenario name').fill('My own start');
      await example.click();
      const dialog = page.getByRole('dialog', { name: 'Leave without saving?' });
      await dialog.waitFor({ timeout: 10_000 });
      await dialog.getByRole('button', { name: 'Stay on the page' }).click();
      await dialog.waitFor({ state: 'hidden' });
      expect(new URL(page.url()).search).toBe('');
      expect(await page.getByLabel('Scenario name').inputValue()).toBe('My own start');

      await example.click();
      await dialog.getByRole('button', { name: 'Leave and lose the changes' }).click();
      await page.getByText('Started from the example “Baseline, fixed engulfment reach”').waitFor({ timeout: 30_000 });
      expect(new URL(page.url()).searchParams.get('preset')).toBe('baseline-fixed-reach');
      expect(await page.getByLabel('Scenario name').inputValue()).toBe('');

      // Nothing changed in the example's builder: going back to the blank one does not ask.
      await examples.getByRole('link', { name: /^Blank/ }).click();
      await page.waitForURL((url) => url.pathname === '/scenarios/new' && url.search === '');
      await expect.poll(() => page.getByText('Started from the example').count(), { timeout: 30_000 }).toBe(0);
      expect(await dialog.isVisible()).toBe(false);
    } finally {
      await context.close();
    }
  });

  it('offers a start to a department with no runs, then lists the run with its status and link', { timeout: 240_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/');
      const start = page.getByRole('region', { name: 'Start here' });
      await start.waitFor({ timeout: 20_000 });
      expect(await start.getByRole('link', { name: 'Start a run' }).isVisible()).toBe(true);
      expect(await page.getByRole('region', { name: 'Your recent runs' }).textContent()).toMatch(/You have not started a run yet/);
      // Fits: listed where the server offers them, left out quietly where it does not (no error on the page).
      const fits = await page.request.get('/api/fits');
      if (fits.status() === 404) expect(await page.getByRole('heading', { name: 'Recent fits' }).count()).toBe(0);
      else await page.getByRole('heading', { name: 'Recent fits' }).waitFor();
      expect(await page.getByRole('alert').count()).toBe(0);
      await stack.screenshot(page, 'overview-start-here');

      await start.getByRole('link', { name: 'Start a run' }).click();
      await page.waitForURL(/\/runs\/new/);
      const runForm = page.getByRole('form', { name: 'Start a run' });
      await runForm.getByLabel('Scenario').selectOption({ index: 1 });
      const systems = runForm.getByLabel('Systems');
      await expect.poll(() => systems.inputValue(), { timeout: 20_000 }).not.toBe('');
      await systems.fill('50000');
      await runForm.getByRole('button', { name: 'Start the run' }).click();
      await page.waitForURL(/\/runs\/[A-Za-z0-9_-]{8,}$/);
      runId = new URL(page.url()).pathname.split('/').pop()!;
      await page.getByRole('link', { name: 'Download CSV' }).waitFor({ timeout: 120_000 });

      await page.goto('/');
      const recent = page.getByRole('region', { name: 'Your recent runs' });
      const link = recent.locator(`a[href="/runs/${runId}"]`);
      await link.waitFor({ timeout: 20_000 });
      expect(await recent.textContent()).toMatch(/Finished/);
      // The department now has a scenario, a run and a sample: the start is no longer offered.
      await expect.poll(() => page.getByRole('region', { name: 'Start here' }).count()).toBe(0);
      await stack.screenshot(page, 'overview-recent-work');
    } finally {
      await context.close();
    }
  });
});

describe('charts on a phone', () => {
  it('draws the run page at 390 px with log-axis labels apart and no charting-library warnings', { timeout: 120_000 }, async () => {
    expect(runId).not.toBe('');
    const { page, context } = await stack.newPage({ width: 390, height: 844 });
    const problems = consoleProblems(page);
    try {
      await stack.signIn(page, 'modeller');
      await page.goto(`/runs/${runId}`);
      await expect.poll(() => page.locator('figure svg').count(), { timeout: 60_000 }).toBeGreaterThanOrEqual(4);
      await page.waitForTimeout(1000);
      // Every visible axis label of every chart: no two on one axis overlap.
      const overlaps = await page.evaluate(() => {
        const found: string[] = [];
        for (const axis of document.querySelectorAll('figure svg g.role-axis-label')) {
          const boxes = [...axis.querySelectorAll('text')]
            .filter((t) => (t.textContent ?? '') !== '' && Number(t.getAttribute('opacity') ?? '1') > 0 && getComputedStyle(t).opacity !== '0')
            .map((t) => ({ text: t.textContent ?? '', box: t.getBoundingClientRect() }));
          for (let i = 0; i < boxes.length; i++)
            for (let j = i + 1; j < boxes.length; j++) {
              const a = boxes[i].box;
              const b = boxes[j].box;
              if (a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom) found.push(`${boxes[i].text} / ${boxes[j].text}`);
            }
        }
        return found;
      });
      expect(overlaps).toEqual([]);
      // No "0k" on a count axis, and no plain 10000 on an axis that also writes powers of ten.
      const labels = await page.locator('figure svg g.role-axis-label text').allTextContents();
      expect(labels).not.toContain('0k');
      await stack.screenshot(page, 'run-page-phone');
      expect(problems.filter((p) => /vega|WARN|scale|encoding|mark/i.test(p))).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
