/**
 * What a new user trips over, through the API: a sweep point's methods text and "run again",
 * an observer's own occurrence tables, presets without test fixtures, duplicate scenario names,
 * implied occurrence of a scenario without companions, and one e-mail per sweep.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
beforeAll(async () => {
  ctx = await createTestApp();
  owner = await signUp(ctx.app);
});
afterAll(() => ctx.close());

async function waitForSweep(agent: typeof owner.agent, id: string, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/sweeps/${id}`).expect(200);
    if (res.body.status === 'finished' || res.body.status === 'cancelled') return res.body;
    if (Date.now() > deadline) throw new Error(`sweep ${id} still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('a sweep point describes the model it ran', { timeout: 180_000 }, () => {
  it('gives the point its values, its own methods text, one e-mail for the sweep, and runs the point again', async () => {
    const scenarioId = await createScenario(owner.agent, checkScenario({ systems: 2000 }), 'Point check');
    const sweep = await owner.agent
      .post('/api/sweeps')
      .send({ scenarioId, name: 'Multiplier check', axes: [{ path: 'companions.multiplier', values: [1, 3] }] })
      .expect(201);
    const detail = await waitForSweep(owner.agent, sweep.body.id);
    const point = detail.points.find((p: { values: number[] }) => p.values[0] === 3);
    expect(point.status).toBe('succeeded');

    const run = await owner.agent.get(`/api/runs/${point.runId}`).expect(200);
    expect(run.body.sweepPoint).toMatchObject({ sweepId: sweep.body.id, sweepName: 'Multiplier check', number: 2, pointCount: 2 });
    expect(run.body.sweepPoint.values).toEqual([{ path: 'companions.multiplier', label: 'Occurrence multiplier', unit: '', value: 3 }]);

    // The methods text of the point names the point's value, not only the base scenario's.
    const methods = await owner.agent.get(`/api/runs/${point.runId}/methods.txt`).expect(200);
    expect(methods.text).toMatch(/grid point 2 of 2 of the parameter sweep "Multiplier check", with Occurrence multiplier = 3;/);

    // One e-mail for the whole sweep, none per point.
    const notice = await ctx.fakes.mail.waitFor((m) => m.to.includes(owner.email) && m.subject === 'Sweep finished: Multiplier check');
    expect(notice.text).toMatch(/Grid points: 2/);
    await new Promise((r) => setTimeout(r, 500));
    const mine = ctx.fakes.mail.messages().filter((m) => m.to.includes(owner.email));
    expect(mine.filter((m) => m.subject.startsWith('Run finished'))).toHaveLength(0);
    expect(mine.filter((m) => m.subject.startsWith('Sweep finished'))).toHaveLength(1);

    // "Run this point again" runs the point's own document (multiplier 3), outside the sweep.
    const again = await owner.agent.post(`/api/runs/${point.runId}/again`).send({ seed: 'again' }).expect(201);
    const rerun = await waitForRun(owner.agent, again.body.id);
    expect(rerun).toMatchObject({ status: 'succeeded', sweepId: null, seed: 'again', scenarioName: 'Point check · Occurrence multiplier = 3' });
    const [rows] = (await ctx.database.pool.query('select snapshot from runs where id = ?', [again.body.id])) as unknown as [{ snapshot: string | { companions: { multiplier: number } } }[]];
    const snapshot = typeof rows[0].snapshot === 'string' ? JSON.parse(rows[0].snapshot) : rows[0].snapshot;
    expect(snapshot.companions.multiplier).toBe(3);
    // A standalone run still mails its own notice.
    await ctx.fakes.mail.waitFor((m) => m.to.includes(owner.email) && m.subject === 'Run finished: Point check · Occurrence multiplier = 3');
  });
});

describe('observers and their own occurrence tables', () => {
  const rows = [{ class: 'planet', massMJup: [1, 2], periodDays: [10, 100], occurrence: 0.1 }];

  it('lets an observer create, edit and delete their own table, and only read the others', async () => {
    const observer = await addMember(ctx, owner.me.department.id, 'observer');
    const created = await observer.agent.post('/api/occurrence-tables').send({ name: 'My survey', rows }).expect(201);
    await observer.agent.patch(`/api/occurrence-tables/${created.body.id}`).send({ name: 'My survey, revised' }).expect(200);

    const theirs = await owner.agent.post('/api/occurrence-tables').send({ name: 'Department table', rows }).expect(201);
    await observer.agent.get(`/api/occurrence-tables/${theirs.body.id}`).expect(200);
    const refused = await observer.agent.patch(`/api/occurrence-tables/${theirs.body.id}`).send({ name: 'Mine now' }).expect(403);
    expect(refused.body.error.message).toMatch(/only the occurrence tables they uploaded/);
    await observer.agent.delete(`/api/occurrence-tables/${theirs.body.id}`).expect(403);
    expect((await owner.agent.get(`/api/occurrence-tables/${theirs.body.id}`).expect(200)).body.name).toBe('Department table');

    await observer.agent.delete(`/api/occurrence-tables/${created.body.id}`).expect(204);
  });
});

describe('presets and scenario names', () => {
  it('ships only the documented examples as presets: no test fixture (check-1)', async () => {
    const res = await owner.agent.get('/api/scenarios/presets').expect(200);
    const keys = res.body.presets.map((p: { key: string }) => p.key);
    expect(keys).not.toContain('check-1');
    for (const preset of res.body.presets) expect(preset.description.length).toBeGreaterThan(0);
  });

  it('refuses a second scenario of the same name with 409 at the name field, and names copies apart', async () => {
    const first = await createScenario(owner.agent, checkScenario(), 'Twin');
    const res = await owner.agent.post('/api/scenarios').send({ name: ' twin ', document: checkScenario() }).expect(409);
    expect(res.body.error.field).toBe('name');
    expect(res.body.error.message).toMatch(/already called "twin"; .*"twin \(2\)"/);
    const other = await createScenario(owner.agent, checkScenario(), 'Triplet');
    await owner.agent.patch(`/api/scenarios/${other}`).send({ name: 'Twin' }).expect(409);
    // Renaming a scenario to its own name is no conflict.
    await owner.agent.patch(`/api/scenarios/${first}`).send({ name: 'Twin' }).expect(200);
    const copy = await owner.agent.post(`/api/scenarios/${first}/clone`).send({}).expect(201);
    const copy2 = await owner.agent.post(`/api/scenarios/${first}/clone`).send({}).expect(201);
    expect((await owner.agent.get(`/api/scenarios/${copy.body.id}`).expect(200)).body.name).toBe('Copy of Twin');
    expect((await owner.agent.get(`/api/scenarios/${copy2.body.id}`).expect(200)).body.name).toBe('Copy of Twin (2)');
  });
});

describe('implied occurrence', () => {
  it('refuses up front a scenario with no companion rows, spending no run', async () => {
    const scenarioId = await createScenario(owner.agent, checkScenario({ systems: 2000, companions: { multiplier: 1, rows: [] } }), 'No companions');
    const counts = (await owner.agent.post('/api/samples').send({ name: 'Survey of all white dwarfs', magnetic: 12, total: 100 }).expect(201)).body;
    const before = (await owner.agent.get('/api/runs?pageSize=100').expect(200)).body.page.total;
    const res = await owner.agent.post('/api/implied-occurrence').send({ scenarioId, sampleId: counts.id }).expect(400);
    expect(res.body.error.field).toBe('scenarioId');
    expect(res.body.error.message).toMatch(/has no occurrence table to scale/);
    expect((await owner.agent.get('/api/runs?pageSize=100').expect(200)).body.page.total).toBe(before);
  });
});
