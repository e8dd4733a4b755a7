import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createEnginePool } from '../../server/engine-pool/engine-pool.ts';
import { runCheckpoints } from '../../server/modules/runs/runs.table.ts';
import { addMember, createTestApp, restartApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
let modeller: Awaited<ReturnType<typeof addMember>>;
let observer: Awaited<ReturnType<typeof addMember>>;
let scenarioId: string;

beforeAll(async () => {
  ctx = await createTestApp();
  owner = await signUp(ctx.app);
  modeller = await addMember(ctx, owner.me.department.id, 'modeller');
  observer = await addMember(ctx, owner.me.department.id, 'observer');
  scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 100_000 }));
});
afterAll(() => ctx.close());

async function finishedRun(agent: request.Agent, body: Record<string, unknown>) {
  const res = await agent.post('/api/runs').send(body).expect(201);
  const run = await waitForRun(agent, res.body.id);
  expect(run.status).toBe('succeeded');
  return res.body.id as string;
}

describe('runs for each role', () => {
  it('CSV formula injection: a seed that looks like a formula comes back neutralised in the result export', async () => {
    const runId = await finishedRun(modeller.agent, { scenarioId, systems: 20_000, seed: '=HYPERLINK("http://evil.example")' });
    const csv = (await modeller.agent.get(`/api/runs/${runId}/export.csv`).expect(200)).text;
    expect(csv).toContain(`run,seed,"'=HYPERLINK(""http://evil.example"")"`);
    expect(csv).not.toMatch(/(^|,)=HYPERLINK/m);
  });

  it('an observer runs up to 10^6 systems, compares with a sample of their own, and is refused larger runs', async () => {
    const sample = await observer.agent.post('/api/samples').send({ name: 'Pilot (illustrative)', magnetic: 7, total: 60 }).expect(201);
    const runId = await finishedRun(observer.agent, { scenarioId, systems: 50_000 });
    const cmp = await observer.agent.get(`/api/runs/${runId}/comparison?sample=${sample.body.id}`).expect(200);
    expect(cmp.body.counts.observed).toMatchObject({ magnetic: 7, total: 60 });
    expect(cmp.body.counts.pValue).toBeGreaterThan(0);
    expect(cmp.body.counts.pValue).toBeLessThanOrEqual(1);
    const big = await observer.agent.post('/api/runs').send({ scenarioId, systems: 2_000_000 }).expect(403);
    expect(big.body.error.field).toBe('systems');
    expect(big.body.error.message).toMatch(/at most 1,000,000 systems/);
  });

  it('a modeller and an admin run larger jobs and read results, exports and the methods paragraph', async () => {
    for (const who of [modeller, owner]) {
      const runId = await finishedRun(who.agent, { scenarioId, systems: 70_000, seed: `role-${who.email}` });
      const result = await who.agent.get(`/api/runs/${runId}/result`).expect(200);
      expect(result.body).toMatchObject({ systems: 70_000, seed: `role-${who.email}`, counts: { primaries: 70_000 } });
      const csv = await who.agent.get(`/api/runs/${runId}/export.csv`).expect(200);
      expect(csv.text).toMatch(/^section,key,value/);
      expect(csv.text).toContain(`counts,magnetic,${result.body.counts.magnetic}`);
      const json = await who.agent.get(`/api/runs/${runId}/export.json`).expect(200);
      expect(JSON.parse(json.text).scenarioHash).toBe(result.body.scenarioHash);
      // RFC 6266: the file name as a token or a quoted string.
      expect(csv.headers['content-disposition']).toMatch(new RegExp(`^attachment; filename="?tidefield-run-${runId}\\.csv"?$`));
      const methods = await who.agent.get(`/api/runs/${runId}/methods.txt`).expect(200);
      expect(methods.text).toContain('Kalirai');
      expect(methods.text).toContain(result.body.scenarioHash);
      expect(methods.text).toContain(result.body.engineVersion);
    }
  });

  it('answers 409 for the result of a run that has not finished', async () => {
    const res = await modeller.agent.post('/api/runs').send({ scenarioId, systems: 3_000_000, seed: 'slow' }).expect(201);
    const early = await modeller.agent.get(`/api/runs/${res.body.id}/result`);
    expect([200, 409]).toContain(early.status);
    await modeller.agent.post(`/api/runs/${res.body.id}/cancel`).expect(200);
  });
});

describe('listing', () => {
  it('pages, sorts and filters', async () => {
    const list = await modeller.agent.get('/api/runs?pageSize=2&sort=systems&order=asc').expect(200);
    expect(list.body.runs.length).toBeLessThanOrEqual(2);
    expect(list.body.page.total).toBeGreaterThanOrEqual(2);
    const systems = list.body.runs.map((r: { systems: number }) => r.systems);
    expect(systems).toEqual([...systems].sort((a, b) => a - b));
    const mine = await observer.agent.get('/api/runs?owner=me&status=succeeded').expect(200);
    expect(mine.body.runs.every((r: { ownerUserId: string; status: string }) => r.ownerUserId === observer.userId && r.status === 'succeeded')).toBe(true);
    const bad = await modeller.agent.get('/api/runs?pageSize=500').expect(400);
    expect(bad.body.error.field).toBe('pageSize');
  });
});

