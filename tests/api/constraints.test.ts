/**
 * Constraint sets, the published library, a run's evaluation against a set, and the two-sample
 * test, through the HTTP API on a throwaway MariaDB.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
let observer: Awaited<ReturnType<typeof addMember>>;
let runId: string;

beforeAll(async () => {
  ctx = await createTestApp();
  owner = await signUp(ctx.app);
  observer = await addMember(ctx, owner.me.department.id, 'observer');
  const scenarioId = await createScenario(owner.agent, checkScenario({ systems: 50_000 }));
  runId = (await owner.agent.post('/api/runs').send({ scenarioId }).expect(201)).body.id;
  expect((await waitForRun(owner.agent, runId)).status).toBe('succeeded');
}, 120_000);
afterAll(() => ctx.close());

describe('POST /api/stats/two-sample', () => {
  it('answers 149 of 1500 vs 0 of 1200 with p = 5.687e-40, 13.23σ (scipy.stats.fisher_exact, computed once)', async () => {
    // scipy 1.17.1: fisher_exact([[149, 1351], [0, 1200]]).pvalue = 5.686980030186101e-40; norm.isf(p/2) = 13.2326.
    const res = await observer.agent.post('/api/stats/two-sample').send({ a: { magnetic: 149, total: 1500 }, b: { magnetic: 0, total: 1200 } }).expect(200);
    expect(Math.abs(res.body.p - 5.686980030186101e-40) / 5.686980030186101e-40).toBeLessThan(1e-9);
    expect(res.body.sigma).toBeCloseTo(13.2326, 3);
    expect(res.body.verdict).toMatch(/cannot share one magnetic fraction/);
    // Clopper–Pearson upper 95% limit for 0 of 1200: 1 − 0.025^(1/1200) (Clopper & Pearson 1934, closed form at k = 0).
    expect(res.body.b.interval95[1]).toBeCloseTo(1 - Math.pow(0.025, 1 / 1200), 10);
    expect(res.body.method).toMatch(/Fisher's exact test/);
  });

  it('names the field and the range of bad input', async () => {
    const res = await observer.agent.post('/api/stats/two-sample').send({ a: { magnetic: 5, total: 4 }, b: { magnetic: 0, total: 10 } }).expect(400);
    expect(res.body.error.field).toBe('a.magnetic');
    expect(res.body.error.message).toMatch(/must not exceed total = 4/);
  });
});

describe('constraint sets', () => {
  it('lists the library (cited) and the library set, and refuses to change it', async () => {
    const lib = await observer.agent.get('/api/constraint-library').expect(200);
    expect(lib.body.setId).toBe('library');
    const zero = lib.body.constraints.find((c: { id: string }) => c.id === 'tout2008-wd-dm-zero');
    expect(zero.constraint).toMatchObject({ kind: 'fraction', setting: 'postCE', magnetic: 0, total: 1253 });
    for (const c of lib.body.constraints) expect(c.citation).toMatch(/\d{4}/);
    const sets = await observer.agent.get('/api/constraint-sets').expect(200);
    expect(sets.body.constraintSets[0]).toMatchObject({ id: 'library', library: true });
    await observer.agent.put('/api/constraint-sets/library').send({ name: 'Mine', constraints: [{ libraryId: 'tout2008-wd-dm-zero' }] }).expect(404);
  });

  it('saves a set, versions it on change, and deletes it', async () => {
    const body = { name: 'Pilot (illustrative)', constraints: [{ libraryId: 'tout2008-wd-dm-zero' }, { kind: 'fraction', setting: 'single', magnetic: 7, total: 60 }] };
    const id = (await observer.agent.post('/api/constraint-sets').send(body).expect(201)).body.id;
    const one = await observer.agent.get(`/api/constraint-sets/${id}`).expect(200);
    expect(one.body).toMatchObject({ currentVersion: 1, constraintCount: 2, kinds: ['fraction'], library: false });
    const two = await observer.agent.put(`/api/constraint-sets/${id}`).send({ ...body, constraints: [...body.constraints, { kind: 'meanMass', meanMsun: 0.8, errorMsun: 0.05 }] }).expect(200);
    expect(two.body.currentVersion).toBe(2);
    expect(two.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(two.body.kinds).toEqual(['fraction', 'meanMass']);
    await observer.agent.delete(`/api/constraint-sets/${id}`).expect(204);
    await observer.agent.get(`/api/constraint-sets/${id}`).expect(404);
  });

  it('names the constraint and field of a bad constraint and of an unknown library id', async () => {
    const bad = await observer.agent.post('/api/constraint-sets').send({ name: 'Bad', constraints: [{ libraryId: 'tout2008-wd-dm-zero' }, { kind: 'fraction', magnetic: 9, total: 4 }] }).expect(400);
    expect(bad.body.error.field).toBe('constraints.1.magnetic');
    expect(bad.body.error.message).toMatch(/constraints\[1\]\.magnetic must not exceed total = 4 \(got 9\)/);
    const unknown = await observer.agent.post('/api/constraint-sets').send({ name: 'Bad', constraints: [{ libraryId: 'no-such-paper' }] }).expect(400);
    expect(unknown.body.error.field).toBe('constraints.0.libraryId');
    const range = await observer.agent.post('/api/constraint-sets').send({ name: 'Bad', constraints: [{ kind: 'meanMass', massesMsun: [0.8, 3] }] }).expect(400);
    expect(range.body.error.message).toMatch(/constraints\[0\]\.massesMsun\[1\] must be between 0.1 and 1.5/);
  });

  it('stores nothing when a CSV has bad rows, and reports each with its line and column', async () => {
    const before = (await observer.agent.get('/api/constraint-sets').expect(200)).body.constraintSets.length;
    const csv = 'massMsun\n0.81\nheavy\n0.92\n\n0.77,\n';
    const res = await observer.agent.post('/api/constraint-sets').send({ name: 'Masses', constraints: [{ kind: 'meanMass', csv }] }).expect(400);
    expect(res.body.error.code).toBe('csv_invalid');
    expect(res.body.error.field).toBe('constraints.0.csv');
    expect(res.body.error.details).toContainEqual({ line: 3, column: 'massMsun', message: 'massMsun must be a number (got "heavy")' });
    expect(res.body.error.message).toMatch(/nothing was stored/);
    const missing = await observer.agent.post('/api/constraint-sets').send({ name: 'Masses', constraints: [{ kind: 'coolingAgeIncidence', csv: 'ageMinGyr,ageMaxGyr,magnetic\n0,1,2\n' }] }).expect(400);
    expect(missing.body.error.details).toContainEqual({ line: 1, column: 'total', message: 'the header has no column total (required: ageMinGyr, ageMaxGyr, magnetic, total)' });
    const after = (await observer.agent.get('/api/constraint-sets').expect(200)).body.constraintSets.length;
    expect(after).toBe(before);
  });

  it('turns a good CSV of magnetic masses into a list and tests it against a run', async () => {
    const csv = 'name,massMsun\nA,0.81\nB,0.92\nC,0.77\nD,1.05\nE,0.69\nF,0.88\n';
    const id = (await observer.agent.post('/api/constraint-sets').send({ name: 'My masses (illustrative)', constraints: [{ kind: 'meanMass', population: 'magnetic', csv }] }).expect(201)).body.id;
    const set = await observer.agent.get(`/api/constraint-sets/${id}`).expect(200);
    expect(set.body.constraints[0]).toMatchObject({ kind: 'meanMass', massesMsun: [0.81, 0.92, 0.77, 1.05, 0.69, 0.88] });
    expect(set.body.constraints[0].csv).toBeUndefined();
    const e = await observer.agent.get(`/api/runs/${runId}/evaluation?constraintSet=${id}`).expect(200);
    const c = e.body.constraints[0];
    expect(c.status).toBe('scored');
    expect(c.p).toBeGreaterThan(0);
    expect(c.p).toBeLessThanOrEqual(1);
    expect(c.method).toMatch(/Kolmogorov–Smirnov test on grouped data/);
    expect(c.overlay.observed.reduce((a: number, b: number) => a + b, 0)).toBe(6);
  });
});

describe('GET /api/runs/:id/evaluation', () => {
  it('scores a run against the library: per constraint and jointly, independence stated', async () => {
    const res = await observer.agent.get(`/api/runs/${runId}/evaluation?constraintSet=library`).expect(200);
    expect(res.body.constraintSet).toMatchObject({ id: 'library', version: null });
    expect(res.body.constraints.length).toBeGreaterThanOrEqual(6);
    const bound = res.body.constraints.find((c: { id: string }) => c.id === 'bagnulo-landstreet2020-20pc-lower');
    expect(bound.status).toBe('notTestable');
    const scored = res.body.constraints.filter((c: { status: string }) => c.status === 'scored');
    expect(res.body.combined.scored).toBe(scored.length);
    expect(res.body.combined.method).toMatch(/independent/);
    for (const c of scored) {
      expect(c.p).toBeGreaterThanOrEqual(0);
      expect(typeof c.mcLimited).toBe('boolean');
    }
  });

  it('answers 400 naming constraintSet when it is missing and 404 for an unknown set', async () => {
    const res = await observer.agent.get(`/api/runs/${runId}/evaluation`).expect(400);
    expect(res.body.error.field).toBe('constraintSet');
    await observer.agent.get(`/api/runs/${runId}/evaluation?constraintSet=nope`).expect(404);
  });
});
