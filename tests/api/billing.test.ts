/**
 * Compute credit end to end: the stripe SDK against the local payment stand-in, signed
 * webhooks, the append-only ledger under row locks, reservations, settlements and refunds.
 */
import request from 'supertest';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createEnginePool } from '../../server/engine-pool/engine-pool.ts';
import { balanceOf, expectSelfContained, ledgerCheck, payOnStandIn, startCheckout } from '../support/billing.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';
import { findFreePort } from '../../scripts/mariadb.ts';
import { addMember, createTestApp, signUp, TEST_STRIPE_SECRETS, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
let admin: Awaited<ReturnType<typeof signUp>>;
let modeller: Awaited<ReturnType<typeof addMember>>;

beforeAll(async () => {
  // No free allowance here, so that every system costs credit.
  ctx = await createTestApp({ FREE_SYSTEMS_PER_MONTH: 0 });
  admin = await signUp(ctx.app, { name: 'Pat Admin' });
  modeller = await addMember(ctx, admin.me.department.id, 'modeller');
});
afterAll(() => ctx?.close());

const departmentId = () => admin.me.department.id;

describe('buying credit', () => {
  let checkoutId: string;

  it('goes from checkout through the stand-in page and the signed webhook to a balance that rises once, with a receipt e-mail', async () => {
    expect((await balanceOf(admin.agent)).credits).toBe(0);
    const packs = (await admin.agent.get('/api/billing/packs').expect(200)).body.packs;
    expect(packs.map((p: { id: string }) => p.id)).toContain('pack-100');

    const started = await startCheckout(admin.agent, 'pack-100');
    checkoutId = started.checkoutId;
    expect(started.url.startsWith(ctx.fakes.payment.url)).toBe(true);
    const page = await fetch(started.url);
    expect(page.status).toBe(200);
    expect(await page.text()).toMatch(/€20\.00/);
    expect((await admin.agent.get(`/api/billing/checkouts/${checkoutId}`).expect(200)).body.status).toBe('open');

    const paid = await payOnStandIn(started.url, 'success');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`${ctx.url}/credits?checkout=${checkoutId}`);

    expect((await balanceOf(admin.agent)).credits).toBe(100);
    const status = (await admin.agent.get(`/api/billing/checkouts/${checkoutId}`).expect(200)).body;
    expect(status).toMatchObject({ status: 'paid', credits: 100, paymentReceived: true });
    expect(status.receiptNumber).toMatch(/^TF-\d{8}-[0-9A-F]{8}$/);
    const ledger = (await admin.agent.get('/api/billing/ledger').expect(200)).body.entries;
    expect(ledger.filter((e: { kind: string }) => e.kind === 'purchase')).toHaveLength(1);
    expect((await admin.agent.get('/api/billing/receipts').expect(200)).body.receipts.map((r: { id: string }) => r.id)).toEqual([checkoutId]);

    const receipt = await ctx.fakes.mail.waitFor((m) => m.to.includes(admin.email) && m.subject.startsWith('Receipt'));
    expect(receipt.subject).toBe(`Receipt ${status.receiptNumber}: 100 Tidefield credits`);
    expect(receipt.text).toContain('Balance now: 100 credits');
    expect(receipt.text).toContain(`${ctx.url}/credits`);
    expectSelfContained(receipt);

    const [audit] = (await ctx.database.pool.query("select detail from audit_log where action = 'billing.purchase' and target = ?", [checkoutId])) as unknown as [{ detail: string }[]];
    expect(audit).toHaveLength(1);
    expect(await ledgerCheck(ctx, departmentId())).toMatchObject({ total: 100, account: 100 });
  });

  it('credits once when the same event is delivered twice', async () => {
    const event = ctx.fakes.payment.events().find((e) => e.type === 'checkout.session.completed')!;
    expect(await ctx.fakes.payment.redeliver(event.id)).toBe(200);
    // And by hand, with a fresh signature on the very same bytes.
    const header = new Stripe(TEST_STRIPE_SECRETS.apiKey).webhooks.generateTestHeaderString({ payload: event.payload, secret: TEST_STRIPE_SECRETS.webhookSecret });
    const again = await request(ctx.app).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', header).send(event.payload).expect(200);
    expect(again.body).toEqual({ received: true, duplicate: true });
    expect((await balanceOf(admin.agent)).credits).toBe(100);
    expect(await ledgerCheck(ctx, departmentId())).toMatchObject({ total: 100, account: 100 });
  });

  it('answers 400 to a bad signature and changes nothing', async () => {
    const event = ctx.fakes.payment.events().find((e) => e.type === 'checkout.session.completed')!;
    const signer = new Stripe(TEST_STRIPE_SECRETS.apiKey).webhooks;
    // A forged event (a new id, so no replay guard would catch it) signed with the wrong secret…
    const forged = event.payload.replace(event.id, 'evt_forged_1');
    const wrongSecret = signer.generateTestHeaderString({ payload: forged, secret: 'whsec_not_the_secret' });
    const res = await request(ctx.app).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', wrongSecret).send(forged).expect(400);
    expect(res.body.error.code).toBe('bad_signature');
    // …a good signature over other bytes…
    const goodHeader = signer.generateTestHeaderString({ payload: event.payload, secret: TEST_STRIPE_SECRETS.webhookSecret });
    await request(ctx.app).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', goodHeader).send(forged).expect(400);
    // …and no signature at all.
    await request(ctx.app).post('/api/billing/webhook').set('content-type', 'application/json').send(forged).expect(400);
    const [events] = (await ctx.database.pool.query("select count(*) as n from payment_events where event_id = 'evt_forged_1'")) as unknown as [{ n: number }[]];
    expect(Number(events[0].n)).toBe(0);
    expect((await balanceOf(admin.agent)).credits).toBe(100);
  });

  it('credits nothing for a declined card, and the same checkout can still be paid', async () => {
    const { url, checkoutId: declinedId } = await startCheckout(admin.agent, 'pack-500');
    const declined = await payOnStandIn(url, 'declined');
    expect(declined.status).toBe(402);
    expect(await declined.text()).toMatch(/declined/);
    const status = (await admin.agent.get(`/api/billing/checkouts/${declinedId}`).expect(200)).body;
    expect(status).toMatchObject({ status: 'declined', paymentReceived: false, receiptNumber: null });
    expect(status.failureMessage).toMatch(/declined/i);
    expect((await balanceOf(admin.agent)).credits).toBe(100);

    expect((await payOnStandIn(url, 'success')).status).toBe(303);
    expect((await balanceOf(admin.agent)).credits).toBe(600);
    // Put the department back where the tests below expect it.
    await ctx.tidefield.billing.adjust({ departmentId: departmentId(), credits: -500, reason: 'test: back to 100 credits' });
    expect(await ledgerCheck(ctx, departmentId())).toMatchObject({ total: 100, account: 100 });
  });

  it('marks a checkout that expires unpaid, and credits nothing', async () => {
    const { checkoutId: id } = await startCheckout(admin.agent, 'pack-100');
    const [rows] = (await ctx.database.pool.query('select session_id from credit_checkouts where id = ?', [id])) as unknown as [{ session_id: string }[]];
    const service = new Stripe(TEST_STRIPE_SECRETS.apiKey, { host: ctx.fakes.payment.host, port: ctx.fakes.payment.port, protocol: 'http', maxNetworkRetries: 0 });
    await service.checkout.sessions.expire(rows[0].session_id);
    await expect.poll(async () => (await admin.agent.get(`/api/billing/checkouts/${id}`).expect(200)).body.status).toBe('expired');
    expect((await balanceOf(admin.agent)).credits).toBe(100);
  });

  it('lets only admins buy, and refuses unknown packs by name', async () => {
    for (const agent of [modeller.agent]) {
      const res = await agent.post('/api/billing/checkout').send({ packId: 'pack-100' }).expect(403);
      expect(res.body.error.code).toBe('forbidden');
      await agent.get('/api/billing/ledger').expect(403);
    }
    const observer = await addMember(ctx, departmentId(), 'observer');
    await observer.agent.post('/api/billing/checkout').send({ packId: 'pack-100' }).expect(403);
    await request(ctx.app).post('/api/billing/checkout').send({ packId: 'pack-100' }).expect(401);
    const unknown = await admin.agent.post('/api/billing/checkout').send({ packId: 'pack-7' }).expect(400);
    expect(unknown.body.error).toMatchObject({ field: 'packId' });
    expect(unknown.body.error.message).toMatch(/pack-100, pack-500, pack-2000/);
    // Members may still read the balance and ask what a run would cost.
    expect((await modeller.agent.get('/api/billing/quote?systems=200000000').expect(200)).body).toMatchObject({ credits: 20, balance: 100, balanceAfter: 80, sufficient: true });
    const bad = await modeller.agent.get('/api/billing/quote?systems=12').expect(400);
    expect(bad.body.error.field).toBe('systems');
  });

  it('refuses an adjustment that would overdraw, and one without a reason', async () => {
    await expect(ctx.tidefield.billing.adjust({ departmentId: departmentId(), credits: -101, reason: 'too much' })).rejects.toMatchObject({ code: 'would_overdraw' });
    await expect(ctx.tidefield.billing.adjust({ departmentId: departmentId(), credits: 5, reason: ' ' })).rejects.toMatchObject({ field: 'reason' });
    expect((await balanceOf(admin.agent)).credits).toBe(100);
  });
});

