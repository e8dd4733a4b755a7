/**
 * The demo admin buys a credit pack in the browser: Credits page → the payment stand-in's
 * hosted page → the success card → back on the Credits page with the balance raised once.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakesOnFreePorts, type FakesOnFreePorts } from '../../server/fakes/local-fakes.ts';
import { findFreePort } from '../../scripts/mariadb.ts';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';
import { TEST_STRIPE_SECRETS } from '../support/test-app.ts';

let stack: BrowserStack;
let fakes: FakesOnFreePorts;

beforeAll(async () => {
  fakes = await startFakesOnFreePorts(TEST_STRIPE_SECRETS);
  // A fixed port, so that the payment page's way back (built from PUBLIC_URL) leads here.
  const port = await findFreePort();
  stack = await startBrowserStack({ ...fakes.config, PORT: port, PUBLIC_URL: `http://127.0.0.1:${port}` });
  fakes.payment.setWebhookUrl(`${stack.baseUrl}/api/billing/webhook`);
});
afterAll(async () => {
  await stack?.stop();
  await fakes?.close();
});

describe('credits', () => {
  it('the admin buys a pack through the stand-in checkout and sees the balance and the receipt', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'admin');
      await page.goto('/credits');
      await expect.poll(() => page.getByTestId('credit-balance').textContent()).toBe('0 credits');
      await page.getByRole('button', { name: /Buy 500/ }).click();

      await page.waitForURL((url) => url.origin === fakes.payment.url);
      await page.getByRole('button', { name: /success card/ }).click();

      await page.waitForURL((url) => url.origin === stack.baseUrl && url.pathname === '/credits');
      await page.getByText(/Payment received: 500 credits added/).waitFor({ timeout: 15_000 });
      await expect.poll(() => page.getByTestId('credit-balance').textContent()).toBe('500 credits');
      await page.getByRole('region', { name: 'Receipts' }).getByText(/^TF-/).waitFor();
      await stack.screenshot(page, 'admin-credits');

      const balance = await (await page.request.get('/api/billing/balance')).json();
      expect(balance.credits).toBe(500);
      const receipt = await fakes.mail.waitFor((m) => m.to.includes('admin@harrowgate.example') && m.subject.startsWith('Receipt'));
      expect(receipt.text).toContain('500');

      // The outbox page shows the receipt to the admin.
      await page.goto('/outbox');
      await page.getByText(receipt.subject).first().waitFor();
    } finally {
      await context.close();
    }
  });
});
