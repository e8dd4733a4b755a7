/**
 * Faults in the run pipeline: the database going away while a run finishes, a run left
 * "running" with no live executor, and a batch that keeps failing on its worker thread.
 * This file runs its own private MariaDB, which it stops and starts; the suite's shared
 * server is never touched.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureMariaDb, findFreePort, stopMariaDb, type DbConnection } from '../../scripts/mariadb.ts';
import type { BatchDone, ChunkExecutor, ExecuteRequest } from '../../server/engine-pool/chunk-executor.ts';
import { createEnginePool } from '../../server/engine-pool/engine-pool.ts';
import { createPoolExecutor } from '../../server/engine-pool/pool-executor.ts';
import { creditLedger } from '../../server/modules/billing/billing.table.ts';
import { runCheckpointPoints, runCheckpoints, runs } from '../../server/modules/runs/runs.table.ts';
import request from 'supertest';
import { parseScenario } from '../../shared/contracts/scenario.ts';
import { prepareScenario } from '../../shared/engine/kernel/prepare.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { addTallyInto } from '../../shared/engine/kernel/tally.ts';
import { saveCheckpoint } from '../../server/modules/runs/runs.repository.ts';
import { createTestApp, GOOD_PASSWORD, restartApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForFit, waitForRun } from '../support/runs.ts';

let stateDir: string;
let dbServer: DbConnection;
const startDb = (port: number) => ensureMariaDb({ stateDir, port, database: 'tidefield_faults', appUser: 'tidefield_faults', grantAll: true, log: () => {} });

beforeAll(async () => {
  stateDir = mkdtempSync(path.join(os.tmpdir(), 'tidefield-faults-db-'));
  dbServer = await startDb(await findFreePort());
}, 120_000);

afterAll(async () => {
  await stopMariaDb(stateDir, () => {});
  rmSync(stateDir, { recursive: true, force: true });
});

/** The real pool executor, with a hook that runs before the last batch of a chosen run is handed over. */
function executorWithHook(pool: ReturnType<typeof createEnginePool>, beforeLastBatch: (runId: string) => Promise<void>): ChunkExecutor {
  const inner = createPoolExecutor({ pool });
  return {
    kind: 'embedded',
    async *execute(request: ExecuteRequest): AsyncGenerator<BatchDone> {
      let left = request.pending.length;
      for await (const done of inner.execute(request)) {
        left -= done.chunks.length;
        if (left === 0) await beforeLastBatch(request.runId);
        yield done;
      }
    },
    close: () => inner.close(),
  };
}

describe('a run that finishes while MariaDB is down (issue: runs stuck "running" after a database outage)', () => {
  let ctx: TestContext;
  const pool = createEnginePool({ workers: 2 });
  let outageRunId: string | null = null;
  let stopped: () => void;
  const databaseStopped = new Promise<void>((resolve) => (stopped = resolve));

  beforeAll(async () => {
    const executor = executorWithHook(pool, async (runId) => {
      if (runId !== outageRunId) return;
      await stopMariaDb(stateDir, () => {});
      stopped();
    });
    ctx = await createTestApp({}, { executor, schedulerTiming: { saveRetry: { firstDelayMs: 100, maxDelayMs: 1000 } } }, dbServer);
  });

  afterAll(async () => {
    await ctx.close();
    await pool.destroy();
  });

  it('saves the result and settles once after the database is back, with the counts of an uninterrupted run', async () => {
    const modeller = await signUp(ctx.app);
    const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 400_000 }));
    const body = { scenarioId, seed: 'outage' };
    const reference = await modeller.agent.post('/api/runs').send(body).expect(201);
    expect((await waitForRun(modeller.agent, reference.body.id)).status).toBe('succeeded');

    const started = await modeller.agent.post('/api/runs').send(body).expect(201);
    outageRunId = started.body.id as string;
    await databaseStopped;
    // Let the scheduler fail to save a few times, then bring the same server back on its port.
    await new Promise((r) => setTimeout(r, 2500));
    await startDb(dbServer.port);

    const finished = await waitForRun(modeller.agent, outageRunId, 60_000);
    expect(finished.status).toBe('succeeded');
    const a = (await modeller.agent.get(`/api/runs/${outageRunId}/result`).expect(200)).body;
    const b = (await modeller.agent.get(`/api/runs/${reference.body.id}/result`).expect(200)).body;
    expect(a.counts).toEqual(b.counts);
    expect(a.bins).toEqual(b.bins);
    // Exactly one settlement (it follows the status change, so wait for it), never a refund.
    const kinds = async () => (await ctx.database.db.select().from(creditLedger).where(eq(creditLedger.runId, outageRunId!))).map((e) => e.kind).sort();
    await expect.poll(kinds, { timeout: 10_000 }).toEqual(['reservation', 'settlement']);
    await new Promise((r) => setTimeout(r, 500));
    expect(await kinds()).toEqual(['reservation', 'settlement']);
    expect(await ctx.database.db.select().from(runCheckpoints).where(eq(runCheckpoints.runId, outageRunId))).toEqual([]);
  }, 120_000);
});

