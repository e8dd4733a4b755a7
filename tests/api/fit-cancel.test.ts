/**
 * Cancelling fits, implied-occurrence questions (a fit underneath) and sweeps: the whole
 * reservation comes back exactly once, the chunks computed so far are discarded (no posterior,
 * no resume), a second cancel is a clear 409, and the same rules on whose job it is as for runs
 * (owner or a modeller; another department's job does not exist for the caller).
 */
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { balanceOf, ledgerCheck } from '../support/billing.ts';
import { checkScenario, createScenario, waitForFit } from '../support/runs.ts';
import { addMember, createTestApp, signUp, signUpWithoutMail, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
let admin: Awaited<ReturnType<typeof signUp>>;
let modeller: { agent: request.Agent };
let observer: { agent: request.Agent };
let outsider: { agent: request.Agent };
let scenarioId: string;
const START_CREDITS = 100;

beforeAll(async () => {
  // No free allowance, so that every system of a fit costs credit and the refund is visible in credits.
  ctx = await createTestApp({ FREE_SYSTEMS_PER_MONTH: 0 });
  admin = await signUp(ctx.app);
  modeller = await addMember(ctx, admin.me.department.id, 'modeller');
  observer = await addMember(ctx, admin.me.department.id, 'observer');
  outsider = await signUpWithoutMail(ctx);
  await ctx.tidefield.billing.adjust({
    departmentId: admin.me.department.id,
    credits: START_CREDITS,
    reason: 'credit for the cancel tests',
  });
  scenarioId = await createScenario(modeller.agent, checkScenario({ seed: 'cancel' }));
}, 60_000);
afterAll(() => ctx?.close());

type Entry = { runId: string | null; kind: string; credits: number };
async function entriesOf(runId: string): Promise<[string, number][]> {
  const ledger: Entry[] = (await admin.agent.get('/api/billing/ledger?pageSize=100').expect(200)).body.entries;
  return ledger
    .filter((e) => e.runId === runId)
    .map((e): [string, number] => [e.kind, e.credits])
    .sort();
}

async function until<T>(what: string, read: () => Promise<T>, done: (x: T) => boolean, timeoutMs = 60_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const x = await read();
    if (done(x)) return x;
    if (Date.now() > deadline)
      throw new Error(`${what}: still ${JSON.stringify(x).slice(0, 300)} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('cancelling a fit', () => {
  it('refunds the whole reservation once, keeps no posterior, and answers a second cancel with 409', async () => {
    // 4 grid points × 2×10^7 systems = 8×10^7 systems; the price list (shared/contracts/pricing.ts) is
    // one credit per 10^7 systems, so 8 credits are reserved at once.
    const created = await modeller.agent
      .post('/api/fits')
      .send({
        scenarioId,
        constraintSetId: 'library',
        systems: 20_000_000,
        parameters: [{ path: 'envelope.alpha', min: 0.1, max: 1, points: 4 }],
      })
      .expect(201);
    const id = created.body.id as string;
    const queued = (await modeller.agent.get(`/api/fits/${id}`).expect(200)).body;
    expect(queued.costCredits).toBe(8);
    expect(await balanceOf(admin.agent)).toMatchObject({ credits: START_CREDITS - 8, reservedCredits: 8 });

    // Cancel while it computes: wait for the first chunk of the one pass.
    const running = await until(
      'the fit to compute a chunk',
      async () => (await modeller.agent.get(`/api/fits/${id}`).expect(200)).body,
      (f) => f.chunksDone > 0 || (f.status !== 'queued' && f.status !== 'running'),
    );
    expect(running.status).toBe('running');

    // Not the observer's fit, and not the other department's at all (the same 404 as an unknown id).
    const refused = await observer.agent.post(`/api/fits/${id}/cancel`).expect(403);
    expect(refused.body.error.message).toMatch(/owner or a modeller/);
    await outsider.agent.post(`/api/fits/${id}/cancel`).expect(404);
    await outsider.agent.post('/api/fits/no-such-fit/cancel').expect(404);

    const cancelled = (await modeller.agent.post(`/api/fits/${id}/cancel`).expect(200)).body;
    expect(cancelled.status).toBe('cancelled');
    expect(cancelled.chunksDone).toBeGreaterThan(0);
    expect(cancelled.chunksDone).toBeLessThan(cancelled.chunkCount);

    const detail = await waitForFit(modeller.agent, id);
    expect(detail).toMatchObject({ status: 'cancelled', posterior: null, methods: null });
    await modeller.agent.get(`/api/fits/${id}/methods.txt`).expect(409);
    // The checkpoint is discarded on cancel: nothing to resume from.
    await modeller.agent.post(`/api/fits/${id}/resume`).expect(409);

    // The 8 credits came back once: one reservation, one refund, and the ledger adds up to the account.
    expect(await entriesOf(detail.runId)).toEqual([
      ['refund', 8],
      ['reservation', -8],
    ]);
    expect(await balanceOf(admin.agent)).toMatchObject({ credits: START_CREDITS, reservedCredits: 0 });

    const again = await modeller.agent.post(`/api/fits/${id}/cancel`).expect(409);
    expect(again.body.error.message).toBe(
      'The fit has already been cancelled; only a queued or running fit can be cancelled.',
    );
    expect(await entriesOf(detail.runId)).toEqual([
      ['refund', 8],
      ['reservation', -8],
    ]);
    const check = await ledgerCheck(ctx, admin.me.department.id);
    expect(check).toMatchObject({ total: START_CREDITS, account: START_CREDITS });
  }, 120_000);

  it('lets an observer cancel their own implied-occurrence question (a fit underneath), with the same refund', async () => {
    const sample = (
      await observer.agent
        .post('/api/samples')
        .send({ name: 'Forty of four hundred (illustrative)', magnetic: 40, total: 400 })
        .expect(201)
    ).body;
    // The observer's cap is 10^6 systems per value of m; 129 values × 10^6 = 1.29×10^8 systems → 13 credits (rounded up).
    const started = (
      await observer.agent
        .post('/api/implied-occurrence')
        .send({ scenarioId, sampleId: sample.id, systems: 1_000_000 })
        .expect(201)
    ).body;
    const fit = (await observer.agent.get(`/api/fits/${started.fitId}`).expect(200)).body;
    expect(fit.costCredits).toBe(13);
    const cancelled = (await observer.agent.post(`/api/fits/${started.fitId}/cancel`).expect(200)).body;
    expect(cancelled.status).toBe('cancelled');
    const answer = (await observer.agent.get(`/api/implied-occurrence/${started.fitId}`).expect(200)).body;
    expect(answer).toMatchObject({ status: 'cancelled', confidence: null, credible: null });
    expect(await entriesOf(started.runId)).toEqual([
      ['refund', 13],
      ['reservation', -13],
    ]);
    expect((await balanceOf(admin.agent)).credits).toBe(START_CREDITS);
    await observer.agent.post(`/api/fits/${started.fitId}/cancel`).expect(409);
  }, 120_000);
});

describe('cancelling a sweep', () => {
  it('refunds every point once and answers a second cancel with 409', async () => {
    // 2 points, each its own run reserving 2×10^7 systems = 2 credits.
    const sweep = (
      await modeller.agent
        .post('/api/sweeps')
        .send({ scenarioId, systems: 20_000_000, axes: [{ path: 'envelope.alpha', values: [0.2, 0.8] }] })
        .expect(201)
    ).body;
    expect((await balanceOf(admin.agent)).credits).toBe(START_CREDITS - 4);
    const cancelled = (await modeller.agent.post(`/api/sweeps/${sweep.id}/cancel`).expect(200)).body;
    expect(cancelled.status).toBe('cancelled');
    const detail = (await modeller.agent.get(`/api/sweeps/${sweep.id}`).expect(200)).body;
    for (const point of detail.points)
      expect(await entriesOf(point.runId)).toEqual([
        ['refund', 2],
        ['reservation', -2],
      ]);
    expect((await balanceOf(admin.agent)).credits).toBe(START_CREDITS);
    const again = await modeller.agent.post(`/api/sweeps/${sweep.id}/cancel`).expect(409);
    expect(again.body.error.message).toBe(
      'The sweep is already cancelled; only a queued or running sweep can be cancelled.',
    );
    expect((await balanceOf(admin.agent)).credits).toBe(START_CREDITS);
  }, 120_000);
});
