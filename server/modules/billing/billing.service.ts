import { randomBytes } from 'node:crypto';
import type { Logger } from 'pino';
import type { BalanceResponse, Checkout, LedgerEntry, QuoteResponse } from '../../../shared/contracts/billing.ts';
import { allowancePeriod, CREDIT_PACKS, findPack, quoteRun, SYSTEMS_PER_CREDIT } from '../../../shared/contracts/pricing.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db, Tx } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { AppError, badRequest, isDuplicateKey } from '../../lib/errors.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { receiptEmail } from '../mail/mail-templates.ts';
import type { Mailer } from '../mail/mailer.ts';
import type { RunBilling } from '../runs/runs.service.ts';
import type { RunRow } from '../runs/runs.table.ts';
import {
  findCheckout,
  findLedgerEntry,
  insertCheckout,
  insertLedgerEntry,
  insertPaymentEventOnce,
  listCheckouts,
  listLedger,
  lockAccount,
  lockCheckout,
  readAccount,
  reservedCredits,
  setPaymentEventOutcome,
  updateAccount,
  updateCheckout,
  type NewLedgerEntry,
} from './billing.repository.ts';
import type { BillingAccountRow, CheckoutRow } from './billing.table.ts';
import { badSignature, checkoutNotFound, insufficientCredit, notRawWebhook, unknownPack, wouldOverdraw } from './billing.errors.ts';
import { paymentUnavailable, type PaymentEvent, type PaymentGateway } from './payment-gateway.ts';

type Account = Pick<BillingAccountRow, 'departmentId' | 'balanceCredits' | 'freeSystemsLeft' | 'allowancePeriod'>;

const KIND_TEXT: Record<LedgerEntry['kind'], string> = {
  purchase: 'Credit bought',
  reservation: 'Reserved for a run',
  settlement: 'Run finished: cost kept',
  refund: 'Run did not finish: given back',
  allowance: 'Monthly free allowance',
  adjustment: 'Adjustment',
};

const reserveKey = (runId: string) => `run:${runId}:reserve`;
/** Settlement and refund share one key, so a run is settled or refunded, once. */
const finalKey = (runId: string) => `run:${runId}:final`;

/**
 * Compute credit. Every change goes through `apply` inside a transaction holding the
 * department's account row lock: one ledger entry appended, the account's running totals
 * moved with it, and a negative balance refused before anything is written.
 */
