/**
 * Keys typed while another example opens on the New scenario page were dropped without a sign:
 * the router renders the next builder in a transition, the unchanged old one stayed on screen and
 * took input, and the new one replaced it with what was typed. Now the old builder takes no input
 * while the switch is pending and says what is opening; a switch the user cancels changes nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

const EXAMPLE = 'Baseline, fixed engulfment reach';

declare global {
  interface Window {
    /** The name field of the builder shown before the switch, kept to read what reached it. */
    oldNameField?: HTMLInputElement;
    /** The "Opening …" status on the page at each key press (null: none shown). */
    statusAtKeys?: (string | null)[];
  }
}

describe('new scenario, switching examples', () => {
  it(
    'does not silently drop keys typed into the builder while another example opens',
    { timeout: 120_000 },
    async () => {
      // Tall enough to show the examples and the name field at once, so the click below needs no scrolling.
      const { page, context } = await stack.newPage({ width: 1280, height: 1200 });
      try {
        await stack.signIn(page, 'modeller');
        await page.goto('/scenarios/new');
        const name = page.getByLabel('Scenario name');
        await name.waitFor({ timeout: 20_000 });
        const box = (await name.boundingBox())!;
        await name.evaluate((field: HTMLInputElement) => {
          window.oldNameField = field;
          window.statusAtKeys = [];
          window.addEventListener(
            'keydown',
            () => {
              const statuses = [...document.querySelectorAll('[role="status"]')].map(
                (s) => s.textContent?.trim() ?? '',
              );
              window.statusAtKeys!.push(statuses.find((s) => s.startsWith('Opening')) ?? null);
            },
            { capture: true },
          );
        });
        // The switch takes 0.1–0.5 s on this machine, depending on its load; a CPU six times slower
        // (a busy laptop) makes it reliably longer than the click and the keys below take.
        const cdp = await context.newCDPSession(page);
        await cdp.send('Emulation.setCPUThrottlingRate', { rate: 6 });

        // The user chooses the example, then at once clicks where the name field is and types.
        await page
          .getByRole('navigation', { name: 'Start from' })
          .getByRole('link', { name: new RegExp(EXAMPLE) })
          .click();
        await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
        const typed = 'My first keys';
        await page.keyboard.type(typed);

        await page.getByText(`Started from the example “${EXAMPLE}”`).waitFor({ timeout: 30_000 });
        await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
        const kept = await name.inputValue();
        const reachedOld = await page.evaluate(() => window.oldNameField!.value);
        const statusAtKeys = await page.evaluate(() => window.statusAtKeys!);
        // Either the keys are in the new builder, or they were refused while the page said why.
        if (kept !== typed) {
          expect(reachedOld, 'typed into the builder that was then replaced').toBe('');
          expect(statusAtKeys).toEqual([...typed].map(() => `Opening the example “${EXAMPLE}”…`));
        }

        // The new builder takes input as usual; nothing is left busy.
        expect(await page.getByText(/^Opening the example/).count()).toBe(0);
        expect(await page.locator('[inert], [aria-busy="true"]').count()).toBe(0);
        await name.fill('Typed after the switch');
        expect(await name.inputValue()).toBe('Typed after the switch');
        await stack.screenshot(page, 'new-scenario-after-switch');
      } finally {
        await context.close();
      }
    },
  );

  it('leaves the builder and its changes as they were when the switch is cancelled', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'modeller');
      await page.goto('/scenarios/new');
      const name = page.getByLabel('Scenario name');
      await name.fill('My own start');
      await page
        .getByRole('navigation', { name: 'Start from' })
        .getByRole('link', { name: new RegExp(EXAMPLE) })
        .click();
      const dialog = page.getByRole('dialog', { name: 'Leave without saving?' });
      await dialog.waitFor({ timeout: 10_000 });
      await dialog.getByRole('button', { name: 'Stay on the page' }).click();
      await dialog.waitFor({ state: 'hidden' });

      expect(await page.getByText(/^Opening the example/).count()).toBe(0);
      expect(await page.locator('[inert], [aria-busy="true"]').count()).toBe(0);
      expect(await name.inputValue()).toBe('My own start');
      await name.fill('My own start, still mine', { timeout: 5_000 });
      expect(await name.inputValue()).toBe('My own start, still mine');
      expect(new URL(page.url()).search).toBe('');
    } finally {
      await context.close();
    }
  });
});
