import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

describe('admin', () => {
  it('signs in and changes a member’s role on the members page', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'admin');
      await page.goto('/members');
      const row = page.getByRole('row', { name: /observer@harrowgate\.example/ });
      await row.getByRole('combobox').selectOption('modeller');
      await page.getByText(/role (changed|updated)/i).first().waitFor({ timeout: 10_000 }).catch(() => undefined);
      await stack.screenshot(page, 'admin-members');
      const res = await page.request.get('/api/members');
      const members = (await res.json()).members as { email: string; role: string }[];
      expect(members.find((m) => m.email === 'observer@harrowgate.example')?.role).toBe('modeller');
    } finally {
      await context.close();
    }
  });
});
