/**
 * Cancelling from the browser: the demo admin starts a fit on the Fits page and cancels it while
 * it computes; the demo observer cancels their own implied-occurrence question; the admin cancels a
 * sweep from its page. Each time the
 * confirmation names the credits that come back, the page then says "Cancelled" with no posterior,
 * and the balance the Credits page shows, the ledger and the server's own answers agree: the whole
 * reservation was refunded once. No free allowance here, so every system costs credit.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { chooseOption, fillFitForm, startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
const START_CREDITS = 50;
beforeAll(async () => {
  stack = await startBrowserStack({ FREE_SYSTEMS_PER_MONTH: 0 });
}, 240_000);
afterAll(() => stack?.stop());

type Entry = { runId: string | null; kind: string; credits: number; description: string };
const json = async (page: Page, url: string) => {
  const res = await page.request.get(url);
  expect(res.status(), url).toBe(200);
  return res.json();
};

/** The Credits page's balance, and the server's balance and ledger entries of one run (the admin's view). */
async function creditsSeen(page: Page, runId: string) {
  await page.goto('/credits');
  const balance = await json(page, '/api/billing/balance');
  await expect
    .poll(() => page.getByTestId('credit-balance').textContent(), { timeout: 20_000 })
    .toBe(`${balance.credits} credits`);
  const entries: Entry[] = (await json(page, '/api/billing/ledger?pageSize=100')).entries.filter(
    (e: Entry) => e.runId === runId,
  );
  return {
    balance,
    entries: entries.map((e) => [e.kind, e.credits]).sort(),
    refund: entries.find((e) => e.kind === 'refund'),
  };
}