describe('cancel', () => {
  it('cancels a running run and it stays cancelled', async () => {
    const res = await modeller.agent.post('/api/runs').send({ scenarioId, systems: 5_000_000, seed: 'to-cancel' }).expect(201);
    const cancelled = await modeller.agent.post(`/api/runs/${res.body.id}/cancel`).expect(200);
    expect(cancelled.body.status).toBe('cancelled');
    const again = await modeller.agent.post(`/api/runs/${res.body.id}/cancel`).expect(409);
    expect(again.body.error.message).toMatch(/cancelled/);
    expect((await waitForRun(modeller.agent, res.body.id)).status).toBe('cancelled');
  });

  it("lets an observer cancel their own run but not a modeller's", async () => {
    const theirs = await modeller.agent.post('/api/runs').send({ scenarioId, systems: 5_000_000, seed: 'not-yours' }).expect(201);
    await observer.agent.post(`/api/runs/${theirs.body.id}/cancel`).expect(403);
    await modeller.agent.post(`/api/runs/${theirs.body.id}/cancel`).expect(200);
  });
});

describe('progress stream', () => {
  it('sends progress events over SSE and ends with the final state', async () => {
    const res = await modeller.agent.post('/api/runs').send({ scenarioId, systems: 400_000, seed: 'sse' }).expect(201);
    const stream = await modeller.agent
      .get(`/api/runs/${res.body.id}/events`)
      .buffer(true)
      .parse((response, callback) => {
        let text = '';
        response.on('data', (chunk: Buffer) => (text += chunk.toString()));
        response.on('end', () => callback(null, text));
      })
      .expect(200);
    expect(stream.headers['content-type']).toMatch(/text\/event-stream/);
    const events = String(stream.body)
      .split('\n\n')
      .filter((block) => block.startsWith('event: progress'))
      .map((block) => JSON.parse(block.split('data: ')[1]!));
    expect(events.length).toBeGreaterThanOrEqual(1);
    expect(events.at(-1)).toMatchObject({ status: 'succeeded', progress: 1 });
  });
});

describe('resume after the server stops', () => {
  it('finishes an interrupted run with exactly the counts of an uninterrupted one', async () => {
    const body = { scenarioId, systems: 2_600_000, seed: 'resume-check' };
    const started = await modeller.agent.post('/api/runs').send(body).expect(201);
    const runId = started.body.id as string;
    // Wait for a checkpoint, then stop the scheduler as SIGTERM would.
    const deadline = Date.now() + 60_000;
    for (;;) {
      const [cp] = await ctx.database.db.select().from(runCheckpoints).where(eq(runCheckpoints.runId, runId));
      if (cp && cp.doneChunks.length > 0) break;
      if (Date.now() > deadline) throw new Error('no checkpoint written');
      await new Promise((r) => setTimeout(r, 50));
    }
    await ctx.tidefield.scheduler.stop();
    const interrupted = await modeller.agent.get(`/api/runs/${runId}`).expect(200);
    expect(interrupted.body.status).toBe('running');
    expect(interrupted.body.chunksDone).toBeGreaterThan(0);
    expect(interrupted.body.chunksDone).toBeLessThan(interrupted.body.chunkCount);

    const restarted = await restartApp(ctx);
    try {
      const agent = request.agent(restarted.app);
      await agent.post('/api/auth/sign-in').send({ email: modeller.email, password: 'correct horse battery' }).expect(200);
      const resumed = await waitForRun(agent, runId, 120_000);
      expect(resumed).toMatchObject({ status: 'succeeded', resumes: 1 });
      const reference = await agent.post('/api/runs').send(body).expect(201);
      expect((await waitForRun(agent, reference.body.id, 120_000)).status).toBe('succeeded');
      const a = (await agent.get(`/api/runs/${runId}/result`).expect(200)).body;
      const b = (await agent.get(`/api/runs/${reference.body.id}/result`).expect(200)).body;
      expect(a.counts).toEqual(b.counts);
      expect(a.bins).toEqual(b.bins);
      expect(a.multiplierResponse).toEqual(b.multiplierResponse);
    } finally {
      await restarted.close();
      await ctx.tidefield.scheduler.start();
    }
  });
});

describe('a worker that throws', () => {
  it('fails that run with the error, and the pool keeps serving other runs', async () => {
    // The engine's own test fixture: the real chunk task, except that a batch holding chunk 3 throws.
    const pool = createEnginePool({ workers: 2, filename: new URL('../../server/engine-pool/failing-chunk-task.fixture.mjs', import.meta.url).href });
    const faulty = await createTestApp({}, { pool });
    try {
      const admin = await signUp(faulty.app);
      const id = await createScenario(admin.agent, checkScenario({ systems: 400_000 }));
      const bad = await admin.agent.post('/api/runs').send({ scenarioId: id }).expect(201);
      const failed = await waitForRun(admin.agent, bad.body.id);
      expect(failed.status).toBe('failed');
      expect(failed.error).toMatch(/deliberate failure in chunk 3/);
      // Two chunks (0 and 1) never reach the failing chunk: the same pool serves this run.
      const good = await admin.agent.post('/api/runs').send({ scenarioId: id, systems: 100_000 }).expect(201);
      expect((await waitForRun(admin.agent, good.body.id)).status).toBe('succeeded');
    } finally {
      await faulty.close();
      await pool.destroy();
    }
  });
});

