/**
 * Scale-out: runs computed by `npm run worker` processes over BullMQ on the test setup's private
 * Redis give exactly what the embedded pool gives, survive a worker killed with SIGKILL and an
 * app restart without redoing finished batches, and cancel cleanly. This file uses its own
 * queue name, so it shares the Redis with no other file.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { Queue } from 'bullmq';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { WorkersResponse } from '../../shared/contracts/workers.ts';
import type { BatchDone, ChunkExecutor, ExecuteRequest } from '../../server/engine-pool/chunk-executor.ts';
import { createEnginePool } from '../../server/engine-pool/engine-pool.ts';
import { createPoolExecutor } from '../../server/engine-pool/pool-executor.ts';
import { jobIdOf, redisConnection, type ChunkJobData, type ChunkJobResult } from '../../server/scale-out/queue-names.ts';
import { checkScenario, createScenario, waitForFit, waitForRun } from '../support/runs.ts';
import { createTestApp, GOOD_PASSWORD, restartApp, signUp, type TestContext } from '../support/test-app.ts';

const WORKER_MAIN = fileURLToPath(new URL('../../server/scale-out/worker-main.ts', import.meta.url));
const redisUrl = inject('testRedisUrl');
const queueName = `tf-test-${randomBytes(4).toString('hex')}`;
const BATCH_CHUNKS = 2;
/** 40 chunks of 65,536 systems: 20 jobs of two chunks. */
const SYSTEMS = 40 * 65_536;
const JOBS = 20;

interface WorkerProcess {
  child: ChildProcess;
  exited: Promise<number | null>;
}

function startWorker(): WorkerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', WORKER_MAIN], {
    env: {
      ...process.env,
      REDIS_URL: redisUrl,
      TIDEFIELD_QUEUE: queueName,
      WORKER_THREADS: '1',
      // Short lock and stalled check, so a killed worker's job moves on within seconds (BullMQ's defaults are 30 s).
      WORKER_LOCK_MS: '2000',
      WORKER_STALLED_INTERVAL_MS: '1000',
      WORKER_HEARTBEAT_MS: '300',
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  return { child, exited };
}

async function stopWorker(worker: WorkerProcess): Promise<number | null> {
  if (worker.child.exitCode !== null || worker.child.signalCode !== null) return worker.child.exitCode;
  worker.child.kill('SIGTERM');
  return worker.exited;
}

let embedded: TestContext;
let scaled: TestContext;
let workers: WorkerProcess[] = [];
let queue: Queue<ChunkJobData, ChunkJobResult>;
let admin: Awaited<ReturnType<typeof signUp>>;
let scenarioId: string;
let reference: { counts: unknown; bins: unknown; fraction: unknown };

async function workerList(): Promise<WorkersResponse> {
  return (await admin.agent.get('/api/workers').expect(200)).body as WorkersResponse;
}
const jobsDoneTotal = async () => (await workerList()).workers.reduce((n, w) => n + w.jobsDone, 0);

