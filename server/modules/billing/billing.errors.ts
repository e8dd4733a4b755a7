import type { RunQuote } from '../../../shared/contracts/pricing.ts';
import { AppError, notFound } from '../../lib/errors.ts';

const n = (x: number) => x.toLocaleString('en-US');
const credits = (x: number) => `${n(x)} credit${x === 1 ? '' : 's'}`;

/** 402: the run's cost is more than the balance. Nothing is queued (the transaction rolls back). */
export const insufficientCredit = (quote: RunQuote, balance: number, freeSystemsLeft: number) =>
  new AppError({
    code: 'insufficient_credit',
    status: 402,
    field: 'systems',
    message:
      `This run of ${n(quote.systems)} systems costs ${credits(quote.credits)} ` +
      `(${n(quote.billableSystems)} systems beyond the ${n(freeSystemsLeft)} free systems left this month, one credit per 10,000,000), ` +
      `but the department has ${credits(balance)}. Nothing was queued: an admin can buy credit on the Credits page, or start a smaller run.`,
  });

export const unknownPack = (packId: string, ids: string[]) =>
  new AppError({ code: 'invalid_input', status: 400, field: 'packId', message: `packId must be one of ${ids.join(', ')} (got "${packId}")` });

export const badSignature = () =>
  new AppError({ code: 'bad_signature', status: 400, message: 'The webhook signature does not match this body and secret, so the event was ignored and nothing changed.' });

export const notRawWebhook = () =>
  new AppError({ code: 'invalid_webhook', status: 400, field: 'body', message: 'A webhook must be a JSON event (Content-Type: application/json) with a Stripe-Signature header.' });

export const checkoutNotFound = () => notFound('That checkout');

export const wouldOverdraw = (balance: number, change: number) =>
  new AppError({ code: 'would_overdraw', status: 409, field: 'credits', message: `An adjustment of ${n(change)} credits would leave ${n(balance + change)}; the balance may never be negative (it is ${n(balance)}).` });