export function createBillingService(deps: { db: Db; config: Config; payments: PaymentGateway; mailer: Mailer; logger: Logger }) {
  const { db, config, payments, mailer, logger } = deps;
  const freePerMonth = config.FREE_SYSTEMS_PER_MONTH;
  const base = publicBaseUrl(config);

  async function apply(tx: Tx, account: Account, entry: NewLedgerEntry, now: Date): Promise<Account> {
    const balanceCredits = account.balanceCredits + entry.credits;
    if (balanceCredits < 0) throw new Error(`ledger guard: ${entry.kind} would leave ${account.departmentId} at ${balanceCredits} credits`);
    const freeSystemsLeft = entry.period === account.allowancePeriod ? account.freeSystemsLeft + entry.freeSystems : account.freeSystemsLeft;
    await insertLedgerEntry(tx, account.departmentId, { ...entry, balanceAfter: balanceCredits, createdAt: now });
    await updateAccount(tx, account.departmentId, { balanceCredits, freeSystemsLeft, allowancePeriod: account.allowancePeriod }, now);
    return { ...account, balanceCredits, freeSystemsLeft };
  }

  /** Locks the account and grants this month's free allowance if it is the first change of the month. */
  async function lockForChange(tx: Tx, departmentId: string, now: Date): Promise<Account> {
    const account: Account = await lockAccount(tx, departmentId, now);
    const period = allowancePeriod(now);
    if (account.allowancePeriod === period) return account;
    // Last month's free systems lapse; the new month starts from its full allowance.
    const fresh = { ...account, allowancePeriod: period, freeSystemsLeft: 0 };
    if (freePerMonth === 0) {
      await updateAccount(tx, departmentId, { allowancePeriod: period, freeSystemsLeft: 0 }, now);
      return fresh;
    }
    return apply(tx, fresh, {
      kind: 'allowance', credits: 0, freeSystems: freePerMonth, period,
      reason: `${freePerMonth.toLocaleString('en-US')} free systems for ${period}`, idempotencyKey: `allowance:${departmentId}:${period}`,
    }, now);
  }

  /** Credit changes that may race with a replay of themselves: a duplicate key means it was already done. */
  async function once<T>(work: (tx: Tx) => Promise<T>): Promise<T | 'already-done'> {
    try {
      return await db.transaction(work);
    } catch (error) {
      if (isDuplicateKey(error)) return 'already-done';
      throw error;
    }
  }

  const runBilling: RunBilling = {
    async reserve(tx, run) {
      const now = new Date();
      const account = await lockForChange(tx, run.departmentId, now);
      const quote = quoteRun(run.systems, account.freeSystemsLeft);
      if (quote.credits > account.balanceCredits) throw insufficientCredit(quote, account.balanceCredits, account.freeSystemsLeft);
      await apply(tx, account, {
        kind: 'reservation', credits: -quote.credits, freeSystems: -quote.freeSystemsUsed, period: account.allowancePeriod!,
        runId: run.id, actorUserId: run.userId, idempotencyKey: reserveKey(run.id),
        reason: `${run.systems.toLocaleString('en-US')} systems: ${quote.freeSystemsUsed.toLocaleString('en-US')} free, ${quote.credits} credits`,
      }, now);
      return { costCredits: quote.credits };
    },
  };

  /** Keeps a finished run's reservation, or gives it back (credits, and free systems of the same month). Idempotent. */
  async function settleRun(run: RunRow, outcome: 'succeeded' | 'failed' | 'cancelled'): Promise<{ refundedCredits: number } | null> {
    const result = await once(async (tx) => {
      const now = new Date();
      const account = await lockForChange(tx, run.departmentId, now);
      const reservation = await findLedgerEntry(tx, reserveKey(run.id));
      if (!reservation || (await findLedgerEntry(tx, finalKey(run.id)))) return null;
      if (outcome === 'succeeded') {
        await apply(tx, account, { kind: 'settlement', credits: 0, freeSystems: 0, period: reservation.period, runId: run.id, idempotencyKey: finalKey(run.id), reason: `${-reservation.credits} credits kept` }, now);
        return { refundedCredits: 0 };
      }
      const freeBack = reservation.period === account.allowancePeriod ? -reservation.freeSystems : 0;
      await apply(tx, account, {
        kind: 'refund', credits: -reservation.credits, freeSystems: freeBack, period: reservation.period, runId: run.id, idempotencyKey: finalKey(run.id),
        reason: outcome === 'failed' ? 'the run failed' : 'the run was cancelled',
      }, now);
      return { refundedCredits: -reservation.credits };
    });
    return result === 'already-done' ? null : result;
  }

  async function balanceOf(departmentId: string): Promise<BalanceResponse> {
    const period = allowancePeriod(new Date());
    const account = await readAccount(db, departmentId);
    return {
      credits: account?.balanceCredits ?? 0,
      // A month without a change yet has its whole allowance (granted at its first change).
      freeSystemsLeft: account?.allowancePeriod === period ? account.freeSystemsLeft : freePerMonth,
      freeSystemsPerMonth: freePerMonth,
      period,
      reservedCredits: await reservedCredits(db, departmentId),
      systemsPerCredit: SYSTEMS_PER_CREDIT,
    };
  }

  function toCheckout(row: { checkout: CheckoutRow; createdByName: string }): Checkout {
    const c = row.checkout;
    return {
      id: c.id, packId: c.packId, packName: findPack(c.packId)?.name ?? c.packId, credits: c.credits, unitAmount: c.unitAmount, currency: c.currency,
      status: c.status, failureMessage: c.failureMessage, receiptNumber: c.receiptNumber, createdAt: c.createdAt.toISOString(),
      paidAt: c.paidAt?.toISOString() ?? null, createdByName: row.createdByName,
    };
  }

  async function customerFor(auth: RequestAuth, department: { id: string; name: string }): Promise<string> {
    const existing = (await readAccount(db, department.id))?.paymentCustomerId;
    if (existing) return existing;
    // The idempotency key is per department, so two admins starting at once get one customer.
    const created = await payments.createCustomer({ departmentId: department.id, name: department.name, email: auth.user.email });
    return db.transaction(async (tx) => {
      const account = await lockAccount(tx, department.id, new Date());
      if (account.paymentCustomerId) return account.paymentCustomerId;
      await updateAccount(tx, department.id, { paymentCustomerId: created }, new Date());
      return created;
    });
  }

  async function sendReceipt(checkoutId: string, departmentId: string, balance: number) {
    const [row] = await listCheckouts(db, departmentId, { id: checkoutId });
    if (!row?.checkout.receiptNumber || !row.checkout.paidAt) return;
    const pack = findPack(row.checkout.packId);
    mailer.sendInBackground({
      to: row.createdByEmail,
      kind: 'receipt',
      departmentId,
      ...receiptEmail({
        departmentName: row.departmentName, receiptNumber: row.checkout.receiptNumber, packName: pack?.name ?? row.checkout.packId,
        credits: row.checkout.credits, unitAmount: row.checkout.unitAmount, currency: row.checkout.currency, paidAt: row.checkout.paidAt,
        balance, link: `${base}/credits`,
      }),
    });
  }

  /** checkout.session.completed (paid): credits the pack once per checkout, and records the event once per id. */
  async function creditPurchase(event: PaymentEvent, checkout: CheckoutRow): Promise<{ duplicate: boolean }> {
    const outcome = await once(async (tx) => {
      const now = new Date();
      const account = await lockForChange(tx, checkout.departmentId, now);
      if (!(await insertPaymentEventOnce(tx, { eventId: event.id, type: event.type, checkoutId: checkout.id, outcome: 'credited', receivedAt: now }))) return 'replay' as const;
      const row = await lockCheckout(tx, checkout.id);
      if (!row || row.status === 'paid') {
        await setPaymentEventOutcome(tx, event.id, 'already_paid');
        return 'already-paid' as const;
      }
      if (event.object.amount_total !== row.unitAmount || event.object.currency?.toLowerCase() !== row.currency) {
        logger.error({ eventId: event.id, checkoutId: row.id, amount: event.object.amount_total, currency: event.object.currency }, 'paid amount does not match the pack; nothing credited');
        await setPaymentEventOutcome(tx, event.id, 'amount_mismatch');
        return 'mismatch' as const;
      }
      const receiptNumber = `TF-${now.toISOString().slice(0, 10).replace(/-/g, '')}-${randomBytes(4).toString('hex').toUpperCase()}`;
      await updateCheckout(tx, row.id, { status: 'paid', paidAt: now, receiptNumber, failureMessage: null });
      const after = await apply(tx, account, {
        kind: 'purchase', credits: row.credits, freeSystems: 0, period: account.allowancePeriod!, checkoutId: row.id,
        actorUserId: row.createdByUserId, idempotencyKey: `purchase:${row.id}`, reason: findPack(row.packId)?.name ?? row.packId,
      }, now);
      await recordAudit(tx, {
        departmentId: row.departmentId, actorUserId: row.createdByUserId, action: 'billing.purchase', target: row.id,
        detail: { credits: row.credits, unitAmount: row.unitAmount, currency: row.currency, eventId: event.id, receiptNumber },
      });
      return { balance: after.balanceCredits };
    });
    if (outcome === 'replay' || outcome === 'already-done') return { duplicate: true };
    if (typeof outcome === 'object') await sendReceipt(checkout.id, checkout.departmentId, outcome.balance);
    return { duplicate: false };
  }

  /** A declined card or an expired session: recorded on the checkout; no credit moves. */
  async function markUnpaid(event: PaymentEvent, checkout: CheckoutRow, status: 'declined' | 'expired'): Promise<{ duplicate: boolean }> {
    const outcome = await once(async (tx) => {
      const now = new Date();
      if (!(await insertPaymentEventOnce(tx, { eventId: event.id, type: event.type, checkoutId: checkout.id, outcome: status, receivedAt: now }))) return 'replay';
      const row = await lockCheckout(tx, checkout.id);
      if (!row || row.status === 'paid' || row.status === 'expired') return 'ignored';
      const failureMessage = status === 'declined' ? (event.object.last_payment_error?.message ?? 'The card was declined.').slice(0, 500) : 'The checkout expired before it was paid.';
      await updateCheckout(tx, row.id, { status, failureMessage });
      await recordAudit(tx, { departmentId: row.departmentId, actorUserId: row.createdByUserId, action: `billing.payment_${status}`, target: row.id, detail: { eventId: event.id } });
      return 'recorded';
    });
    return { duplicate: outcome === 'replay' || outcome === 'already-done' };
  }

  return {
    runBilling,
    settleRun,
    balanceOf,

    balance: (auth: RequestAuth) => balanceOf(departmentOf(auth).id),

    packs: () => CREDIT_PACKS.map(({ id, name, credits, unitAmount, currency }) => ({ id, name, credits, unitAmount, currency })),

    async quote(auth: RequestAuth, systems: number): Promise<QuoteResponse> {
      const balance = await balanceOf(departmentOf(auth).id);
      const quote = quoteRun(systems, balance.freeSystemsLeft);
      return {
        ...quote,
        balance: balance.credits,
        balanceAfter: balance.credits - quote.credits,
        freeSystemsLeft: balance.freeSystemsLeft,
        freeSystemsLeftAfter: balance.freeSystemsLeft - quote.freeSystemsUsed,
        sufficient: quote.credits <= balance.credits,
      };
    },

    async ledger(auth: RequestAuth, page: number, pageSize: number) {
      const { rows, total } = await listLedger(db, departmentOf(auth).id, page, pageSize);
      const entries: LedgerEntry[] = rows.map(({ entry, actorName, scenarioName, packId }) => ({
        id: entry.id, at: entry.createdAt.toISOString(), kind: entry.kind, credits: entry.credits, freeSystems: entry.freeSystems,
        balanceAfter: entry.balanceAfter, period: entry.period, runId: entry.runId, checkoutId: entry.checkoutId, actorName,
        description: [KIND_TEXT[entry.kind], scenarioName, entry.reason ?? (packId ? findPack(packId)?.name : null)].filter(Boolean).join(' · '),
      }));
      return { entries, page: { page, pageSize, total } };
    },

    /** Starts a hosted checkout for a pack (admins). The browser goes to `url`; the webhook credits. */
    async startCheckout(auth: RequestAuth, packId: string): Promise<{ url: string; checkoutId: string }> {
      const pack = findPack(packId);
      if (!pack) throw unknownPack(packId, CREDIT_PACKS.map((p) => p.id));
      const department = departmentOf(auth);
      const id = newId();
      await insertCheckout(db, {
        id, departmentId: department.id, packId: pack.id, credits: pack.credits, unitAmount: pack.unitAmount, currency: pack.currency,
        status: 'open', createdByUserId: auth.user.id, createdAt: new Date(),
      });
      try {
        const customerId = await customerFor(auth, department);
        const back = `${base}/credits?checkout=${id}`;
        const session = await payments.createCheckoutSession({
          checkoutId: id, pack, customerId, successUrl: back, cancelUrl: `${back}&cancelled=1`,
          metadata: { checkoutId: id, departmentId: department.id, packId: pack.id },
        });
        await updateCheckout(db, id, { sessionId: session.id });
        await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'billing.checkout_started', target: id, detail: { packId: pack.id, sessionId: session.id } });
        return { url: session.url, checkoutId: id };
      } catch (error) {
        await updateCheckout(db, id, { status: 'failed', failureMessage: 'The payment service could not start the checkout.' });
        throw error instanceof AppError ? error : paymentUnavailable(error);
      }
    },

    /** One checkout of the department, with whether the service already reports it paid (the webhook may be on its way). */
    async checkout(auth: RequestAuth, id: string) {
      const [row] = await listCheckouts(db, departmentOf(auth).id, { id });
      if (!row) throw checkoutNotFound();
      let paymentReceived = row.checkout.status === 'paid';
      if (!paymentReceived && row.checkout.sessionId && row.checkout.status !== 'failed') {
        paymentReceived = await payments
          .retrieveSession(row.checkout.sessionId)
          .then((s) => s.paymentStatus === 'paid')
          .catch(() => false);
      }
      return { ...toCheckout(row), paymentReceived };
    },

    async receipts(auth: RequestAuth): Promise<Checkout[]> {
      return (await listCheckouts(db, departmentOf(auth).id, { status: 'paid' })).map(toCheckout);
    },

    /** The webhook: verified on the raw body; each event id is handled once; a bad signature changes nothing. */
    async handleWebhook(rawBody: unknown, signature: string | undefined): Promise<{ received: true; duplicate?: boolean }> {
      if (!Buffer.isBuffer(rawBody) || rawBody.length === 0 || !signature) throw notRawWebhook();
      let event: PaymentEvent;
      try {
        event = payments.verifyEvent(rawBody, signature);
      } catch {
        throw badSignature();
      }
      const checkoutId = event.object.metadata?.checkoutId;
      const checkout = checkoutId ? await findCheckout(db, checkoutId) : undefined;
      const record = async (outcome: string) => ({ received: true as const, duplicate: !(await insertPaymentEventOnce(db, { eventId: event.id, type: event.type, checkoutId: checkout?.id ?? null, outcome, receivedAt: new Date() })) });
      if (!checkout) return record(checkoutId ? 'unknown_checkout' : 'ignored');
      switch (event.type) {
        case 'checkout.session.completed':
        case 'checkout.session.async_payment_succeeded':
          if (event.object.payment_status !== 'paid') return record('awaiting_payment');
          return { received: true, ...(await creditPurchase(event, checkout)) };
        case 'payment_intent.payment_failed':
        case 'checkout.session.async_payment_failed':
          return { received: true, ...(await markUnpaid(event, checkout, 'declined')) };
        case 'checkout.session.expired':
          return { received: true, ...(await markUnpaid(event, checkout, 'expired')) };
        default:
          return record('ignored');
      }
    },

    /**
     * An operator's correction of a department's balance, with a reason (there is deliberately no
     * route for it: a department admin must not be able to mint credit). Audited.
     */
    async adjust(input: { departmentId: string; credits: number; reason: string; actorUserId?: string | null }): Promise<number> {
      if (!Number.isSafeInteger(input.credits) || input.credits === 0) throw badRequest(`credits must be a non-zero whole number (got ${input.credits})`, 'credits');
      const reason = input.reason.trim();
      if (reason.length < 3 || reason.length > 500) throw badRequest('reason must be 3 to 500 characters: say why the balance changes', 'reason');
      return db.transaction(async (tx) => {
        const now = new Date();
        const account = await lockForChange(tx, input.departmentId, now);
        if (account.balanceCredits + input.credits < 0) throw wouldOverdraw(account.balanceCredits, input.credits);
        const after = await apply(tx, account, {
          kind: 'adjustment', credits: input.credits, freeSystems: 0, period: account.allowancePeriod!, actorUserId: input.actorUserId ?? null,
          reason, idempotencyKey: `adjustment:${newId()}`,
        }, now);
        await recordAudit(tx, { departmentId: input.departmentId, actorUserId: input.actorUserId ?? null, action: 'billing.adjustment', detail: { credits: input.credits, reason } });
        return after.balanceCredits;
      });
    },
  };
}

export type BillingService = ReturnType<typeof createBillingService>;
