import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp();
});
afterAll(() => ctx.close());

describe('scenario → run → progress → result → comparison', () => {
  it('works for a modeller', async () => {
    const owner = await signUp(ctx.app);
    const modeller = await addMember(ctx, owner.me.department.id, 'modeller');
    const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 200_000 }));
    const run = await modeller.agent.post('/api/runs').send({ scenarioId }).expect(201);
    const done = await waitForRun(modeller.agent, run.body.id);
    expect(done.status).toBe('succeeded');
    const result = await modeller.agent.get(`/api/runs/${run.body.id}/result`).expect(200);
    expect(result.body.counts.primaries).toBe(200_000);
    expect(result.body.fraction.se).toBeGreaterThan(0);
    const samples = await modeller.agent.get('/api/samples').expect(200);
    const tout = samples.body.samples.find((s: { name: string }) => s.name.includes('1,253'));
    const cmp = await modeller.agent.get(`/api/runs/${run.body.id}/comparison?sample=${tout.id}`).expect(200);
    expect(cmp.body.counts).toBeTruthy();
    console.log(JSON.stringify(cmp.body.counts.summary), result.body.fraction);
  });
});
