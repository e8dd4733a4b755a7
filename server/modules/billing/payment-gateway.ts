import Stripe from 'stripe';
import { CREDIT_PACKS, type CreditPack } from '../../../shared/contracts/pricing.ts';
import type { Config } from '../../config.ts';
import { AppError } from '../../lib/errors.ts';

/** The fields of webhook objects Tidefield reads (checkout sessions and payment intents). */
export interface PaymentEvent {
  id: string;
  type: string;
  object: {
    id: string;
    metadata?: Record<string, string> | null;
    payment_status?: string;
    amount_total?: number | null;
    currency?: string | null;
    customer_details?: { email?: string | null } | null;
    last_payment_error?: { message?: string } | null;
  };
}

export const paymentUnavailable = (cause: unknown) =>
  new AppError({
    code: 'payment_unavailable',
    status: 502,
    message: 'The payment service did not answer, so no checkout was started and nothing was charged. Try again in a minute.',
    cause,
  });

/**
 * The payment service through the stripe SDK. Host, port and protocol come from the
 * configuration: the local stand-in by default, the hosted service when configured so.
 * Credit packs are products with one-time prices, found by lookup key and created on first use.
 */
export function createPaymentGateway(config: Pick<Config, 'STRIPE_SECRET_KEY' | 'STRIPE_WEBHOOK_SECRET' | 'STRIPE_API_HOST' | 'STRIPE_API_PORT' | 'STRIPE_API_PROTOCOL'>) {
  const stripe = new Stripe(config.STRIPE_SECRET_KEY, {
    host: config.STRIPE_API_HOST,
    port: config.STRIPE_API_PORT,
    protocol: config.STRIPE_API_PROTOCOL,
    maxNetworkRetries: 0,
    timeout: 20_000,
    telemetry: false,
  });
  let priceIds: Promise<Map<string, string>> | null = null;

  async function loadPrices(): Promise<Map<string, string>> {
    const found = await stripe.prices.list({ lookup_keys: CREDIT_PACKS.map((p) => p.lookupKey), active: true, limit: 100 });
    const byKey = new Map(found.data.map((p) => [p.lookup_key, p.id]));
    const ids = new Map<string, string>();
    for (const pack of CREDIT_PACKS) {
      let id = byKey.get(pack.lookupKey);
      if (!id) {
        const created = await stripe.prices.create(
          {
            currency: pack.currency,
            unit_amount: pack.unitAmount,
            lookup_key: pack.lookupKey,
            product_data: { name: pack.name, metadata: { packId: pack.id, credits: String(pack.credits) } },
            metadata: { packId: pack.id, credits: String(pack.credits) },
          },
          { idempotencyKey: `price-${pack.lookupKey}` },
        );
        id = created.id;
      }
      ids.set(pack.id, id);
    }
    return ids;
  }

  async function priceFor(pack: CreditPack): Promise<string> {
    priceIds ??= loadPrices().catch((error: unknown) => {
      priceIds = null;
      throw error;
    });
    const id = (await priceIds).get(pack.id);
    if (!id) throw new Error(`no price for pack ${pack.id}`);
    return id;
  }

  return {
    async createCustomer(input: { departmentId: string; name: string; email: string }): Promise<string> {
      try {
        const customer = await stripe.customers.create(
          { name: input.name, email: input.email, metadata: { departmentId: input.departmentId } },
          { idempotencyKey: `customer-${input.departmentId}` },
        );
        return customer.id;
      } catch (error) {
        throw paymentUnavailable(error);
      }
    },

    /** A hosted checkout session for one pack; `metadata` comes back on its webhook events. */
    async createCheckoutSession(input: {
      checkoutId: string;
      pack: CreditPack;
      customerId: string;
      successUrl: string;
      cancelUrl: string;
      metadata: Record<string, string>;
    }): Promise<{ id: string; url: string }> {
      const create = async () =>
        stripe.checkout.sessions.create(
          {
            mode: 'payment',
            line_items: [{ price: await priceFor(input.pack), quantity: 1 }],
            customer: input.customerId,
            client_reference_id: input.checkoutId,
            metadata: input.metadata,
            payment_intent_data: { metadata: input.metadata },
            success_url: input.successUrl,
            cancel_url: input.cancelUrl,
          },
          { idempotencyKey: `checkout-${input.checkoutId}` },
        );
      let session;
      try {
        session = await create().catch(async (error: unknown) => {
          // A price deleted on the service side: look the prices up again once.
          if ((error as { code?: string }).code !== 'resource_missing') throw error;
          priceIds = null;
          return create();
        });
      } catch (error) {
        throw paymentUnavailable(error);
      }
      if (!session.url) throw paymentUnavailable(new Error('checkout session without url'));
      return { id: session.id, url: session.url };
    },

    /** The service's view of a session (for a status page while the webhook is on its way). */
    async retrieveSession(id: string): Promise<{ status: string | null; paymentStatus: string }> {
      const session = await stripe.checkout.sessions.retrieve(id);
      return { status: session.status, paymentStatus: session.payment_status };
    },

    /** Verifies the Stripe-Signature header on the raw body; throws on a bad or stale signature. */
    verifyEvent(rawBody: Buffer, signature: string): PaymentEvent {
      const event = stripe.webhooks.constructEvent(rawBody, signature, config.STRIPE_WEBHOOK_SECRET);
      return { id: event.id, type: event.type, object: event.data.object as unknown as PaymentEvent['object'] };
    },
  };
}

export type PaymentGateway = ReturnType<typeof createPaymentGateway>;