describe('cancelling', () => {
  it('the admin cancels a running fit: cancelled state, no posterior, the reservation back once', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'admin');
      const me = await json(page, '/api/me');
      await stack.server.tidefield.billing.adjust({
        departmentId: me.department.id,
        credits: START_CREDITS,
        reason: 'credit for the cancel browser test',
      });

      const form = await fillFitForm(page, {
        scenario: 'Baseline, fixed engulfment reach',
        constraintSet: 'library',
        systems: 20_000_000,
        parameters: [{ path: 'envelope.alpha', from: 0.1, to: 1, points: 3 }],
      });
      // 3 × 2×10^7 = 6×10^7 systems at one credit per 10^7 systems (the price list) = 6 credits.
      await expect
        .poll(() => page.getByTestId('fit-cost').textContent(), { timeout: 20_000 })
        .toMatch(
          /3 grid points × 20,000,000 systems, reserved at once as 60,000,000 systems \(at list price 6 credits\)/,
        );
      await form.getByRole('button', { name: 'Start the fit' }).click();
      await page.waitForURL(/\/fits\/[A-Za-z0-9_-]{8,}$/);
      const id = new URL(page.url()).pathname.split('/').pop()!;

      // Cancel once the one pass is under way (a chunk done), so that there is work to discard.
      await expect
        .poll(async () => (await json(page, `/api/fits/${id}`)).chunksDone, { timeout: 120_000, interval: 250 })
        .toBeGreaterThan(0);
      const reserved = await json(page, '/api/billing/balance');
      expect(reserved).toMatchObject({ credits: START_CREDITS - 6, reservedCredits: 6 });

      await page.getByRole('button', { name: 'Cancel the fit' }).click();
      const dialog = page.getByRole('dialog', { name: 'Cancel the fit?' });
      await dialog.waitFor();
      const warning = await dialog.textContent();
      expect(warning).toContain(
        'Its whole reservation is given back, also for any chunks already computed: the 6 credits reserved for it',
      );
      expect(warning).toContain('cannot be resumed');
      await stack.screenshot(page, 'fit-cancel-confirm');
      await dialog.getByRole('button', { name: 'Cancel the fit' }).click();

      const cancelled = page.getByTestId('fit-cancelled');
      await cancelled.waitFor({ timeout: 60_000 });
      const fit = await json(page, `/api/fits/${id}`);
      expect(fit).toMatchObject({ status: 'cancelled', posterior: null, methods: null, costCredits: 6 });
      expect(fit.chunksDone).toBeGreaterThan(0);
      // The words follow the server's counts; nothing of a posterior is on the page.
      expect(await cancelled.textContent()).toMatch(
        new RegExp(`^Cancelled [^,]+, [^,]+ UTC, after ${fit.chunksDone} of ${fit.chunkCount} chunks of its one pass`),
      );
      expect(await cancelled.textContent()).toContain('the 6 credits reserved for it');
      expect(await page.getByTestId('fit-intervals').count()).toBe(0);
      expect(await page.getByTestId('fit-sentence').count()).toBe(0);
      expect(await page.getByRole('button', { name: 'Cancel the fit' }).count()).toBe(0);
      await stack.screenshot(page, 'fit-cancelled');

      // The Credits page shows the balance the server holds, and the ledger has one reservation and one refund.
      const seen = await creditsSeen(page, fit.runId);
      expect(seen.balance).toMatchObject({ credits: START_CREDITS, reservedCredits: 0 });
      expect(seen.entries).toEqual([
        ['refund', 6],
        ['reservation', -6],
      ]);
      await page.getByRole('rowheader', { name: seen.refund!.description }).first().waitFor({ timeout: 20_000 });
      await stack.screenshot(page, 'fit-cancel-credits');
    } finally {
      await context.close();
    }
  }, 300_000);

  it('the observer cancels their own implied-occurrence question while it computes', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      const before = (await json(page, '/api/billing/balance')).credits;
      await page.goto('/implied-occurrence');
      await chooseOption(page.getByLabel('Scenario'), 'Baseline, fixed engulfment reach');
      await chooseOption(page.getByLabel('Observed sample'), 'Harrowgate 40 pc pilot survey (illustrative)');
      // The observer's cap, 10^6 systems per value of m: 129 values → 1.29×10^8 systems → 13 credits (rounded up).
      await page.getByLabel('Systems').fill('1000000');
      await page.getByRole('button', { name: 'Find the implied occurrence' }).click();
      await page.waitForURL(/fit=/);
      const fitId = new URL(page.url()).searchParams.get('fit')!;

      await page.getByRole('button', { name: 'Cancel the question' }).click();
      const dialog = page.getByRole('dialog', { name: 'Cancel the question?' });
      await dialog.waitFor();
      expect(await dialog.textContent()).toContain('the 13 credits reserved for it');
      await dialog.getByRole('button', { name: 'Cancel the question' }).click();

      const cancelled = page.getByTestId('implied-cancelled');
      await cancelled.waitFor({ timeout: 60_000 });
      expect(await cancelled.textContent()).toMatch(
        /^Cancelled (after [\d.]+% of its one pass, which was discarded|before its first chunk was computed): there is no answer\. Its whole reservation was given back \(13 credits/,
      );
      const answer = await json(page, `/api/implied-occurrence/${fitId}`);
      expect(answer).toMatchObject({ status: 'cancelled', confidence: null, credible: null, costCredits: 13 });
      expect((await json(page, '/api/billing/balance')).credits).toBe(before);
      await stack.screenshot(page, 'implied-cancelled');
    } finally {
      await context.close();
    }
  }, 300_000);

  it('the admin cancels a running sweep from its page: each point’s reservation back, the sweep cancelled', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'admin');
      const before = (await json(page, '/api/billing/balance')).credits;
      const scenario = (await json(page, '/api/scenarios')).scenarios.find(
        (x: { name: string }) => x.name === 'Baseline, fixed engulfment reach',
      );
      // 2 points × 2×10^7 systems, each point its own run: 2 credits each (one credit per 10^7 systems).
      const created = await page.request.post('/api/sweeps', {
        headers: { Origin: stack.baseUrl },
        data: { scenarioId: scenario.id, systems: 20_000_000, axes: [{ path: 'envelope.alpha', values: [0.2, 0.8] }] },
      });
      expect(created.status()).toBe(201);
      const { id } = await created.json();
      await page.goto(`/sweeps/${id}`);
      await page.getByRole('button', { name: 'Cancel the sweep' }).click();
      const dialog = page.getByRole('dialog', { name: 'Cancel the sweep?' });
      await dialog.waitFor();
      expect(await dialog.textContent()).toContain('Each one’s reserved credit is given back in full');
      await dialog.getByRole('button', { name: 'Cancel the remaining points' }).click();
      await page.getByText('Cancelled', { exact: true }).first().waitFor({ timeout: 60_000 });
      const sweep = await json(page, `/api/sweeps/${id}`);
      expect(sweep.status).toBe('cancelled');
      const ledger: Entry[] = (await json(page, '/api/billing/ledger?pageSize=100')).entries;
      for (const point of sweep.points) {
        expect(
          ledger
            .filter((e) => e.runId === point.runId)
            .map((e) => [e.kind, e.credits])
            .sort(),
        ).toEqual([
          ['refund', 2],
          ['reservation', -2],
        ]);
      }
      expect((await json(page, '/api/billing/balance')).credits).toBe(before);
      await stack.screenshot(page, 'sweep-cancelled');
    } finally {
      await context.close();
    }
  }, 300_000);
});
