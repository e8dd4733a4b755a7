/**
 * What a new modeller, observer and user of Settings see: a sweep's errors at their fields,
 * a sweep point that names its values and runs again, one e-mail per sweep, an observer's
 * tables, run size and sample test, the Settings page, and no charting-library warnings.
 */
import type { ConsoleMessage, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chooseOption, startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

/** The text of everything an input's aria-describedby points at (its hint and its error). */
async function describedText(input: Locator): Promise<string> {
  const ids = ((await input.getAttribute('aria-describedby')) ?? '').split(/\s+/).filter(Boolean);
  const texts = await Promise.all(ids.map((id) => input.page().locator(`[id="${id}"]`).textContent()));
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

let pointRunId = '';
let rerunId = '';

describe('modeller: a sweep from first try to a point run again', () => {
  it('shows every sweep-form error at its field at once, then runs the sweep; one e-mail for it', { timeout: 300_000 }, async () => {
    const { page, context } = await stack.newPage();
    const problems = consoleProblems(page);
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/sweeps');
      const form = page.getByRole('form', { name: 'New sweep' });
      await chooseOption(form.getByLabel('Scenario'), 'Baseline, fixed engulfment reach');
      await form.getByLabel('Parameter', { exact: true }).selectOption('companions.multiplier');
      const start = form.getByLabel('Start', { exact: true });
      const stop = form.getByLabel('Stop', { exact: true });
      const count = form.getByLabel('Number of values');
      await start.fill('-1');
      await stop.fill('5000');
      await count.fill('40');
      await form.getByRole('button', { name: 'Start the sweep' }).click();
      // All three problems at once, each described at its own input.
      await expect.poll(() => describedText(start)).toMatch(/Start must be from 0 to 1000 \(got -1\)/);
      expect(await describedText(stop)).toMatch(/Stop must be from 0 to 1000 \(got 5000\)/);
      expect(await describedText(count)).toMatch(/whole number from 2 to 25 \(got 40\)/);
      expect(await describedText(start)).not.toMatch(/number of values/);
      await stack.screenshot(page, 'sweep-form-errors-at-fields');

      await start.fill('1');
      await stop.fill('2');
      await count.fill('2');
      await form.getByLabel('Systems per point').fill('20000');
      await form.getByLabel('Name').fill('Browser multiplier sweep');
      await form.getByRole('button', { name: 'Start the sweep' }).click();
      await page.waitForURL(/\/sweeps\/[A-Za-z0-9_-]{8,}$/);
      await page.getByText(/2 of 2 points/).first().waitFor({ timeout: 180_000 });
      await page.locator('figure svg').first().waitFor({ timeout: 30_000 });
      await stack.screenshot(page, 'sweep-finished');

      const href = await page.locator('a[href^="/runs/"]').last().getAttribute('href');
      expect(href).toMatch(/^\/runs\//);
      pointRunId = href!.split('/').pop()!;
      expect(problems.filter((p) => /vega|WARN|scale|encoding|mark/i.test(p))).toEqual([]);
    } finally {
      await context.close();
    }

    // The admin's outbox: exactly one e-mail for the sweep, none per point.
    const admin = await stack.newPage();
    try {
      await stack.signIn(admin.page, 'admin');
      await admin.page.goto('/outbox');
      await expect.poll(async () => admin.page.getByText('Sweep finished: Browser multiplier sweep', { exact: true }).count(), { timeout: 30_000 }).toBe(1);
      expect(await admin.page.getByText(/^Run finished: Baseline, fixed engulfment reach/).count()).toBe(0);
      await stack.screenshot(admin.page, 'outbox-one-sweep-email');
    } finally {
      await admin.context.close();
    }
  });

  it("shows a point's values, its sweep, its own methods text, and runs the point again", { timeout: 240_000 }, async () => {
    expect(pointRunId).not.toBe('');
    const { page, context } = await stack.newPage();
    const problems = consoleProblems(page);
    try {
      await stack.signIn(page, 'modeller');
      await page.goto(`/runs/${pointRunId}`);
      const title = page.getByRole('heading', { level: 1 });
      await expect.poll(() => title.textContent(), { timeout: 30_000 }).toMatch(/Baseline, fixed engulfment reach · Occurrence multiplier = 2/);
      await page.getByRole('link', { name: /Sweep “Browser multiplier sweep”/ }).waitFor();
      const methods = page.getByRole('region', { name: 'Methods paragraph text' });
      await expect.poll(() => methods.textContent(), { timeout: 60_000 }).toMatch(/grid point 2 of 2 .*Occurrence multiplier = 2/);
      await page.locator('figure svg').first().waitFor({ timeout: 30_000 });
      await stack.screenshot(page, 'sweep-point-run');
      expect(problems.filter((p) => /vega|WARN|scale|encoding|mark/i.test(p))).toEqual([]);

      await page.getByRole('link', { name: 'Run this point again' }).click();
      await page.waitForURL(/\/runs\/new\?again=/);
      const again = page.getByRole('form', { name: 'Run again' });
      await again.getByText(/Point 2 of 2 of the sweep/).waitFor();
      expect(await again.textContent()).toMatch(/Occurrence multiplier = 2/);
      await again.getByLabel('Seed').fill('again, by hand');
      await again.getByRole('button', { name: 'Run this point again' }).click();
      await page.waitForURL((url) => /^\/runs\/[A-Za-z0-9_-]{8,}$/.test(url.pathname) && !url.pathname.endsWith(pointRunId));
      rerunId = page.url().split('/').pop()!;
      await expect.poll(() => title.textContent(), { timeout: 30_000 }).toMatch(/Occurrence multiplier = 2/);
      await page.getByRole('link', { name: 'Download CSV' }).waitFor({ timeout: 120_000 });
      await stack.screenshot(page, 'sweep-point-run-again');
    } finally {
      await context.close();
    }
  });
});

describe('observer', () => {
  it('is told the truth on the Overview and uploads an occurrence table of their own', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/');
      const abilities = page.getByRole('region', { name: 'What you can do here' });
      await abilities.getByText(/Upload your own occurrence tables/).waitFor();
      expect(await abilities.getByRole('link', { name: 'Samples' }).count()).toBe(1);
      await page.getByRole('region', { name: 'Your recent runs' }).waitFor();
      await stack.screenshot(page, 'observer-overview');

      await page.goto('/occurrence-tables');
      await page.getByLabel('Name of the empty table').fill('My own survey table');
      await page.getByRole('button', { name: 'Create and edit it' }).click();
      await page.waitForURL(/\/occurrence-tables\/[A-Za-z0-9_-]{8,}$/);
      await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('My own survey table');
      await page.getByRole('button', { name: /Delete/ }).first().waitFor();

      // A row added and saved with a host-mass slope keeps it (a CSV has no column for it).
      await page.getByRole('button', { name: 'Add a row' }).click();
      await page.getByRole('button', { name: 'Save the rows' }).click();
      const occurrence = page.getByLabel('Occurrence, row 1');
      await expect.poll(() => describedText(occurrence)).toMatch(/Is required/);
      expect(await page.getByText('Some rows have problems; they are marked in the table. Nothing was saved.').count()).toBe(1);
      await occurrence.fill('0.08');
      await page.getByLabel('Host-mass slope s, row 1').fill('1');
      await page.getByRole('button', { name: 'Save the rows' }).click();
      await page.getByText('Saved.', { exact: true }).waitFor();
      await page.reload();
      await expect.poll(() => page.getByLabel('Host-mass slope s, row 1').inputValue()).toBe('1');
      expect(await page.getByLabel('Occurrence, row 1').inputValue()).toBe('0.08');
      await stack.screenshot(page, 'observer-own-table');
    } finally {
      await context.close();
    }
  });

  it("pre-fills a run within the observer's cap, and says so at the field and in the cost box", { timeout: 60_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/runs/new');
      const runForm = page.getByRole('form', { name: 'Start a run' });
      await chooseOption(runForm.getByLabel('Scenario'), 'Baseline, fixed engulfment reach');
      const systems = runForm.getByLabel('Systems');
      // The scenario asks for 10^7; an observer may start 10^6.
      await expect.poll(() => systems.inputValue(), { timeout: 20_000 }).toBe('1000000');
      expect(await describedText(systems)).toMatch(/1,000 to 1,000,000, the most an observer may start/);
      const cost = page.getByRole('region', { name: 'Cost' });
      expect(await cost.textContent()).toMatch(/up to 1,000,000 systems/);
      await systems.fill('5000000');
      // Checked at the field before anything is sent.
      await expect.poll(() => describedText(systems)).toMatch(/Observers may start runs of at most 1,000,000 systems \(this one has 5,000,000\)/);
      await expect.poll(() => cost.textContent()).toMatch(/above your limit of 1,000,000/);
      await stack.screenshot(page, 'observer-run-cap');
    } finally {
      await context.close();
    }
  });

  it("tests a sample against a chosen run from the sample's page", { timeout: 120_000 }, async () => {
    expect(rerunId).not.toBe('');
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/samples');
      await page.getByRole('link', { name: 'Harrowgate 40 pc pilot survey (illustrative)', exact: true }).first().waitFor();
      await stack.screenshot(page, 'samples-list');
      // Every sample row links to its test.
      expect(await page.getByRole('link', { name: /^Test against a run/ }).count()).toBeGreaterThanOrEqual(2);
      await page.getByRole('link', { name: /^Test against a run/ }).first().click();
      await page.waitForURL(/\/samples\/[A-Za-z0-9_-]{8,}#test$/);
      const card = page.getByRole('region', { name: 'Test against a run' });
      await card.waitFor();
      await chooseOption(card.getByLabel('Run'), 'Occurrence multiplier = 2');
      await card.getByText(/Exact binomial test/).waitFor({ timeout: 30_000 });
      expect(await card.textContent()).toMatch(/Observed.*magnetic/);
      await stack.screenshot(page, 'sample-test-against-run');
    } finally {
      await context.close();
    }
  });
});

