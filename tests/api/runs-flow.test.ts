import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';
import { binomTestTwoSided } from '../support/binomial-reference.ts';
import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';

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
    const counts = result.body.counts;
    expect(counts.primaries).toBe(200_000);
    // Binomial standard error of k magnetic of N white dwarfs, √(f(1 − f)/N) (common practice, no source).
    const f = counts.magnetic / counts.whiteDwarfs;
    expect(result.body.fraction.value).toBeCloseTo(f, 12);
    expect(result.body.fraction.se).toBeCloseTo(Math.sqrt((f * (1 - f)) / counts.whiteDwarfs), 12);

    // Tout et al. 2008 (MNRAS 387, 897, abstract): none of 1,253 white dwarfs with a detached
    // M-dwarf companion is magnetic above 1 MG. Compared with the model's detached (wide +
    // post-common-envelope) white dwarfs.
    const samples = await modeller.agent.get('/api/samples').expect(200);
    const tout = samples.body.samples.find((s: { name: string }) => s.name.includes('1,253'));
    expect({ magnetic: tout.magnetic, total: tout.total, setting: tout.setting }).toEqual({ magnetic: 0, total: 1253, setting: 'detachedCompanion' });
    const cmp = await modeller.agent.get(`/api/runs/${run.body.id}/comparison?sample=${tout.id}`).expect(200);
    const test = cmp.body.counts;
    const s = counts.bySetting;
    const k = s.wide.magnetic + s.postCE.magnetic;
    const n = s.wide.whiteDwarfs + s.postCE.whiteDwarfs;
    expect(n).toBeGreaterThan(0);
    expect(test.predictedCounts).toEqual({ magnetic: k, whiteDwarfs: n });
    expect(test.predicted.value).toBeCloseTo(k / n, 12);
    expect(test.predicted.se).toBeCloseTo(Math.sqrt(((k / n) * (1 - k / n)) / n), 12);
    expect(test.observed).toMatchObject({ magnetic: 0, total: 1253, fraction: 0 });
    // Clopper & Pearson (1934, Biometrika 26, 404) for 0 of n has the closed form [0, 1 − (α/2)^(1/n)];
    // 1e-12 absolute is far below any rounding the engine's beta-quantile search needs.
    expect(test.observed.interval95[0]).toBe(0);
    expect(test.observed.interval95[1]).toBeCloseTo(1 - Math.pow(0.025, 1 / 1253), 12);
    expect(test.observed.interval68[1]).toBeCloseTo(1 - Math.pow(0.16, 1 / 1253), 12);
    // R's binom.test two-sided p-value from jstat's pmf (tests/support/binomial-reference.ts);
    // relative 1e-9: both sum the same pmf terms in double precision.
    const p = binomTestTwoSided(0, 1253, k / n);
    expect(test.pValue).toBeGreaterThan(0);
    expect(Math.abs(test.pValue - p) / p).toBeLessThan(1e-9);
    // Gaussian-equivalent significance of a two-sided p: Φ⁻¹(1 − p/2) (common practice, no source);
    // jstat's normal quantile is good to ~1e-9 relative where p is not tiny.
    if (p > 1e-12 && p < 1) expect(test.sigma).toBeCloseTo(jStat.normal.inv(1 - p / 2, 0, 1), 6);
    if (p === 1) expect(test.sigma).toBe(0);
  });
});