describe('sweeps', () => {
  it('makes one point per grid value, in order, all with the same seed', async () => {
    const values = [0.5, 1, 2, 3];
    const sweep = await modeller.agent
      .post('/api/sweeps')
      .send({ scenarioId, axes: [{ path: 'giant.reachAU', values }], systems: 20_000, seed: 'crn' })
      .expect(201);
    let detail;
    for (let i = 0; i < 600; i++) {
      detail = (await modeller.agent.get(`/api/sweeps/${sweep.body.id}`).expect(200)).body;
      if (detail.status === 'finished') break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(detail.status).toBe('finished');
    expect(detail.points.map((p: { index: number }) => p.index)).toEqual([0, 1, 2, 3]);
    expect(detail.points.map((p: { values: number[] }) => p.values[0])).toEqual(values);
    // Common random numbers: a larger reach engulfs a superset, so the fraction cannot fall (semantics of fixedReach).
    const fractions = detail.points.map((p: { fraction: number }) => p.fraction);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThanOrEqual(fractions[i - 1]);
    // A sample of one setting is tested against that setting's fraction: with a single planet
    // row no white dwarf with a surviving (wide) companion can be magnetic, so 0 of 45 fits every point.
    const pairs = await modeller.agent.post('/api/samples').send({ name: 'Pairs (illustrative)', magnetic: 0, total: 45, setting: 'detachedCompanion' }).expect(201);
    const against = (await modeller.agent.get(`/api/sweeps/${sweep.body.id}?sample=${pairs.body.id}`).expect(200)).body;
    expect(against.points.map((p: { pValue: number }) => p.pValue)).toEqual([1, 1, 1, 1]);
    expect(against.method).toMatch(/detached companion/);
    const implied = await modeller.agent.post('/api/implied-occurrence').send({ scenarioId, sampleId: pairs.body.id }).expect(400);
    expect(implied.body.error.message).toMatch(/Sweep companions.multiplier/);
    const runs = await modeller.agent.get(`/api/runs?includeSweepPoints=true&pageSize=100`).expect(200);
    const points = runs.body.runs.filter((r: { sweepId: string | null }) => r.sweepId === sweep.body.id);
    expect(new Set(points.map((r: { seed: string }) => r.seed))).toEqual(new Set(['crn']));
  });

  it('names the bad grid value', async () => {
    const res = await modeller.agent
      .post('/api/sweeps')
      .send({ scenarioId, axes: [{ path: 'companions.multiplier', values: [1, 2, 5] }], systems: 2000 })
      .expect(400);
    expect(res.body.error.field).toBe('axes[0].values[2]');
    expect(res.body.error.message).toMatch(/at most 1/);
    const unknown = await modeller.agent.post('/api/sweeps').send({ scenarioId, axes: [{ path: 'seed', values: [1, 2] }] }).expect(400);
    expect(unknown.body.error.field).toBe('axes[0].path');
  });
});

describe('implied occurrence and compare', () => {
  it('gives the multiplier range a sample allows, and compares runs on the same axes', async () => {
    const sample = await observer.agent.post('/api/samples').send({ name: 'Ten per cent (illustrative)', magnetic: 10, total: 100 }).expect(201);
    const start = await observer.agent.post('/api/implied-occurrence').send({ scenarioId, sampleId: sample.body.id, systems: 100_000 }).expect(201);
    expect((await waitForRun(observer.agent, start.body.runId)).status).toBe('succeeded');
    const implied = await observer.agent.get(`/api/runs/${start.body.runId}/implied-occurrence?sample=${sample.body.id}`).expect(200);
    expect(implied.body.interval95[0]).toBeLessThanOrEqual(implied.body.interval68[0]);
    expect(implied.body.interval95[1]).toBeGreaterThanOrEqual(implied.body.interval68[1]);
    expect(implied.body.summary).toMatch(/multiplier/);
    const other = await finishedRun(observer.agent, { scenarioId, systems: 60_000, seed: 'other' });
    const cmp = await observer.agent.get(`/api/compare?runs=${start.body.runId},${other}`).expect(200);
    expect(cmp.body.runs).toHaveLength(2);
    expect(cmp.body.runs[0].bins.wdMass.edgesMsun).toEqual(cmp.body.runs[1].bins.wdMass.edgesMsun);
    expect(cmp.body.differences).toHaveLength(1);
    const one = await observer.agent.get(`/api/compare?runs=${other}`).expect(400);
    expect(one.body.error.field).toBe('runs');
  });
});