describe('settings', () => {
  it('changes the name, refuses a wrong current password at its field, lists sessions and signs out everywhere', { timeout: 60_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/settings');
      const nameForm = page.getByRole('form', { name: 'Change your name' });
      await nameForm.getByLabel('Name').fill('Ivo Marchetti (renamed)');
      await nameForm.getByRole('button', { name: 'Save the name' }).click();
      await nameForm.getByText('Your name is now Ivo Marchetti (renamed).').waitFor();

      const password = page.getByRole('form', { name: 'Change your password' });
      const current = password.getByLabel('Current password');
      await current.fill('not the password');
      await password.getByLabel('New password').fill('a brand new password');
      await password.getByRole('button', { name: 'Change the password' }).click();
      await expect.poll(() => describedText(current)).toMatch(/not the password you sign in with/);

      const email = page.getByRole('form', { name: 'Change your e-mail address' });
      await email.getByLabel('New e-mail address').fill('ivo.new@harrowgate.example');
      await email.getByLabel('Current password').fill('tidefield-demo');
      await email.getByRole('button', { name: 'Send the confirmation link' }).click();
      await email.getByText(/A link to confirm ivo.new@harrowgate.example is on its way/).waitFor();

      const sessions = page.getByRole('list', { name: 'Sessions' });
      await sessions.getByText('This browser').waitFor();
      await page.getByRole('region', { name: 'E-mail notices' }).waitFor();
      await stack.screenshot(page, 'settings');

      await page.getByRole('button', { name: 'Sign out everywhere' }).first().click();
      await page.getByRole('dialog').getByRole('button', { name: 'Sign out everywhere' }).click();
      await page.waitForURL(/\/sign-in/, { timeout: 20_000 });
    } finally {
      await context.close();
    }
  });
});

describe('charts', () => {
  it('logs no charting-library warnings on the compare page', { timeout: 120_000 }, async () => {
    expect(rerunId).not.toBe('');
    const { page, context } = await stack.newPage();
    const problems = consoleProblems(page);
    try {
      await stack.signIn(page, 'modeller');
      await page.goto(`/compare?runs=${pointRunId},${rerunId}`);
      await page.locator('figure svg').first().waitFor({ timeout: 60_000 });
      await page.waitForTimeout(1000);
      await stack.screenshot(page, 'compare-no-warnings');
      expect(problems.filter((p) => /vega|WARN|scale|encoding|mark/i.test(p))).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