describe('the watchdog (issue: a run never stays running without a live executor)', () => {
  it('re-queues a running run whose lease lapsed and resumes it from its checkpoint', async () => {
    const ctx = await createTestApp({}, { schedulerTiming: { pollIntervalMs: 100, leaseMs: 500 } }, dbServer);
    try {
      const modeller = await signUp(ctx.app);
      const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 400_000 }));
      const reference = await modeller.agent.post('/api/runs').send({ scenarioId, seed: 'orphan' }).expect(201);
      await waitForRun(modeller.agent, reference.body.id);
      // A run that another app instance claimed and lost (killed): running, a lapsed lease, and a checkpoint of chunks 0–2.
      await ctx.tidefield.scheduler.stop();
      const orphan = await modeller.agent.post('/api/runs').send({ scenarioId, seed: 'orphan' }).expect(201);
      const row = (await ctx.database.db.select().from(runs).where(eq(runs.id, orphan.body.id)))[0]!;
      const prepared = prepareScenario(parseScenario(row.snapshot));
      const partial = runChunk(prepared, 0);
      for (const chunk of [1, 2]) addTallyInto(partial, runChunk(prepared, chunk));
      await saveCheckpoint(ctx.database.db, row.id, JSON.stringify(partial), [[0, 2]]);
      await ctx.database.db.update(runs).set({ status: 'running', leaseUntil: new Date(Date.now() - 1000) }).where(eq(runs.id, row.id));
      await ctx.tidefield.scheduler.start();
      const finished = await waitForRun(modeller.agent, row.id, 60_000);
      expect(finished).toMatchObject({ status: 'succeeded', resumes: 1 });
      const a = (await modeller.agent.get(`/api/runs/${row.id}/result`).expect(200)).body;
      const b = (await modeller.agent.get(`/api/runs/${reference.body.id}/result`).expect(200)).body;
      expect(a.counts).toEqual(b.counts);
      expect(a.bins).toEqual(b.bins);
    } finally {
      await ctx.close();
    }
  }, 120_000);
});

describe('a batch that keeps failing on its worker thread (issue: a worker crash fails the whole run)', () => {
  it('fails the run after two retries keeping its checkpoint; resume continues from it to the uninterrupted counts', async () => {
    const fixture = new URL('../../server/engine-pool/failing-chunk-task.fixture.mjs', import.meta.url).href;
    const failing = createEnginePool({ workers: 2, filename: fixture });
    const ctx = await createTestApp({}, { pool: failing }, dbServer);
    let mended: ReturnType<typeof createEnginePool> | undefined;
    let restarted: Awaited<ReturnType<typeof restartApp>> | undefined;
    try {
      const modeller = await signUp(ctx.app);
      const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 400_000 }));
      const bad = await modeller.agent.post('/api/runs').send({ scenarioId, seed: 'crash' }).expect(201);
      const failed = await waitForRun(modeller.agent, bad.body.id);
      expect(failed.status).toBe('failed');
      expect(failed.error).toMatch(/deliberate failure in chunk 3.*3 attempts/);
      const [checkpoint] = await ctx.database.db.select().from(runCheckpoints).where(eq(runCheckpoints.runId, bad.body.id));
      const kept = checkpoint!.doneChunks.reduce((n, [first, last]) => n + last - first + 1, 0);
      expect(kept).toBeGreaterThan(0);
      expect(kept).toBeLessThan(failed.chunkCount as number);
      // Refunded once (settlement follows the status change, so wait for it).
      const refunds = async () => ctx.database.db.select().from(creditLedger).where(and(eq(creditLedger.runId, bad.body.id), eq(creditLedger.kind, 'refund')));
      await expect.poll(refunds, { timeout: 10_000 }).toHaveLength(1);

      // Mended: the same app data on a pool whose first try at chunk 3 kills its thread (retried on a fresh one).
      await ctx.tidefield.scheduler.stop();
      process.env.TIDEFIELD_FIXTURE_CRASH_ONCE = path.join(stateDir, `crash-once-${bad.body.id}`);
      mended = createEnginePool({ workers: 2, filename: fixture });
      restarted = await restartApp(ctx, { pool: mended });
      const agent = request.agent(restarted.app);
      await agent.post('/api/auth/sign-in').send({ email: modeller.email, password: GOOD_PASSWORD }).expect(200);
      const resumed = await agent.post(`/api/runs/${bad.body.id}/resume`).expect(201);
      expect((await waitForRun(agent, resumed.body.id)).status).toBe('succeeded');
      await agent.post(`/api/runs/${resumed.body.id}/resume`).expect(409);
      const reference = await agent.post('/api/runs').send({ scenarioId, seed: 'crash' }).expect(201);
      expect((await waitForRun(agent, reference.body.id)).status).toBe('succeeded');
      const a = (await agent.get(`/api/runs/${resumed.body.id}/result`).expect(200)).body;
      const b = (await agent.get(`/api/runs/${reference.body.id}/result`).expect(200)).body;
      expect(a.counts).toEqual(b.counts);
      expect(a.bins).toEqual(b.bins);
    } finally {
      delete process.env.TIDEFIELD_FIXTURE_CRASH_ONCE;
      await restarted?.close();
      await ctx.close();
      await mended?.destroy();
      await failing.destroy();
    }
  }, 180_000);
});

