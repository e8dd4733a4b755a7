import { z } from 'zod';
import { pageInfoSchema, pageQueryFields } from './common.ts';

/** The department's credit: balance, this month's free allowance, and credit held by unfinished runs. */
export const balanceResponseSchema = z.object({
  credits: z.number(),
  freeSystemsLeft: z.number(),
  freeSystemsPerMonth: z.number(),
  /** The allowance month, "2026-03" (UTC). */
  period: z.string(),
  /** Credits reserved by queued or running runs (already taken off `credits`). */
  reservedCredits: z.number(),
  systemsPerCredit: z.number(),
});
export type BalanceResponse = z.infer<typeof balanceResponseSchema>;

export const creditPackSchema = z.object({
  id: z.string(),
  name: z.string(),
  credits: z.number(),
  unitAmount: z.number(),
  currency: z.string(),
});
export type CreditPackView = z.infer<typeof creditPackSchema>;
export const packListResponseSchema = z.object({ packs: z.array(creditPackSchema) });

export const checkoutBodySchema = z.strictObject({
  packId: z.string({ error: 'packId is required' }).min(1, { error: 'packId is required' }).max(40),
});
export type CheckoutBody = z.infer<typeof checkoutBodySchema>;
/** `url` is the payment page to send the browser to; `checkoutId` names the purchase for its status. */
export const checkoutResponseSchema = z.object({ url: z.string(), checkoutId: z.string() });

export const CHECKOUT_STATUSES = ['open', 'paid', 'declined', 'expired', 'failed'] as const;
export const checkoutStatusSchema = z.enum(CHECKOUT_STATUSES);
export const checkoutSchema = z.object({
  id: z.string(),
  packId: z.string(),
  packName: z.string(),
  credits: z.number(),
  unitAmount: z.number(),
  currency: z.string(),
  status: checkoutStatusSchema,
  /** Why the payment did not go through (declined card), when known. */
  failureMessage: z.string().nullable(),
  receiptNumber: z.string().nullable(),
  createdAt: z.string(),
  paidAt: z.string().nullable(),
  createdByName: z.string(),
});
export type Checkout = z.infer<typeof checkoutSchema>;
/** One checkout; `paymentReceived` is true once the payment service reports it paid (credit follows with its webhook). */
export const checkoutStatusResponseSchema = checkoutSchema.extend({ paymentReceived: z.boolean() });
export const receiptListResponseSchema = z.object({ receipts: z.array(checkoutSchema) });

export const LEDGER_KINDS = ['purchase', 'reservation', 'settlement', 'refund', 'allowance', 'adjustment'] as const;
export const ledgerKindSchema = z.enum(LEDGER_KINDS);
export type LedgerKind = z.infer<typeof ledgerKindSchema>;

export const ledgerEntrySchema = z.object({
  id: z.number(),
  at: z.string(),
  kind: ledgerKindSchema,
  /** Change of the credit balance (negative for a reservation). */
  credits: z.number(),
  /** Change of the month's free systems. */
  freeSystems: z.number(),
  balanceAfter: z.number(),
  period: z.string(),
  description: z.string(),
  runId: z.string().nullable(),
  checkoutId: z.string().nullable(),
  actorName: z.string().nullable(),
});
export type LedgerEntry = z.infer<typeof ledgerEntrySchema>;
export const ledgerQuerySchema = z.strictObject({ ...pageQueryFields });
export const ledgerResponseSchema = z.object({ entries: z.array(ledgerEntrySchema), page: pageInfoSchema });

const systemsQuery = z.coerce
  .number({ error: 'systems must be a whole number from 1000 to 10000000000' })
  .int({ error: 'systems must be a whole number from 1000 to 10000000000' })
  .min(1e3, { error: 'systems must be between 1000 and 10000000000' })
  .max(1e10, { error: 'systems must be between 1000 and 10000000000' });
export const quoteQuerySchema = z.strictObject({ systems: systemsQuery });

/** What a run of `systems` would cost now, and the balance after it. */
export const quoteResponseSchema = z.object({
  systems: z.number(),
  freeSystemsUsed: z.number(),
  billableSystems: z.number(),
  credits: z.number(),
  balance: z.number(),
  balanceAfter: z.number(),
  freeSystemsLeft: z.number(),
  freeSystemsLeftAfter: z.number(),
  /** False when the balance does not cover the cost: starting the run would be refused (402). */
  sufficient: z.boolean(),
});
export type QuoteResponse = z.infer<typeof quoteResponseSchema>;

export const webhookResponseSchema = z.object({ received: z.boolean(), duplicate: z.boolean().optional() });
