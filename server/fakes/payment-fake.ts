/**
 * The local stand-in for the payment service: the few API endpoints Tidefield calls through the
 * `stripe` SDK (customers, products and prices, checkout sessions: create, retrieve, expire),
 * a stand-in hosted checkout page with a card that succeeds and one that is declined, and
 * webhook delivery signed the way the hosted service signs (the SDK's own
 * `webhooks.generateTestHeaderString`). Everything lives in memory; no money moves.
 *
 * The SDK sends form-encoded bodies with bracketed keys (line_items[0][price]=…), so bodies and
 * query strings are parsed with qs (`extended`).
 */
import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type Request, type Response } from 'express';
import Stripe from 'stripe';
import { listenOn } from './listen.ts';

/** Test cards of the stand-in page (the hosted service's test mode knows the same two). */
export const SUCCESS_CARD = '4242424242424242';
export const DECLINED_CARD = '4000000000000002';

type Json = Record<string, unknown>;

export interface DeliveredEvent {
  id: string;
  type: string;
  payload: string;
  attempts: { at: string; status: number | null; error?: string }[];
}

export interface PaymentFake {
  host: string;
  port: number;
  /** Base address of the stand-in (API and hosted pages). */
  url: string;
  apiKey: string;
  webhookSecret: string;
  setWebhookUrl(url: string): void;
  events(): DeliveredEvent[];
  /** Sends a stored event again with a fresh signature, as the service does on a retry. Returns the HTTP status. */
  redeliver(eventId: string): Promise<number | null>;
  close(): Promise<void>;
}

const newObjectId = (prefix: string) => `${prefix}_${randomBytes(12).toString('base64url').replace(/[-_]/g, '0')}`;
const now = () => Math.floor(Date.now() / 1000);

class ApiFailure extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly code?: string,
  ) {
    super(message);
  }
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function money(amount: number, currency: string): string {
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(amount / 100);
}

