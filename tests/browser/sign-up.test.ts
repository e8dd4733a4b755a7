/**
 * Sign-up in the browser (issue 9, item 13): the form answers "check your mail" alike for a new
 * address and for one that has an account; the mailed link creates the account and its
 * department and opens the app signed in; the known address gets a note pointing to password reset.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakesOnFreePorts, type FakesOnFreePorts } from '../../server/fakes/local-fakes.ts';
import { DEMO_USERS } from '../../server/seed/demo.ts';
import { findFreePort } from '../../scripts/mariadb.ts';
import { linkToken } from '../support/billing.ts';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';
import { SIGN_UP_SUBJECT, TEST_STRIPE_SECRETS } from '../support/test-app.ts';

let stack: BrowserStack;
let fakes: FakesOnFreePorts;

beforeAll(async () => {
  fakes = await startFakesOnFreePorts(TEST_STRIPE_SECRETS);
  // A fixed port, so that the links in the e-mails (built from PUBLIC_URL) lead here.
  const port = await findFreePort();
  stack = await startBrowserStack({ ...fakes.config, PORT: port, PUBLIC_URL: `http://127.0.0.1:${port}` });
}, 180_000);
afterAll(async () => {
  await stack?.stop();
  await fakes?.close();
});

async function askForAccount(page: import('playwright-core').Page, email: string) {
  await page.goto('/sign-up');
  const form = page.getByRole('form', { name: 'Create an account' });
  await form.getByLabel('Name').fill('Noor Haddad');
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill('a long enough passphrase');
  await form.getByLabel('Department').fill('Lindqvist Dwarf Census (illustrative)');
  await form.getByRole('button', { name: 'Create account' }).click();
  const answer = page.getByRole('status', { name: 'Check your mail' });
  await answer.waitFor();
  return (await answer.innerText()).trim();
}

describe('sign-up', () => {
  it('answers alike for a new and a known address; the mailed link creates the account and signs in', { timeout: 120_000 }, async () => {
    const { page, context } = await stack.newPage();
    try {
      const email = `noor.${Date.now()}@lindqvist.example`;
      const fresh = await askForAccount(page, email);
      expect(fresh).toMatch(/Check your mail/);
      expect(fresh).toContain(`${fakes.mail.outboxUrl}/messages`);
      await stack.screenshot(page, 'sign-up-check-your-mail');
      const known = await askForAccount(page, DEMO_USERS[0].email);
      expect(known).toBe(fresh);

      const note = await fakes.mail.waitFor((m) => m.to.includes(DEMO_USERS[0].email) && m.subject === 'You already have a Tidefield account');
      expect(note.text).toContain(`${stack.baseUrl}/forgot-password`);

      const message = await fakes.mail.waitFor((m) => m.to.includes(email) && m.subject === SIGN_UP_SUBJECT);
      await page.goto(`/confirm-sign-up?token=${linkToken(message, '/confirm-sign-up')}`);
      await page.waitForURL((url) => url.pathname === '/', { timeout: 30_000 });
      await page.getByRole('navigation').first().waitFor();
      const me = (await (await page.request.get('/api/me')).json()) as { user: { email: string }; role: string };
      expect(me).toMatchObject({ user: { email }, department: { name: 'Lindqvist Dwarf Census (illustrative)' }, role: 'admin' });
      await stack.screenshot(page, 'sign-up-confirmed');

      // The link works once: opened again (signed out), it explains and creates nothing.
      const again = await stack.newPage();
      try {
        await again.page.goto(`/confirm-sign-up?token=${linkToken(message, '/confirm-sign-up')}`);
        await again.page.getByText(/already been used/).waitFor();
      } finally {
        await again.context.close();
      }
    } finally {
      await context.close();
    }
  });
});
