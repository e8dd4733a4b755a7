import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForFit, waitForRun } from '../support/runs.ts';
import { parseScenario } from '../../shared/contracts/scenario.ts';
import { rangeLimits } from '../../server/modules/fits/fit-analysis.ts';
import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';

let ctx: TestContext;
let owner: { agent: request.Agent };
let modeller: { agent: request.Agent };
let observer: { agent: request.Agent };
beforeAll(async () => {
  ctx = await createTestApp();
  const admin = await signUp(ctx.app);
  owner = admin;
  modeller = await addMember(ctx, admin.me.department.id, 'modeller');
  observer = await addMember(ctx, admin.me.department.id, 'observer');
}, 60_000);
afterAll(() => ctx.close());

const SYSTEMS = 20_000;
const SEED = 'fit-crn';

/** A separate run of the check scenario with these companions/giant values and the shared seed. */
async function separateRun(overrides: Record<string, unknown>) {
  const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: SYSTEMS, seed: SEED, ...overrides }));
  const run = await modeller.agent.post('/api/runs').send({ scenarioId }).expect(201);
  expect((await waitForRun(modeller.agent, run.body.id, 60_000)).status).toBe('succeeded');
  return (await modeller.agent.get(`/api/runs/${run.body.id}/result`).expect(200)).body;
}

/** A fit of the check scenario over the multiplier (0.5–3, 5 points) against a one-survey set of k of n; its id and final detail. */
async function multiplierFit(setName: string, survey: { magnetic: number; total: number; label: string }, min = 0.5) {
  const set = await modeller.agent
    .post('/api/constraint-sets')
    .send({ name: setName, constraints: [{ kind: 'fraction', ...survey, citation: 'Invented for this test' }] })
    .expect(201);
  const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: SYSTEMS, seed: SEED }));
  const created = await modeller.agent
    .post('/api/fits')
    .send({ scenarioId, constraintSetId: set.body.id, parameters: [{ path: 'companions.multiplier', min, max: 3, points: 5 }] })
    .expect(201);
  return { id: created.body.id as string, fit: await waitForFit(observer.agent, created.body.id) };
}

const base = checkScenario();
const withMultiplier = (m: number) => ({ companions: { ...(base.companions as object), multiplier: m } });

describe('sweeps as one job', () => {
  it('gives every point the counts of a separate run with the same seed, readable as a run', async () => {
    const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: SYSTEMS, seed: SEED }));
    const values = [0.5, 3];
    const sweep = await modeller.agent.post('/api/sweeps').send({ scenarioId, axes: [{ path: 'giant.reachAU', values }] }).expect(201);
    let detail;
    for (let i = 0; i < 600; i++) {
      detail = (await modeller.agent.get(`/api/sweeps/${sweep.body.id}`).expect(200)).body;
      if (detail.status === 'finished') break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(detail.points.map((p: { status: string }) => p.status)).toEqual(['succeeded', 'succeeded']);
    for (const [i, reach] of values.entries()) {
      const point = detail.points[i];
      const own = (await modeller.agent.get(`/api/runs/${point.runId}/result`).expect(200)).body;
      const separate = await separateRun({ giant: { kind: 'fixedReach', reachAU: reach } });
      // Exactness of common random numbers: identical integer counts, not merely close ones.
      expect(own.counts).toEqual(separate.counts);
      expect(own.bins.wdMass).toEqual(separate.bins.wdMass);
      const methods = await modeller.agent.get(`/api/runs/${point.runId}/methods.txt`).expect(200);
      expect(methods.text).toContain(`Engulfment reach = ${reach} AU`);
      const summary = (await modeller.agent.get(`/api/runs/${point.runId}`).expect(200)).body;
      expect(summary.sweepId).toBe(sweep.body.id);
    }
  }, 180_000);
});

