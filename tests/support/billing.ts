import type request from 'supertest';
import { expect } from 'vitest';
import { DECLINED_CARD, SUCCESS_CARD } from '../../server/fakes/payment-fake.ts';
import type { StoredMessage } from '../../server/fakes/smtp-fake.ts';
import type { TestContext } from './test-app.ts';

/** Starts a checkout as `admin` and pays it on the stand-in's hosted page, as a browser would post its form. */
export async function payOnStandIn(url: string, card: 'success' | 'declined'): Promise<Response> {
  return fetch(url, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card: card === 'success' ? SUCCESS_CARD : DECLINED_CARD }),
    redirect: 'manual',
  });
}

export async function startCheckout(admin: request.Agent, packId = 'pack-100'): Promise<{ url: string; checkoutId: string }> {
  const res = await admin.post('/api/billing/checkout').send({ packId });
  if (res.status !== 201) throw new Error(`checkout: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** Buys a pack end to end (checkout → stand-in page → signed webhook) and returns the checkout id. */
export async function buyPack(admin: request.Agent, packId = 'pack-100'): Promise<string> {
  const { url, checkoutId } = await startCheckout(admin, packId);
  const paid = await payOnStandIn(url, 'success');
  expect(paid.status).toBe(303);
  return checkoutId;
}

export async function balanceOf(agent: request.Agent): Promise<{ credits: number; freeSystemsLeft: number; reservedCredits: number }> {
  return (await agent.get('/api/billing/balance').expect(200)).body;
}

/** The ledger's own sum, the account row and the smallest running balance ever written, read from the database. */
export async function ledgerCheck(ctx: TestContext, departmentId: string) {
  const [rows] = (await ctx.database.pool.query(
    'select coalesce(sum(credits), 0) as total, coalesce(min(balance_after), 0) as lowest, count(*) as n from credit_ledger where department_id = ?',
    [departmentId],
  )) as unknown as [{ total: string; lowest: number; n: number }[]];
  const [account] = (await ctx.database.pool.query('select balance_credits from billing_accounts where department_id = ?', [departmentId])) as unknown as [
    { balance_credits: number }[],
  ];
  return { total: Number(rows[0].total), lowest: Number(rows[0].lowest), entries: Number(rows[0].n), account: account[0]?.balance_credits ?? 0 };
}

/** The token of the first link to `path` in an e-mail's text part. */
export function linkToken(message: StoredMessage, path: string): string {
  const match = message.text.match(new RegExp(`${path.replace(/[/?]/g, '\\$&')}\\?token=([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link in: ${message.text}`);
  return match[1];
}

/** Every e-mail has both parts, and its HTML loads nothing from elsewhere (no images, fonts or style sheets). */
export function expectSelfContained(message: StoredMessage) {
  expect(message.text.length).toBeGreaterThan(20);
  expect(message.html).toMatch(/<html/);
  expect(message.html).not.toMatch(/<img|<link|@import|@font-face|url\(|src=/i);
}