/** Waits (outside a test, where expect.poll is not available) until n workers have a heartbeat. */
async function waitForWorkers(n: number): Promise<void> {
  const deadline = Date.now() + 60_000;
  while ((await workerList()).workers.length !== n) {
    if (Date.now() > deadline) throw new Error(`${n} workers did not report within 60 s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function waitForChunks(agent: request.Agent, runId: string, atLeast: number): Promise<void> {
  await expect.poll(async () => (await agent.get(`/api/runs/${runId}`).expect(200)).body.chunksDone as number, { timeout: 60_000, interval: 50 }).toBeGreaterThanOrEqual(atLeast);
}

async function resultOf(agent: request.Agent, runId: string) {
  const body = (await agent.get(`/api/runs/${runId}/result`).expect(200)).body;
  return { counts: body.counts, bins: body.bins, fraction: body.fraction };
}

beforeAll(async () => {
  embedded = await createTestApp();
  const owner = await signUp(embedded.app);
  const id = await createScenario(owner.agent, checkScenario({ systems: SYSTEMS }));
  const run = await owner.agent.post('/api/runs').send({ scenarioId: id, seed: 'scale-out' }).expect(201);
  expect((await waitForRun(owner.agent, run.body.id, 120_000)).status).toBe('succeeded');
  reference = await resultOf(owner.agent, run.body.id);

  scaled = await createTestApp({ REDIS_URL: redisUrl, REDIS_QUEUE: queueName, REDIS_BATCH_CHUNKS: BATCH_CHUNKS, REDIS_JOBS_PER_RUN: 64 });
  admin = await signUp(scaled.app);
  scenarioId = await createScenario(admin.agent, checkScenario({ systems: SYSTEMS }));
  queue = new Queue<ChunkJobData, ChunkJobResult>(queueName, { connection: redisConnection(redisUrl) });
  workers = [startWorker(), startWorker()];
  await waitForWorkers(2);
}, 240_000);

afterAll(async () => {
  await Promise.all(workers.map(stopWorker));
  await queue?.obliterate({ force: true }).catch(() => {});
  await queue?.close();
  await scaled?.close();
  await embedded?.close();
});

describe('runs on BullMQ workers over Redis', () => {
  it('give the embedded pool\'s counts and bins for the same scenario and seed; GET /api/workers lists both workers', async () => {
    const listed = await workerList();
    expect(listed.mode).toBe('redis');
    expect(listed.workers).toHaveLength(2);
    expect(listed.workers.every((w) => w.threads === 1)).toBe(true);
    const before = await jobsDoneTotal();
    const run = await admin.agent.post('/api/runs').send({ scenarioId, seed: 'scale-out' }).expect(201);
    expect((await waitForRun(admin.agent, run.body.id, 120_000)).status).toBe('succeeded');
    expect(await resultOf(admin.agent, run.body.id)).toEqual(reference);
    await expect.poll(jobsDoneTotal, { timeout: 5000 }).toBe(before + JOBS);
  }, 180_000);

  it('a fit\'s packed per-node tallies come back through Redis: the embedded pool\'s likelihood at every node', async () => {
    const fitOn = async (agent: request.Agent) => {
      const set = await agent
        .post('/api/constraint-sets')
        .send({ name: 'Scale-out fit (illustrative)', constraints: [{ kind: 'fraction', magnetic: 12, total: 400, label: 'Illustrative survey', citation: 'Invented for this test' }] })
        .expect(201);
      // Three chunks: two jobs of up to BATCH_CHUNKS chunks, each returning 144 packed tallies.
      const id = await createScenario(agent, checkScenario({ systems: 2 * 65_536 + 5000 }));
      const parameters = [
        { path: 'companions.multiplier', min: 0.5, max: 3, points: 12 },
        { path: 'envelope.alpha', min: 0.05, max: 2, points: 12 },
      ];
      const created = await agent.post('/api/fits').send({ scenarioId: id, constraintSetId: set.body.id, seed: 'scale-out-fit', parameters }).expect(201);
      return waitForFit(agent, created.body.id, 180_000);
    };
    const local = await fitOn((await signUp(embedded.app)).agent);
    const before = await jobsDoneTotal();
    const remote = await fitOn(admin.agent);
    // Two jobs (chunks 0–1 and 2), each counted once the workers' heartbeats catch up (the next tests count jobs).
    await expect.poll(jobsDoneTotal, { timeout: 5000 }).toBe(before + 2);
    expect([local.status, remote.status]).toEqual(['succeeded', 'succeeded']);
    expect(remote.posterior.logLikelihood).toEqual(local.posterior.logLikelihood);
    expect(remote.posterior.intervals).toEqual(local.posterior.intervals);
    // The nodes differ (so the comparison could fail).
    expect(new Set(local.posterior.logLikelihood).size).toBeGreaterThan(10);
  }, 240_000);

  it('a job replayed (the same id enqueued twice) is counted once', async () => {
    const before = await jobsDoneTotal();
    const run = await admin.agent.post('/api/runs').send({ scenarioId, seed: 'scale-out' }).expect(201);
    const runId = run.body.id as string;
    // As soon as the run's first job exists, enqueue every batch of the run again under its id.
    let first: ChunkJobData | undefined;
    await expect.poll(async () => (first = (await queue.getJob(jobIdOf(runId, 0)))?.data), { timeout: 30_000, interval: 20 }).toBeDefined();
    for (let batch = 0; batch < JOBS; batch++) {
      const chunks = [batch * BATCH_CHUNKS, batch * BATCH_CHUNKS + 1];
      await queue.add('chunks', { ...first!, batch, chunks }, { jobId: jobIdOf(runId, batch) });
      await queue.add('chunks', { ...first!, batch, chunks }, { jobId: jobIdOf(runId, batch) });
    }
    expect((await waitForRun(admin.agent, runId, 120_000)).status).toBe('succeeded');
    expect(await resultOf(admin.agent, runId)).toEqual(reference);
    await expect.poll(jobsDoneTotal, { timeout: 5000 }).toBe(before + JOBS);
  }, 180_000);

  it('kill -9 of one of two workers in the middle of a run: the run finishes with the same counts', async () => {
    const run = await admin.agent.post('/api/runs').send({ scenarioId, seed: 'scale-out' }).expect(201);
    await waitForChunks(admin.agent, run.body.id, 4);
    const victim = workers[0]!;
    victim.child.kill('SIGKILL');
    await victim.exited;
    const finished = await waitForRun(admin.agent, run.body.id, 120_000);
    expect(finished.status).toBe('succeeded');
    expect(await resultOf(admin.agent, run.body.id)).toEqual(reference);
    // The survivor carries on alone; start a second one again for the next tests.
    workers[0] = startWorker();
    await expect.poll(async () => (await workerList()).workers.filter((w) => Date.now() - Date.parse(w.lastSeenAt) < 1000).length, { timeout: 60_000 }).toBe(2);
  }, 240_000);

  it('an app restarted in the middle of a run resumes without redoing finished batches', async () => {
    await expect.poll(async () => (await workerList()).workers.length, { timeout: 10_000 }).toBe(2);
    const before = await jobsDoneTotal();
    const run = await admin.agent.post('/api/runs').send({ scenarioId, seed: 'scale-out' }).expect(201);
    const runId = run.body.id as string;
    await waitForChunks(admin.agent, runId, 6);
    await scaled.tidefield.scheduler.stop();
    const restarted = await restartApp(scaled);
    try {
      const agent = request.agent(restarted.app);
      await agent.post('/api/auth/sign-in').send({ email: admin.email, password: GOOD_PASSWORD }).expect(200);
      const resumed = await waitForRun(agent, runId, 120_000);
      expect(resumed).toMatchObject({ status: 'succeeded', resumes: 1 });
      expect(await resultOf(agent, runId)).toEqual(reference);
      // Every batch was computed exactly once over both app lives.
      await expect.poll(jobsDoneTotal, { timeout: 5000 }).toBe(before + JOBS);
    } finally {
      await restarted.close();
      await scaled.tidefield.scheduler.start();
    }
  }, 240_000);

  it('cancel removes the pending jobs and no worker keeps computing the run', async () => {
    const run = await admin.agent.post('/api/runs').send({ scenarioId, seed: 'scale-out-cancel' }).expect(201);
    const runId = run.body.id as string;
    await waitForChunks(admin.agent, runId, 2);
    const cancelled = await admin.agent.post(`/api/runs/${runId}/cancel`).expect(200);
    expect(cancelled.body.status).toBe('cancelled');
    const ofRun = async (states: Parameters<typeof queue.getJobs>[0]) => (await queue.getJobs(states, 0, -1)).filter((j) => j?.data?.runId === runId).length;
    expect(await ofRun(['wait', 'delayed', 'prioritized'])).toBe(0);
    await expect.poll(() => ofRun(['active']), { timeout: 10_000 }).toBe(0);
    await expect.poll(async () => (await workerList()).workers.every((w) => w.activeJobs === 0), { timeout: 10_000 }).toBe(true);
    const settled = await jobsDoneTotal();
    await new Promise((r) => setTimeout(r, 1500));
    expect(await jobsDoneTotal()).toBe(settled);
    expect(await ofRun(['wait', 'delayed', 'prioritized', 'active'])).toBe(0);
  }, 180_000);
});

describe('a batch delivered twice to the scheduler', () => {
  it('is added to the running total once (embedded executor that replays every batch)', async () => {
    const pool = createEnginePool({ workers: 2 });
    const inner = createPoolExecutor({ pool });
    const replaying: ChunkExecutor = {
      kind: 'embedded',
      async *execute(req: ExecuteRequest): AsyncGenerator<BatchDone> {
        for await (const done of inner.execute(req)) {
          yield done;
          yield structuredClone(done);
        }
      },
      close: () => inner.close(),
    };
    const ctx = await createTestApp({}, { executor: replaying });
    try {
      const owner = await signUp(ctx.app);
      const id = await createScenario(owner.agent, checkScenario({ systems: SYSTEMS }));
      const run = await owner.agent.post('/api/runs').send({ scenarioId: id, seed: 'scale-out' }).expect(201);
      expect((await waitForRun(owner.agent, run.body.id, 120_000)).status).toBe('succeeded');
      expect(await resultOf(owner.agent, run.body.id)).toEqual(reference);
    } finally {
      await ctx.close();
      await pool.destroy();
    }
  }, 180_000);
});