describe('fits', () => {
  it('gives the posterior over the multiplier that the binomial likelihood of separate runs gives', async () => {
    const multipliers = [0.5, 1.125, 1.75, 2.375, 3];
    const separate = [];
    for (const m of multipliers) separate.push(await separateRun(withMultiplier(m)));
    // An observation near the model's prediction at m ≈ 1.75, so that the posterior lies inside the range.
    const f = separate[2].counts.magnetic / separate[2].counts.whiteDwarfs;
    const total = 400;
    const magnetic = Math.round(f * total);
    const { id, fit } = await multiplierFit('One survey (illustrative)', { magnetic, total, label: 'Illustrative survey' });
    expect(fit.status).toBe('succeeded');
    expect(fit.pointCount).toBe(5);
    // One pass of ceil(20,000 / 65,536) = 1 chunk, all done; no time left.
    expect(fit).toMatchObject({ chunksDone: 1, chunkCount: 1, etaSeconds: null });
    const post = fit.posterior;
    expect(post.parameters[0].values).toEqual(multipliers);

    // The likelihood at each node is the binomial probability of k of n at the separate run's
    // predicted fraction (jStat's pmf, an independent implementation); 1e-9 covers log-gamma rounding.
    const ll = separate.map((r) => Math.log(jStat.binomial.pdf(magnetic, total, r.counts.magnetic / r.counts.whiteDwarfs)));
    post.logLikelihood.forEach((x: number, i: number) => expect(x).toBeCloseTo(ll[i], 9));

    // The 68% interval from those likelihoods, integrated independently: the density linear between
    // nodes, summed on 10^5 sub-steps. Agreement within 1e-3 of the range (the sub-step sum's error).
    const L = ll.map((x) => Math.exp(x - Math.max(...ll)));
    const steps = 100_000;
    const xs: number[] = [];
    const cdf: number[] = [];
    let acc = 0;
    for (let s = 0; s <= steps; s++) {
      const x = 0.5 + (2.5 * s) / steps;
      const j = Math.min(3, Math.floor((x - 0.5) / 0.625));
      const t = (x - multipliers[j]) / 0.625;
      const d = L[j] * (1 - t) + L[j + 1] * t;
      if (s > 0) acc += d * (2.5 / steps);
      xs.push(x);
      cdf.push(acc);
    }
    const q = (p: number) => xs[cdf.findIndex((c) => c >= p * acc)];
    const [iv] = post.intervals;
    expect(Math.abs(iv.lo68 - q(0.158655))).toBeLessThan(2.5e-3);
    expect(Math.abs(iv.hi68 - q(0.841345))).toBeLessThan(2.5e-3);

    // Best point, its scorecard, the sentence and the methods paragraph (grid, prior, set with citation, MC size, engine).
    const best = ll.indexOf(Math.max(...ll));
    expect(post.bestPoint.values).toEqual({ 'companions.multiplier': multipliers[best] });
    expect(post.bestPoint.evaluation.constraints[0].label).toBe('Illustrative survey');
    expect(post.sentence).toMatch(/^We find Occurrence multiplier between /);
    const methods = (await observer.agent.get(`/api/fits/${id}/methods.txt`).expect(200)).text;
    expect(methods).toContain('5 linearly spaced values from 0.5 to 3 with a uniform prior');
    expect(methods).toContain('Invented for this test');
    expect(methods).toContain(`${SYSTEMS.toLocaleString('en-US')} primaries`);
    expect(methods).toContain(`engine ${fit.engineVersion}`);
    // The observation sits inside the range, so no interval is flagged; the model at the best point is
    // stated in the run paragraph's words (its physics and the scenario hash), not only by name.
    expect(iv).toMatchObject({ lowerEdge: false, upperEdge: false, flat: false });
    expect(post.sentence).not.toMatch(/cut by|not constrained/);
    expect(methods).toContain(`The model at the best grid point (Occurrence multiplier = ${multipliers[best]}): We drew ${SYSTEMS.toLocaleString('en-US')} Monte Carlo primaries`);
    expect(methods).toMatch(/The scenario document \(SHA-256 [0-9a-f]{64}\)/);
    expect(methods).toContain('not corrected for the parameters fitted');
    // The check scenario's IFMR is Kalirai et al. 2008 (tests/fixtures/check-1.json): its full reference is listed.
    expect(methods).toContain('- Kalirai, J. S., Hansen, B. M. S., Kelson, D. D., et al. 2008, ApJ, 676, 594');

    // Listed for the Overview; credit reserved for every grid point (5 × 20,000 systems).
    const list = (await observer.agent.get('/api/fits').expect(200)).body.fits;
    expect(list[0]).toMatchObject({ id, status: 'succeeded', progress: 1, parameters: ['companions.multiplier'], constraintSetName: 'One survey (illustrative)' });
    const ledger = (await owner.agent.get('/api/billing/ledger?pageSize=100').expect(200)).body.entries;
    const reservation = ledger.find((e: { runId: string | null; kind: string }) => e.runId === fit.runId && e.kind === 'reservation');
    expect(reservation.description).toContain(`${(5 * SYSTEMS).toLocaleString('en-US')} systems`);
  }, 240_000);

  it('says in the sentence, the methods text and the interval flags when the posterior piles at the grid edge', async () => {
    // None magnetic of 400: the predicted fraction rises with the multiplier, so the likelihood is
    // highest at the grid's lowest value and the 68% interval's lower end is the grid's, not the data's.
    const { id, fit } = await multiplierFit('None of four hundred (illustrative)', { magnetic: 0, total: 400, label: 'Illustrative null survey' });
    expect(fit.status).toBe('succeeded');
    const post = fit.posterior;
    // The flag against the likelihood itself: 1-D, uniform prior, so the marginal is ∝ L and its value at
    // the lower edge relative to its peak is exp(ln L_0 − max ln L) (the 10% rule of grid-posterior.ts).
    const ll: number[] = post.logLikelihood;
    const atLowerEdge = Math.exp(ll[0] - Math.max(...ll));
    const atUpperEdge = Math.exp(ll[4] - Math.max(...ll));
    expect(atLowerEdge).toBeGreaterThanOrEqual(0.1);
    expect(post.intervals[0]).toMatchObject({ lowerEdge: true, upperEdge: atUpperEdge >= 0.1, flat: false });
    expect(post.sentence).toContain("cut by the grid's lower edge (0.5), where the posterior is still high");
    const methods = (await modeller.agent.get(`/api/fits/${id}/methods.txt`).expect(200)).text;
    expect(methods).toMatch(/Occurrence multiplier: [^;]*\(cut by the grid's lower edge \(0\.5\), where the posterior is still high\)/);
    expect(post.warnings.join(' ')).toMatch(/^The posterior of Occurrence multiplier is still \d+% of its peak at the lower edge/);

    // From m = 0, the lowest multiplier there is: the same data make the interval an upper limit, and no
    // warning asks for a wider range below 0.
    const fromZero = (await multiplierFit('None of four hundred, from zero (illustrative)', { magnetic: 0, total: 400, label: 'Illustrative null survey' }, 0)).fit.posterior;
    expect(fromZero.intervals[0]).toMatchObject({ lowerEdge: false, lowerLimit: true, flat: false });
    expect(fromZero.sentence).toContain('the posterior piles up at the lowest value the parameter can take (0): read it as an upper limit');
    expect(fromZero.warnings.join(' ')).not.toMatch(/widen the range/);
  }, 120_000);

  it('knows which ends of a range are the parameter’s own limits (the scenario schema’s bounds, the rows’ largest multiplier)', () => {
    // The check scenario: one planet row of occurrence 0.3 (tests/fixtures/check-1.json), so m ≤ 1/0.3;
    // α_CE is allowed from 0.01 to 10 (shared/contracts/scenario.ts).
    const scenario = parseScenario(checkScenario());
    expect(rangeLimits(scenario, { path: 'companions.multiplier', min: 0, max: 1 / 0.3 })).toEqual({ lower: true, upper: true });
    expect(rangeLimits(scenario, { path: 'companions.multiplier', min: 0.5, max: 3 })).toEqual({ lower: false, upper: false });
    expect(rangeLimits(scenario, { path: 'envelope.alpha', min: 0.01, max: 10 })).toEqual({ lower: true, upper: true });
    expect(rangeLimits(scenario, { path: 'envelope.alpha', min: 0.02, max: 2 })).toEqual({ lower: false, upper: false });
  });

  it('refuses a bad grid, naming the field, and lets observers read but not start fits', async () => {
    const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: 2000 }));
    const over = await modeller.agent
      .post('/api/fits')
      .send({ scenarioId, constraintSetId: 'library', parameters: [{ path: 'companions.multiplier', min: 0.5, max: 5, points: 3 }] })
      .expect(400);
    expect(over.body.error.field).toBe('parameters[0].max');
    const log = await modeller.agent
      .post('/api/fits')
      .send({ scenarioId, constraintSetId: 'library', parameters: [{ path: 'envelope.alpha', min: 0, max: 1, points: 3, scale: 'log' }] })
      .expect(400);
    expect(log.body.error.message).toMatch(/parameters(\[0\]|\.0)\.min must be above 0 for a log grid/);
    const big = await modeller.agent
      .post('/api/fits')
      .send({ scenarioId, constraintSetId: 'library', parameters: [{ path: 'envelope.alpha', min: 0.1, max: 1, points: 200 }, { path: 'envelope.lambda', min: 0.1, max: 1, points: 60 }] })
      .expect(400);
    expect(big.body.error.message).toMatch(/12000 grid points; a fit may have at most 10000/);
    await observer.agent.post('/api/fits').send({ scenarioId, constraintSetId: 'library', parameters: [{ path: 'envelope.alpha', min: 0.1, max: 1, points: 3 }] }).expect(403);
  }, 60_000);
});