describe('a fit and a sweep whose jobs fail midway (issue 14: a failed multi-point job could not be resumed)', () => {
  it('resumes from its checkpoint, computing only the missing chunks, to the counts of an uninterrupted fit, charged once', async () => {
    const fixture = new URL('../../server/engine-pool/failing-chunk-task.fixture.mjs', import.meta.url).href;
    const failing = createEnginePool({ workers: 2, filename: fixture });
    const ctx = await createTestApp({}, { pool: failing }, dbServer);
    let mended: ReturnType<typeof createEnginePool> | undefined;
    let restarted: Awaited<ReturnType<typeof restartApp>> | undefined;
    try {
      const admin = await signUp(ctx.app);
      const scenarioId = await createScenario(admin.agent, checkScenario({ systems: 400_000 }));
      const set = await admin.agent
        .post('/api/constraint-sets')
        .send({ name: 'One survey (illustrative)', constraints: [{ kind: 'fraction', magnetic: 20, total: 400, label: 'Illustrative survey', citation: 'Invented for this test' }] })
        .expect(201);
      const body = { scenarioId, constraintSetId: set.body.id, seed: 'fit-crash', parameters: [{ path: 'companions.multiplier', min: 0.5, max: 3, points: 3 }] };
      const created = await admin.agent.post('/api/fits').send(body).expect(201);
      const sweepBody = { scenarioId, seed: 'sweep-crash', axes: [{ path: 'giant.reachAU', values: [0.5, 3] }] };
      const sweep = await admin.agent.post('/api/sweeps').send(sweepBody).expect(201);
      const failed = await waitForFit(admin.agent, created.body.id);
      expect(failed.status).toBe('failed');
      expect(failed.error).toMatch(/deliberate failure in chunk 3.*3 attempts/);
      const failedRunId = failed.runId as string;
      const [checkpoint] = await ctx.database.db.select().from(runCheckpoints).where(eq(runCheckpoints.runId, failedRunId));
      const kept = checkpoint!.doneChunks.reduce((n, [first, last]) => n + last - first + 1, 0);
      expect(kept).toBeGreaterThan(0);
      expect(kept).toBeLessThan(7);
      // One row per grid point, not one document for the whole job.
      expect(await ctx.database.db.select({ point: runCheckpointPoints.point }).from(runCheckpointPoints).where(eq(runCheckpointPoints.runId, failedRunId))).toHaveLength(3);
      const ledgerOf = (runId: string) => ctx.database.db.select().from(creditLedger).where(eq(creditLedger.runId, runId));
      await expect.poll(async () => (await ledgerOf(failedRunId)).map((e) => e.kind).sort(), { timeout: 10_000 }).toEqual(['refund', 'reservation']);

      const sweepStatuses = async () => ((await admin.agent.get(`/api/sweeps/${sweep.body.id}`).expect(200)).body.points as { status: string }[]).map((p) => p.status);
      await expect.poll(sweepStatuses, { timeout: 60_000 }).toEqual(['failed', 'failed']);

      // Mended: the same data on a pool whose first try at chunk 3 kills its thread; an executor that records what it was asked to compute.
      await ctx.tidefield.scheduler.stop();
      process.env.TIDEFIELD_FIXTURE_CRASH_ONCE = path.join(stateDir, `crash-once-fit-${failedRunId}`);
      mended = createEnginePool({ workers: 2, filename: fixture });
      const inner = createPoolExecutor({ pool: mended });
      const asked = new Map<string, number>();
      const executor: ChunkExecutor = {
        kind: 'embedded',
        execute(request: ExecuteRequest) {
          asked.set(request.runId, request.pending.length);
          return inner.execute(request);
        },
        close: () => inner.close(),
      };
      restarted = await restartApp(ctx, { executor });
      const agent = request.agent(restarted.app);
      await agent.post('/api/auth/sign-in').send({ email: admin.email, password: GOOD_PASSWORD }).expect(200);
      await agent.post(`/api/runs/${failedRunId}/resume`).expect(409); // a fit's run resumes through its fit
      const resumed = await agent.post(`/api/fits/${created.body.id}/resume`).expect(200);
      expect(['queued', 'running']).toContain(resumed.body.status);
      const done = await waitForFit(agent, created.body.id);
      expect(done.status).toBe('succeeded');
      expect(done.runId).not.toBe(failedRunId);
      expect(asked.get(done.runId)).toBe(7 - kept);
      await agent.post(`/api/fits/${created.body.id}/resume`).expect(409);

      // A sweep's job resumes the same way; its points stay in their places and equal an uninterrupted sweep's.
      const sweepPoints = async (id: string) => (await agent.get(`/api/sweeps/${id}`).expect(200)).body.points as { runId: string; status: string }[];
      const failedPoints = await sweepPoints(sweep.body.id);
      expect(failedPoints.map((p) => p.status)).toEqual(['failed', 'failed']);
      await agent.post(`/api/sweeps/${sweep.body.id}/resume`).expect(200);
      const rerun = (await agent.post('/api/sweeps').send(sweepBody).expect(201)).body.id as string;
      for (const id of [sweep.body.id, rerun]) await expect.poll(async () => (await sweepPoints(id)).map((p) => p.status), { timeout: 60_000 }).toEqual(['succeeded', 'succeeded']);
      const [resumedPoints, rerunPoints] = [await sweepPoints(sweep.body.id), await sweepPoints(rerun)];
      expect(resumedPoints.map((p) => p.runId)).not.toEqual(failedPoints.map((p) => p.runId));
      for (const i of [0, 1]) {
        const x = (await agent.get(`/api/runs/${resumedPoints[i].runId}/result`).expect(200)).body;
        const y = (await agent.get(`/api/runs/${rerunPoints[i].runId}/result`).expect(200)).body;
        expect(x.counts).toEqual(y.counts);
      }
      await agent.post(`/api/sweeps/${sweep.body.id}/resume`).expect(409);

      const reference = await waitForFit(agent, (await agent.post('/api/fits').send(body).expect(201)).body.id);
      expect(reference.status).toBe('succeeded');
      // Bit for bit: the first node's counts and every node's log-likelihood.
      const a = (await agent.get(`/api/runs/${done.runId}/result`).expect(200)).body;
      const b = (await agent.get(`/api/runs/${reference.runId}/result`).expect(200)).body;
      expect(a.counts).toEqual(b.counts);
      expect(a.bins).toEqual(b.bins);
      expect(done.posterior.logLikelihood).toEqual(reference.posterior.logLikelihood);
      expect(done.posterior.intervals).toEqual(reference.posterior.intervals);

      // Credit: the failed run's reservation came back whole; the resumed run reserved the whole grid once and kept it, as the uninterrupted fit did.
      const failedEntries = await ledgerOf(failedRunId);
      expect(failedEntries.reduce((s, e) => s + e.credits, 0)).toBe(0);
      expect(failedEntries.reduce((s, e) => s + e.freeSystems, 0)).toBe(0);
      await expect.poll(async () => (await ledgerOf(done.runId)).map((e) => e.kind).sort(), { timeout: 10_000 }).toEqual(['reservation', 'settlement']);
      const reservationOf = async (runId: string) => (await ledgerOf(runId)).find((e) => e.kind === 'reservation')!;
      const [mine, theirs] = [await reservationOf(done.runId), await reservationOf(reference.runId)];
      for (const entry of [mine, theirs]) expect(entry.reason).toMatch(new RegExp(`^${(3 * 400_000).toLocaleString('en-US')} systems:`));
    } finally {
      delete process.env.TIDEFIELD_FIXTURE_CRASH_ONCE;
      await restarted?.close();
      await ctx.close();
      await mended?.destroy();
      await failing.destroy();
    }
  }, 240_000);
});
