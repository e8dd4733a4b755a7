/**
 * Implied occurrence as the one-parameter fit over companions.multiplier: the same confidence
 * range as the one-run answer it replaces, and the fit's credible interval beside it, checked
 * against an independent integration of the binomial likelihood (jStat).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { IMPLIED_CONFIDENCE_LABEL, IMPLIED_CREDIBLE_LABEL, IMPLIED_GRID_POINTS } from '../../shared/contracts/implied-occurrence.ts';
import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { credibleReference, fractionAt, type ResponseCurve } from '../support/implied-reference.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';

let ctx: TestContext;
let owner: { agent: request.Agent };
let observer: { agent: request.Agent };
beforeAll(async () => {
  ctx = await createTestApp();
  const admin = await signUp(ctx.app);
  owner = admin;
  observer = await addMember(ctx, admin.me.department.id, 'observer');
}, 60_000);
afterAll(() => ctx.close());

const SYSTEMS = 20_000;
const SEED = 'implied-fit';

async function waitForAnswer(agent: request.Agent, fitId: string, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/implied-occurrence/${fitId}`).expect(200);
    if (['succeeded', 'failed', 'cancelled'].includes(res.body.status)) return res.body;
    if (Date.now() > deadline) throw new Error(`implied-occurrence fit ${fitId} still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('implied occurrence as a fit over the multiplier', () => {
  it('gives today\'s confidence range and the credible interval of the binomial likelihood', async () => {
    // The check scenario: one planet row of occurrence 0.3, so m runs from 0 to 1/0.3.
    const scenarioId = await createScenario(owner.agent, checkScenario({ systems: SYSTEMS, seed: SEED }));

    // Today's path: one run of the scenario, its exact multiplier response, the test inverted.
    const run = await observer.agent.post('/api/runs').send({ scenarioId }).expect(201);
    expect((await waitForRun(observer.agent, run.body.id)).status).toBe('succeeded');
    const result = (await observer.agent.get(`/api/runs/${run.body.id}/result`).expect(200)).body;
    // A sample near the prediction at m = 1 (so that both answers lie inside the range), 200 white dwarfs.
    const total = 200;
    const magnetic = Math.round((result.counts.magnetic / result.counts.whiteDwarfs) * total);
    const sample = (await observer.agent.post('/api/samples').send({ name: 'Two hundred (illustrative)', magnetic, total }).expect(201)).body;
    const today = (await observer.agent.get(`/api/runs/${run.body.id}/implied-occurrence?sample=${sample.id}`).expect(200)).body;

    // The new path: the fit, on the same scenario, sample and seed.
    const started = await observer.agent.post('/api/implied-occurrence').send({ scenarioId, sampleId: sample.id }).expect(201);
    expect(started.body).toMatchObject({ sampleId: sample.id, fitId: expect.any(String), runId: expect.any(String) });
    const answer = await waitForAnswer(observer.agent, started.body.fitId);
    expect(answer.status).toBe('succeeded');
    expect(answer.sample).toMatchObject({ magnetic, total });

    // (a) The confidence range. Both answers invert the exact test on the exact 256-bin response of
    // the same draws (the response does not depend on the run's own multiplier, and the fit's run
    // draws the same systems), so they must agree to rounding (1e-12), well inside the response's
    // resolution Δm = m_max/256 = 0.013 below which neither answer can say anything.
    const confidence = answer.confidence;
    expect(confidence.kind).toBe('testInversion');
    expect(confidence.label).toBe(IMPLIED_CONFIDENCE_LABEL);
    expect(confidence.curve).toEqual(today.curve);
    for (const key of ['interval68', 'interval95'] as const) {
      expect(confidence[key]).not.toBeNull();
      confidence[key].forEach((x: number, i: number) => expect(Math.abs(x - today[key][i])).toBeLessThan(1e-12));
    }
    expect(Math.abs(confidence.bestFit - today.bestFit)).toBeLessThan(1e-12);
    expect(confidence.summary).toBe(today.summary);

    // The fit's grid: 0 to 1/0.3 on 129 nodes, uniform prior, every other edge of the response.
    const curve = today.curve as ResponseCurve;
    const mMax = 1 / 0.3;
    expect(curve[curve.length - 1].multiplier).toBeCloseTo(mMax, 12);
    const fit = (await observer.agent.get(`/api/fits/${started.body.fitId}`).expect(200)).body;
    expect(fit.grid).toEqual([expect.objectContaining({ path: 'companions.multiplier', min: 0, points: IMPLIED_GRID_POINTS, scale: 'linear', prior: 'uniform' })]);
    expect(fit.grid[0].max).toBeCloseTo(mMax, 12);
    // The fit's likelihood at node i is the binomial probability (jStat's pmf, independent of the
    // engine) of the count at today's response at edge 2i: the nodes are the response's own values.
    // 1e-9 covers log-gamma rounding; -Infinity where the prediction is 0 and the count is not.
    fit.posterior.logLikelihood.forEach((ll: number | null, i: number) => {
      const expected = Math.log(jStat.binomial.pdf(magnetic, total, curve[2 * i].fraction));
      if (Number.isFinite(expected)) expect(ll).toBeCloseTo(expected, 9);
      else expect(ll).toBeNull();
    });

    // (b) The credible interval against an independent integration of the same likelihood on the
    // response curve (2^16 sub-steps). The fit takes the density linear between its nodes
    // (spacing h = m_max/128 = 0.026). For a density of width σ (here σ ≈ 0.16: n = 200 at
    // f ≈ 0.17) linear interpolation errs by about (h/σ)²/8 ≈ 0.3% of the density, which moves a
    // quantile by well under h/10 = 0.0026, the tolerance used; a wrong prior (e.g. ∝ 1/m) or a
    // likelihood off by one node would move the ends by σ²/m ≈ 0.03 or h.
    const credible = answer.credible;
    expect(credible.kind).toBe('posterior');
    expect(credible.label).toBe(IMPLIED_CREDIBLE_LABEL);
    expect(credible.prior).toBe('uniform');
    expect(credible.priorText).toMatch(/^uniform in m from 0 to 3\.33/);
    const reference = credibleReference(curve, magnetic, total);
    const h = mMax / (IMPLIED_GRID_POINTS - 1);
    for (const key of ['interval68', 'interval95'] as const) {
      credible[key].forEach((x: number, i: number) => expect(Math.abs(x - reference[key][i])).toBeLessThan(h / 10));
    }
    expect(Math.abs(credible.peak - reference.peak)).toBeLessThanOrEqual(h);
    // Close to the confidence range, but not the same quantity: not required to be equal, only near (within 20% of the 95% width).
    const width = confidence.interval95[1] - confidence.interval95[0];
    expect(Math.abs(credible.interval68[0] - confidence.interval68[0])).toBeLessThan(0.2 * width);

    // The methods text labels each answer for what it is and carries the fit's own paragraph.
    expect(answer.methods).toContain(`${IMPLIED_CONFIDENCE_LABEL}: ${confidence.summary}`);
    expect(answer.methods).toContain(`${IMPLIED_CREDIBLE_LABEL}: ${credible.summary}`);
    expect(answer.methods).toContain(`${IMPLIED_GRID_POINTS} linearly spaced values from 0 to 3.33 with a uniform prior`);
    expect(answer.difference).toMatch(/not the same|need not agree/);

    // The run behind it still answers the old way (existing clients): the same range.
    expect((await waitForRun(observer.agent, started.body.runId)).status).toBe('succeeded');
    const old = (await observer.agent.get(`/api/runs/${started.body.runId}/implied-occurrence?sample=${sample.id}`).expect(200)).body;
    expect(old.interval68).toEqual(confidence.interval68);
    expect(old.bestFit).toEqual(confidence.bestFit);

    // Listed with the fits, with its question; credit reserved for every grid node.
    const list = (await observer.agent.get('/api/fits').expect(200)).body.fits;
    expect(list.find((f: { id: string }) => f.id === started.body.fitId)).toMatchObject({ parameters: ['companions.multiplier'], implied: { sample: { id: sample.id, magnetic, total } } });
    const ledger = (await owner.agent.get('/api/billing/ledger?pageSize=100').expect(200)).body.entries;
    const reservation = ledger.find((e: { runId: string | null; kind: string }) => e.runId === started.body.runId && e.kind === 'reservation');
    expect(reservation.description).toContain(`${(IMPLIED_GRID_POINTS * SYSTEMS).toLocaleString('en-US')} systems`);
    // Sanity of the reference itself: the best fit reproduces the observed fraction on the curve.
    expect(fractionAt(curve, confidence.bestFit)).toBeCloseTo(magnetic / total, 9);
  }, 300_000);

  it('answers 404 for a fit that is not an implied-occurrence question', async () => {
    const scenarioId = await createScenario(owner.agent, checkScenario({ systems: 2000 }));
    const fit = await owner.agent
      .post('/api/fits')
      .send({ scenarioId, constraintSetId: 'library', parameters: [{ path: 'envelope.alpha', min: 0.1, max: 1, points: 2 }] })
      .expect(201);
    await observer.agent.get(`/api/implied-occurrence/${fit.body.id}`).expect(404);
  }, 60_000);
});
