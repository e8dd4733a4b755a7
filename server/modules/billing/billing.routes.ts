import { Router } from 'express';
import {
  balanceResponseSchema,
  checkoutBodySchema,
  checkoutResponseSchema,
  checkoutStatusResponseSchema,
  ledgerQuerySchema,
  ledgerResponseSchema,
  packListResponseSchema,
  quoteQuerySchema,
  quoteResponseSchema,
  receiptListResponseSchema,
  webhookResponseSchema,
} from '../../../shared/contracts/billing.ts';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import type { BillingService } from './billing.service.ts';

export const WEBHOOK_PATH = '/api/billing/webhook';

export function billingRoutes(registry: RouteRegistry, billing: BillingService): Router {
  const router = Router();
  const mount = '/api/billing';
  const tag = 'Billing';

  defineRoute(router, registry, mount, {
    method: 'get', path: '/balance', tag, access: 'observer', response: balanceResponseSchema,
    summary: "The department's credit balance, this month's free systems left, and credit held by unfinished runs",
  }, ({ auth }) => billing.balance(auth));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/quote', tag, access: 'observer', query: quoteQuerySchema, response: quoteResponseSchema,
    summary: 'What a run of `systems` would cost now (free systems first, then credits) and the balance after it',
  }, ({ auth, query }) => billing.quote(auth, query.systems));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/packs', tag, access: 'observer', response: packListResponseSchema,
    summary: 'The credit packs on sale',
  }, () => ({ packs: billing.packs() }));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/checkout', tag, access: 'admin', status: 201, body: checkoutBodySchema, response: checkoutResponseSchema,
    summary: 'Start a payment for a credit pack; send the browser to the returned url',
  }, ({ auth, body }) => billing.startCheckout(auth, body.packId));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/checkouts/:id', tag, access: 'admin', tokenScope: 'never', params: idParamsSchema, response: checkoutStatusResponseSchema,
    summary: 'One purchase and its state (open, paid, declined, expired, failed)',
  }, ({ auth, params }) => billing.checkout(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/receipts', tag, access: 'admin', tokenScope: 'never', response: receiptListResponseSchema,
    summary: "The department's paid purchases with their receipt numbers",
  }, async ({ auth }) => ({ receipts: await billing.receipts(auth) }));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/ledger', tag, access: 'admin', tokenScope: 'never', query: ledgerQuerySchema, response: ledgerResponseSchema,
    summary: "The department's credit ledger, newest first (append-only)",
  }, ({ auth, query }) => billing.ledger(auth, query.page, query.pageSize));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/webhook', tag, access: 'public', response: webhookResponseSchema,
    summary: 'Payment-service events, signed (Stripe-Signature) and verified on the raw body; each event id is handled once',
  }, ({ req }) => billing.handleWebhook(req.body, req.get('stripe-signature')));

  return router;
}
