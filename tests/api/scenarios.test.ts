import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario } from '../support/runs.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
beforeAll(async () => {
  ctx = await createTestApp();
  owner = await signUp(ctx.app);
});
afterAll(() => ctx.close());

describe('scenarios', () => {
  it('creates, reads with defaults filled in, versions, renames, clones and deletes', async () => {
    const { agent } = owner;
    const created = await agent.post('/api/scenarios').send({ name: 'Planets only', document: checkScenario() }).expect(201);
    const id = created.body.id;
    const detail = await agent.get(`/api/scenarios/${id}`).expect(200);
    expect(detail.body).toMatchObject({ name: 'Planets only', currentVersion: 1 });
    expect(detail.body.documentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(detail.body.resolved.envelope).toEqual({ alpha: 0.1, lambda: 0.5 });
    // The list price: 1e6 systems at one credit per 1e7 systems, rounded up, before any free allowance (shared/contracts/pricing.ts).
    expect(detail.body.costCredits).toBe(1);

    const changed = await agent.patch(`/api/scenarios/${id}`).send({ document: checkScenario({ systems: 2000 }), note: 'smaller' }).expect(200);
    expect(changed.body.currentVersion).toBe(2);
    const same = await agent.patch(`/api/scenarios/${id}`).send({ document: checkScenario({ systems: 2000 }), name: 'Renamed' }).expect(200);
    expect(same.body).toMatchObject({ currentVersion: 2, name: 'Renamed' });
    const versions = await agent.get(`/api/scenarios/${id}/versions`).expect(200);
    expect(versions.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const v1 = await agent.get(`/api/scenarios/${id}/versions/1`).expect(200);
    expect(v1.body.document.systems).toBe(1000000);

    const clone = await agent.post(`/api/scenarios/${id}/clone`).send({}).expect(201);
    const cloned = await agent.get(`/api/scenarios/${clone.body.id}`).expect(200);
    expect(cloned.body.name).toBe('Copy of Renamed');
    expect(cloned.body.documentHash).toBe(same.body.documentHash);

    await agent.delete(`/api/scenarios/${id}`).expect(204);
    await agent.get(`/api/scenarios/${id}`).expect(404);
    const list = await agent.get('/api/scenarios').expect(200);
    expect(list.body.scenarios.map((s: { id: string }) => s.id)).toEqual([clone.body.id]);
  });

  it('names the field and the allowed range of a bad document', async () => {
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [checkScenario({ envelope: { alpha: 20, lambda: 0.5 } }), 'document.envelope.alpha', /between 0.01 and 10/],
      [checkScenario({ systems: 1e12 }), 'document.systems', /1e\+?10|10000000000/],
      [checkScenario({ primaries: { imf: { law: 'topheavy' } } }), 'document.primaries.imf.law', /salpeter1955/],
    ];
    for (const [document, field, message] of cases) {
      const res = await owner.agent.post('/api/scenarios').send({ name: 'Bad', document }).expect(400);
      expect(res.body.error.field).toBe(field);
      expect(res.body.error.message).toMatch(message);
    }
    const list = await owner.agent.get('/api/scenarios').expect(200);
    expect(list.body.scenarios.some((s: { name: string }) => s.name === 'Bad')).toBe(false);
  });

  it('answers every problem of a document at once, the first also as field and message', async () => {
    // α_CE = 50 is outside Webbink's energy formalism's range the schema allows (0.01–10); λ = 0 and
    // a mass range with its ends swapped are two more problems in the same document.
    const document = checkScenario({ envelope: { alpha: 50, lambda: 0 }, primaries: { massRangeMsun: [4, 1] } });
    const res = await owner.agent.post('/api/scenarios').send({ name: 'Three problems', document }).expect(400);
    expect(res.body.error).toMatchObject({
      code: 'invalid_input',
      field: 'document.envelope.alpha',
      message: 'document.envelope.alpha must be between 0.01 and 10 (got 50)',
    });
    expect(res.body.error.issues).toEqual([
      { field: 'document.envelope.alpha', message: 'document.envelope.alpha must be between 0.01 and 10 (got 50)' },
      { field: 'document.envelope.lambda', message: 'document.envelope.lambda must be between 0.05 and 5 (got 0)' },
      { field: 'document.primaries.massRangeMsun', message: 'document.primaries.massRangeMsun must be a range [low, high] with low below high (got [4, 1])' },
    ]);
  });

  it('lists every problem of a request body at once', async () => {
    const res = await owner.agent.post('/api/scenarios').send({ name: '', document: 'x', extra: 1 }).expect(400);
    expect(res.body.error.issues.map((i: { field: string }) => i.field)).toEqual(['name', 'document', 'extra']);
    expect(res.body.error.field).toBe('name');
    expect(res.body.error.message).toBe(res.body.error.issues[0].message);
  });

  it('refuses a document naming another department\'s occurrence table', async () => {
    const other = await signUp(ctx.app);
    const table = await other.agent
      .post('/api/occurrence-tables')
      .send({ name: 'Theirs', rows: [{ class: 'planet', massMJup: [1, 2], periodDays: [10, 100], occurrence: 0.1 }] })
      .expect(201);
    const doc = checkScenario({ companions: { multiplier: 1, tableId: table.body.id } });
    const res = await owner.agent.post('/api/scenarios').send({ name: 'Borrowed', document: doc }).expect(400);
    expect(res.body.error.field).toBe('document.companions.tableId');
  });

  it('lets observers read but not write scenarios', async () => {
    const observer = await addMember(ctx, owner.me.department.id, 'observer');
    await observer.agent.get('/api/scenarios').expect(200);
    const res = await observer.agent.post('/api/scenarios').send({ name: 'Nope', document: checkScenario() }).expect(403);
    expect(res.body.error.message).toMatch(/modeller role/);
  });

  it('serves the example scenarios as presets, each valid', async () => {
    const res = await owner.agent.get('/api/scenarios/presets').expect(200);
    expect(res.body.presets.length).toBeGreaterThanOrEqual(3);
    for (const preset of res.body.presets) {
      await owner.agent.post('/api/scenarios').send({ name: `Preset ${preset.key}`, document: preset.document }).expect(201);
    }
  });
});