describe('runs against the balance', () => {
  let scenarioId: string;

  beforeAll(async () => {
    scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 100_000 }));
    // Keep every run queued: these tests are about money, not physics.
    await ctx.tidefield.scheduler.stop();
  });
  afterAll(() => ctx.tidefield.scheduler.start());

  it('queues exactly 5 of 20 concurrent runs when the balance covers 5, and ends at zero, never below', async () => {
    expect((await balanceOf(admin.agent)).credits).toBe(100);
    // 2 × 10^8 systems at one credit per 10^7 = 20 credits each; 100 credits cover five.
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) => modeller.agent.post('/api/runs').send({ scenarioId, systems: 200_000_000, seed: `race-${i}` })),
    );
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(5);
    expect(statuses.filter((s) => s === 402)).toHaveLength(15);
    const refused = answers.find((a) => a.status === 402)!;
    expect(refused.body.error).toMatchObject({ code: 'insufficient_credit', field: 'systems' });
    expect(refused.body.error.message).toMatch(/costs 20 credits .* has 0 credits/);

    const [queued] = (await ctx.database.pool.query("select count(*) as n, sum(cost_credits) as cost from runs where department_id = ? and status = 'queued'", [departmentId()])) as unknown as [
      { n: number; cost: string }[],
    ];
    expect(Number(queued[0].n)).toBe(5);
    expect(Number(queued[0].cost)).toBe(100);
    const balance = await balanceOf(admin.agent);
    expect(balance).toMatchObject({ credits: 0, reservedCredits: 100 });
    const check = await ledgerCheck(ctx, departmentId());
    expect(check.total).toBe(0);
    expect(check.account).toBe(0);
    expect(check.lowest).toBeGreaterThanOrEqual(0);
  });

  it('refuses a run it cannot pay with 402 and queues nothing, and a sweep reserves its whole grid or nothing', async () => {
    const before = await ledgerCheck(ctx, departmentId());
    const res = await modeller.agent.post('/api/runs').send({ scenarioId, systems: 1000 }).expect(402);
    expect(res.body.error.message).toMatch(/costs 1 credit /);
    const sweep = await modeller.agent
      .post('/api/sweeps')
      .send({ scenarioId, axes: [{ path: 'giant.reachAU', values: [1, 2, 3] }], systems: 2000 })
      .expect(402);
    expect(sweep.body.error.code).toBe('insufficient_credit');
    const [sweeps] = (await ctx.database.pool.query('select count(*) as n from sweeps where department_id = ?', [departmentId()])) as unknown as [{ n: number }[]];
    expect(Number(sweeps[0].n)).toBe(0);
    expect(await ledgerCheck(ctx, departmentId())).toEqual(before);
  });

  it('refunds a cancelled run once, even if settlement is asked for again', async () => {
    const list = (await modeller.agent.get('/api/runs?status=queued&pageSize=10').expect(200)).body.runs;
    const run = list[0];
    expect(run.costCredits).toBe(20);
    await modeller.agent.post(`/api/runs/${run.id}/cancel`).expect(200);
    expect((await balanceOf(admin.agent)).credits).toBe(20);
    // The settled hook firing again (or a settlement after the refund) changes nothing.
    const row = { id: run.id, departmentId: departmentId(), ownerUserId: modeller.userId } as never;
    expect(await ctx.tidefield.billing.settleRun(row, 'cancelled')).toBeNull();
    expect(await ctx.tidefield.billing.settleRun(row, 'succeeded')).toBeNull();
    expect((await balanceOf(admin.agent)).credits).toBe(20);
    const entries = (await admin.agent.get('/api/billing/ledger?pageSize=100').expect(200)).body.entries.filter((e: { runId: string }) => e.runId === run.id);
    expect(entries.map((e: { kind: string; credits: number }) => [e.kind, e.credits]).sort()).toEqual([['refund', 20], ['reservation', -20]]);
  });
});