export async function startPaymentFake(options: {
  apiKey: string;
  webhookSecret: string;
  webhookUrl?: string;
  host?: string;
  port?: number;
}): Promise<PaymentFake> {
  const host = options.host ?? '127.0.0.1';
  let webhookUrl = options.webhookUrl ?? '';
  let baseUrl = '';
  // Only its signing helper is used: it computes the Stripe-Signature header.
  const signer = new Stripe(options.apiKey);

  const customers = new Map<string, Json>();
  const products = new Map<string, Json>();
  const prices = new Map<string, Json>();
  const sessions = new Map<string, Json>();
  const delivered: DeliveredEvent[] = [];
  const idempotent = new Map<string, Json>();

  async function deliver(event: DeliveredEvent): Promise<number | null> {
    if (!webhookUrl) {
      event.attempts.push({ at: new Date().toISOString(), status: null, error: 'no webhook address set' });
      return null;
    }
    // Up to three attempts, as the service retries a failed delivery (much later, there).
    for (let attempt = 0; attempt < 3; attempt++) {
      if (attempt > 0) await new Promise((r) => setTimeout(r, 200 * 4 ** (attempt - 1)));
      const signature = signer.webhooks.generateTestHeaderString({ payload: event.payload, secret: options.webhookSecret });
      try {
        const res = await fetch(webhookUrl, {
          method: 'POST',
          headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signature, 'user-agent': 'TidefieldPaymentStandIn/1.0' },
          body: event.payload,
        });
        event.attempts.push({ at: new Date().toISOString(), status: res.status });
        if (res.ok) return res.status;
        if (res.status < 500) return res.status;
      } catch (error) {
        event.attempts.push({ at: new Date().toISOString(), status: null, error: (error as Error).message });
      }
    }
    return event.attempts.at(-1)?.status ?? null;
  }

  async function emit(type: string, object: Json, apiVersion: string): Promise<DeliveredEvent> {
    const id = newObjectId('evt');
    const payload = JSON.stringify(
      { id, object: 'event', api_version: apiVersion, created: now(), data: { object }, livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, type },
      null,
      2,
    );
    const event: DeliveredEvent = { id, type, payload, attempts: [] };
    delivered.push(event);
    await deliver(event);
    return event;
  }

  function sessionOr404(id: string): Json {
    const session = sessions.get(id);
    if (!session) throw new ApiFailure(404, `No such checkout.session: '${id}'`, 'id', 'resource_missing');
    return session;
  }

  function createPrice(body: Json): Json {
    const unitAmount = Number(body.unit_amount);
    if (!Number.isInteger(unitAmount) || unitAmount < 0) throw new ApiFailure(400, 'Invalid integer: unit_amount', 'unit_amount');
    if (typeof body.currency !== 'string' || !/^[a-z]{3}$/.test(body.currency)) throw new ApiFailure(400, 'Invalid currency', 'currency');
    let productId = typeof body.product === 'string' ? body.product : undefined;
    if (!productId) {
      const data = body.product_data as Json | undefined;
      if (!data?.name) throw new ApiFailure(400, 'Missing required param: product_data[name].', 'product_data[name]');
      productId = newObjectId('prod');
      products.set(productId, { id: productId, object: 'product', name: data.name, active: true, metadata: data.metadata ?? {}, created: now(), livemode: false });
    }
    const lookupKey = typeof body.lookup_key === 'string' ? body.lookup_key : null;
    if (lookupKey && [...prices.values()].some((p) => p.lookup_key === lookupKey)) {
      throw new ApiFailure(400, `A price (\`${lookupKey}\`) already uses that lookup key.`, 'lookup_key');
    }
    const price = {
      id: newObjectId('price'), object: 'price', active: true, currency: body.currency, unit_amount: unitAmount, lookup_key: lookupKey,
      product: productId, type: 'one_time', metadata: body.metadata ?? {}, created: now(), livemode: false,
    };
    prices.set(price.id, price);
    return price;
  }

  function createSession(body: Json, apiVersion: string): Json {
    if (body.mode !== 'payment') throw new ApiFailure(400, 'This stand-in supports only mode=payment.', 'mode');
    if (typeof body.success_url !== 'string') throw new ApiFailure(400, 'Missing required param: success_url.', 'success_url');
    const items = Array.isArray(body.line_items) ? (body.line_items as Json[]) : [];
    if (items.length === 0) throw new ApiFailure(400, 'Missing required param: line_items.', 'line_items');
    let amount = 0;
    let currency = '';
    const lineItems = items.map((item, i) => {
      const price = prices.get(String(item.price));
      if (!price) throw new ApiFailure(400, `No such price: '${String(item.price)}'`, `line_items[${i}][price]`, 'resource_missing');
      const quantity = Number(item.quantity ?? 1);
      amount += Number(price.unit_amount) * quantity;
      currency = String(price.currency);
      return { price: price.id, quantity, description: products.get(String(price.product))?.name ?? '' };
    });
    if (body.customer && !customers.has(String(body.customer))) throw new ApiFailure(400, `No such customer: '${String(body.customer)}'`, 'customer', 'resource_missing');
    const id = newObjectId('cs_test');
    const session: Json = {
      id, object: 'checkout.session', mode: 'payment', status: 'open', payment_status: 'unpaid',
      amount_subtotal: amount, amount_total: amount, currency, customer: body.customer ?? null,
      customer_email: body.customer_email ?? null, client_reference_id: body.client_reference_id ?? null,
      metadata: body.metadata ?? {}, success_url: body.success_url, cancel_url: body.cancel_url ?? null,
      payment_intent: null, created: now(), expires_at: now() + 24 * 3600, livemode: false,
      url: `${baseUrl}/pay/${id}`, customer_details: null,
      // Kept for the hosted page and the payment intent; not part of the API answer.
      _lineItems: lineItems, _paymentIntentMetadata: (body.payment_intent_data as Json | undefined)?.metadata ?? {}, _apiVersion: apiVersion,
    };
    sessions.set(id, session);
    return session;
  }

  const publicView = (session: Json) => Object.fromEntries(Object.entries(session).filter(([k]) => !k.startsWith('_')));

  async function expireSession(session: Json): Promise<Json> {
    if (session.status !== 'open') throw new ApiFailure(400, `Only open checkout sessions can be expired (this one is ${String(session.status)}).`, 'session');
    session.status = 'expired';
    session.url = null;
    await emit('checkout.session.expired', publicView(session), String(session._apiVersion));
    return session;
  }

  async function pay(session: Json, card: string): Promise<{ ok: boolean; message: string }> {
    const customer = session.customer ? customers.get(String(session.customer)) : undefined;
    const paymentIntent = newObjectId('pi');
    if (card === DECLINED_CARD) {
      const intent = {
        id: paymentIntent, object: 'payment_intent', amount: session.amount_total, currency: session.currency, status: 'requires_payment_method',
        customer: session.customer, metadata: session._paymentIntentMetadata, created: now(), livemode: false,
        last_payment_error: { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
      };
      await emit('payment_intent.payment_failed', intent, String(session._apiVersion));
      return { ok: false, message: 'Your card was declined. Nothing was charged; try the other card or go back.' };
    }
    session.status = 'complete';
    session.payment_status = 'paid';
    session.payment_intent = paymentIntent;
    session.url = null;
    session.customer_details = { email: customer?.email ?? session.customer_email ?? null, name: customer?.name ?? null };
    await emit('checkout.session.completed', publicView(session), String(session._apiVersion));
    return { ok: true, message: 'Paid.' };
  }

  function page(session: Json, notice?: { tone: 'error' | 'info'; text: string }): string {
    const items = session._lineItems as { description: string; quantity: number }[];
    const open = session.status === 'open';
    const amount = money(Number(session.amount_total), String(session.currency));
    const back = open ? (session.cancel_url as string | null) : String(session.success_url).replace('{CHECKOUT_SESSION_ID}', String(session.id));
    return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Pay ${escapeHtml(amount)} · local payment stand-in</title>
<style>
body{margin:0;font:17px/1.5 system-ui,sans-serif;background:#f3f1ea;color:#1d1b16}
main{max-width:30rem;margin:3rem auto;padding:2rem;background:#fffdf7;border:2px solid #1d1b16;border-radius:6px}
.banner{margin:0 0 1.5rem;padding:.6rem .9rem;background:#1d1b16;color:#f3f1ea;font-weight:700;border-radius:4px}
h1{font-size:1.6rem;margin:.2rem 0 1rem}label{display:block;font-weight:700;margin-top:1rem}
input{width:100%;box-sizing:border-box;font:inherit;padding:.6rem;border:2px solid #1d1b16;border-radius:4px;letter-spacing:.08em}
button{font:inherit;font-weight:700;padding:.7rem 1rem;margin-top:1rem;border:2px solid #1d1b16;border-radius:4px;cursor:pointer;background:#e3b341;color:#1d1b16;width:100%}
button.plain{background:transparent}.error{border-left:6px solid #b3261e;padding:.5rem .8rem;background:#fbe9e7}
.info{border-left:6px solid #2c6e49;padding:.5rem .8rem;background:#e7f4ec}.cards{font-size:.95rem;color:#4a463c}code{font-size:1rem}
</style></head><body><main>
<p class="banner">Local payment stand-in · no real card is charged</p>
<p>${items.map((i) => `${escapeHtml(i.description)}${i.quantity > 1 ? ` × ${i.quantity}` : ''}`).join('<br>')}</p>
<h1>${escapeHtml(amount)}</h1>
${notice ? `<p class="${notice.tone}" role="${notice.tone === 'error' ? 'alert' : 'status'}">${escapeHtml(notice.text)}</p>` : ''}
${
  open
    ? `<form method="post" action="/pay/${escapeHtml(String(session.id))}">
<label for="card">Card number</label><input id="card" name="card" inputmode="numeric" autocomplete="off" placeholder="4242 4242 4242 4242">
<button type="submit">Pay ${escapeHtml(amount)}</button></form>
<div class="cards"><p>Test cards of this stand-in:</p>
<form method="post" action="/pay/${escapeHtml(String(session.id))}"><input type="hidden" name="card" value="${SUCCESS_CARD}"><button type="submit" class="plain">Pay with the success card <code>4242 4242 4242 4242</code></button></form>
<form method="post" action="/pay/${escapeHtml(String(session.id))}"><input type="hidden" name="card" value="${DECLINED_CARD}"><button type="submit" class="plain">Try the declined card <code>4000 0000 0000 0002</code></button></form></div>`
    : `<p class="info" role="status">This checkout is ${escapeHtml(String(session.status))}.</p>`
}
${back ? `<p><a href="${escapeHtml(back)}">${open ? 'Cancel and go back' : 'Back to the shop'}</a></p>` : ''}
</main></body></html>`;
  }

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended');
  app.use(express.urlencoded({ extended: true }));

  const api = express.Router();
  api.use((req, _res, next) => {
    const auth = req.headers.authorization ?? '';
    if (auth !== `Bearer ${options.apiKey}`) return next(new ApiFailure(401, 'Invalid API Key provided.'));
    next();
  });
  // Replays of the same Idempotency-Key get the first answer, as the service does.
  const once = (handler: (req: Request) => Json | Promise<Json>) => async (req: Request, res: Response) => {
    const key = req.headers['idempotency-key'];
    const cacheKey = typeof key === 'string' ? `${req.path}|${key}` : null;
    if (cacheKey && idempotent.has(cacheKey)) return res.json(idempotent.get(cacheKey));
    const body = await handler(req);
    if (cacheKey) idempotent.set(cacheKey, body);
    res.json(body);
  };
  const apiVersion = (req: Request) => String(req.headers['stripe-version'] ?? 'unversioned');

  api.post('/customers', once((req) => {
    const body = (req.body ?? {}) as Json;
    const customer = { id: newObjectId('cus'), object: 'customer', name: body.name ?? null, email: body.email ?? null, metadata: body.metadata ?? {}, created: now(), livemode: false };
    customers.set(customer.id, customer);
    return customer;
  }));
  api.get('/customers/:id', (req, res) => {
    const customer = customers.get(String(req.params.id));
    if (!customer) throw new ApiFailure(404, `No such customer: '${String(req.params.id)}'`, 'id', 'resource_missing');
    res.json(customer);
  });
  api.post('/prices', once((req) => createPrice((req.body ?? {}) as Json)));
  api.get('/prices', (req, res) => {
    const keys = req.query.lookup_keys as string[] | string | undefined;
    const wanted = keys === undefined ? null : new Set(Array.isArray(keys) ? keys : [keys]);
    const data = [...prices.values()].filter((p) => (!wanted || wanted.has(String(p.lookup_key))) && (req.query.active === undefined || String(p.active) === req.query.active));
    res.json({ object: 'list', url: '/v1/prices', has_more: false, data });
  });
  api.get('/prices/:id', (req, res) => {
    const price = prices.get(String(req.params.id));
    if (!price) throw new ApiFailure(404, `No such price: '${String(req.params.id)}'`, 'id', 'resource_missing');
    res.json(price);
  });
  api.get('/products/:id', (req, res) => {
    const product = products.get(String(req.params.id));
    if (!product) throw new ApiFailure(404, `No such product: '${String(req.params.id)}'`, 'id', 'resource_missing');
    res.json(product);
  });
  api.post('/checkout/sessions', once((req) => publicView(createSession((req.body ?? {}) as Json, apiVersion(req)))));
  api.get('/checkout/sessions/:id', (req, res) => res.json(publicView(sessionOr404(String(req.params.id)))));
  api.post('/checkout/sessions/:id/expire', async (req, res) => res.json(publicView(await expireSession(sessionOr404(String(req.params.id))))));
  api.use((req, _res, next) => next(new ApiFailure(404, `Unrecognized request URL (${req.method}: ${req.originalUrl}). This stand-in implements only the endpoints Tidefield uses.`)));
  app.use('/v1', api);

  // The hosted checkout page.
  app.get('/pay/:id', (req, res) => {
    const session = sessions.get(String(req.params.id));
    if (!session) return res.status(404).type('text/plain').send('No such checkout.');
    res.type('html').send(page(session));
  });
  app.post('/pay/:id', async (req, res) => {
    const session = sessions.get(String(req.params.id));
    if (!session) return res.status(404).type('text/plain').send('No such checkout.');
    if (session.status !== 'open') return res.status(409).type('html').send(page(session));
    const card = String((req.body as Json | undefined)?.card ?? '').replace(/[\s-]/g, '');
    if (card !== SUCCESS_CARD && card !== DECLINED_CARD) {
      return res.status(400).type('html').send(page(session, { tone: 'error', text: 'This stand-in takes only its two test cards: 4242 4242 4242 4242 (succeeds) or 4000 0000 0000 0002 (declined).' }));
    }
    const outcome = await pay(session, card);
    if (!outcome.ok) return res.status(402).type('html').send(page(session, { tone: 'error', text: outcome.message }));
    res.redirect(303, String(session.success_url).replace('{CHECKOUT_SESSION_ID}', String(session.id)));
  });

  // Control endpoints for tests and curious developers.
  app.get('/_control/events', (_req, res) => res.json({ events: delivered.map(({ payload: _p, ...e }) => e) }));
  app.post('/_control/events/:id/redeliver', async (req, res) => {
    const event = delivered.find((e) => e.id === req.params.id);
    if (!event) return res.status(404).json({ error: 'no such event' });
    res.json({ status: await deliver(event) });
  });

  app.use((error: unknown, _req: Request, res: Response, _next: unknown) => {
    const failure = error instanceof ApiFailure ? error : new ApiFailure(500, (error as Error)?.message ?? 'stand-in error');
    const type = failure.status === 401 ? 'invalid_request_error' : failure.status >= 500 ? 'api_error' : 'invalid_request_error';
    res.status(failure.status).json({ error: { type, message: failure.message, ...(failure.param ? { param: failure.param } : {}), ...(failure.code ? { code: failure.code } : {}) } });
  });

  const server = http.createServer(app);
  await listenOn(server, options.port ?? 0, host);
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host}:${port}`;

  return {
    host,
    port,
    url: baseUrl,
    apiKey: options.apiKey,
    webhookSecret: options.webhookSecret,
    setWebhookUrl: (url) => void (webhookUrl = url),
    events: () => [...delivered],
    async redeliver(eventId) {
      const event = delivered.find((e) => e.id === eventId);
      if (!event) throw new Error(`no event ${eventId}`);
      return deliver(event);
    },
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