describe('free allowance, settlement and failure refunds', () => {
  it('uses the month’s free systems first, keeps a finished run’s cost, and refunds a failed one', async () => {
    // The engine's fixture task: any batch holding chunk 3 throws (runs of ≤ 100 000 systems have chunks 0 and 1 only).
    const pool = createEnginePool({ workers: 2, filename: new URL('../../server/engine-pool/failing-chunk-task.fixture.mjs', import.meta.url).href });
    const own = await createTestApp({ FREE_SYSTEMS_PER_MONTH: 50_000 }, { pool });
    try {
      const boss = await signUp(own.app);
      const dept = boss.me.department.id;
      expect(await balanceOf(boss.agent)).toMatchObject({ credits: 0, freeSystemsLeft: 50_000 });
      expect((await boss.agent.get('/api/billing/quote?systems=100000').expect(200)).body).toMatchObject({
        freeSystemsUsed: 50_000, billableSystems: 50_000, credits: 1, sufficient: false, balanceAfter: -1,
      });
      await own.tidefield.billing.adjust({ departmentId: dept, credits: 3, reason: 'test: starting credit' });
      const id = await createScenario(boss.agent, checkScenario({ systems: 400_000 }));

      // 100 000 systems: 50 000 free, the rest costs one credit; it succeeds and the cost is kept.
      const good = await boss.agent.post('/api/runs').send({ scenarioId: id, systems: 100_000 }).expect(201);
      expect((await waitForRun(boss.agent, good.body.id)).status).toBe('succeeded');
      expect((await waitForRun(boss.agent, good.body.id)).costCredits).toBe(1);
      expect(await balanceOf(boss.agent)).toMatchObject({ credits: 2, freeSystemsLeft: 0, reservedCredits: 0 });

      // A run whose worker throws (400 000 systems reach chunk 3) fails, and its credit comes back.
      const bad = await boss.agent.post('/api/runs').send({ scenarioId: id }).expect(201);
      expect((await waitForRun(boss.agent, bad.body.id)).status).toBe('failed');
      await expect.poll(async () => (await balanceOf(boss.agent)).credits).toBe(2);
      const kinds = (await boss.agent.get('/api/billing/ledger?pageSize=100').expect(200)).body.entries.map((e: { kind: string }) => e.kind);
      expect(kinds.sort()).toEqual(['adjustment', 'allowance', 'refund', 'reservation', 'reservation', 'settlement']);
      expect(await ledgerCheck(own, dept)).toMatchObject({ total: 2, account: 2 });

      const failedMail = await own.fakes.mail.waitFor((m) => m.to.includes(boss.email) && m.subject.startsWith('Run failed'));
      expect(failedMail.text).toMatch(/1 credit was given back/);
      const finished = await own.fakes.mail.waitFor((m) => m.to.includes(boss.email) && m.subject.startsWith('Run finished'));
      expect(finished.text).toContain(`${own.url}/runs/${good.body.id}`);
      expectSelfContained(finished);
    } finally {
      await own.close();
      await pool.destroy();
    }
  });
});

describe('stand-ins down (issue 9, item 9)', () => {
  it('payment service down: checkout answers the 502 text written for it, not a generic 500', async () => {
    const closedPort = await findFreePort();
    const down = await createTestApp({ STRIPE_API_PORT: closedPort });
    try {
      const { agent } = await signUp(down.app);
      const res = await agent.post('/api/billing/checkout').send({ packId: 'pack-100' }).expect(502);
      expect(res.body.error.code).toBe('payment_unavailable');
      expect(res.body.error.message).toMatch(/nothing was charged/);
    } finally {
      await down.close();
    }
  });

  it('mail stand-in down: the outbox answers the 502 text written for it, not a generic 500', async () => {
    const closedPort = await findFreePort();
    const down = await createTestApp({ DEV_OUTBOX_URL: `http://127.0.0.1:${closedPort}` });
    try {
      const { agent } = await signUp(down.app);
      const res = await agent.get('/api/outbox').expect(502);
      expect(res.body.error.code).toBe('outbox_unavailable');
      expect(res.body.error.message).toMatch(/did not answer/);
    } finally {
      await down.close();
    }
  });
});
