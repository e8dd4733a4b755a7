import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { fitParameterSchema } from '../../shared/contracts/fits.ts';
import { parseScenario } from '../../shared/contracts/scenario.ts';
import { prepareScenario } from '../../shared/engine/kernel/prepare.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { jStat } from '../../shared/engine/stats/testing/jstat-reference.ts';
import { fitPoints } from '../../server/modules/fits/fit-analysis.ts';
import { addMember, createTestApp, signUp, type TestContext } from '../support/test-app.ts';
import { checkScenario, createScenario, waitForFit } from '../support/runs.ts';

let ctx: TestContext;
let modeller: { agent: request.Agent };
beforeAll(async () => {
  ctx = await createTestApp();
  const admin = await signUp(ctx.app);
  modeller = await addMember(ctx, admin.me.department.id, 'modeller');
}, 60_000);
afterAll(() => ctx.close());

const SYSTEMS = 3000;
const SEED = 'large-fit';

/** A separate single run of the check scenario with the node's values written in (same seed), computed in this process. */
function separateRun(values: Record<string, number>) {
  const doc = checkScenario({ systems: SYSTEMS, seed: SEED }) as Record<string, any>;
  for (const [path, value] of Object.entries(values)) {
    const keys = path.split('.');
    keys.slice(0, -1).reduce((node, key) => node[key], doc)[keys[keys.length - 1]] = value;
  }
  return runChunk(prepareScenario(parseScenario(doc)), 0);
}

describe('a fit of thousands of grid nodes', () => {
  it('runs through POST /api/fits and gives sampled nodes the likelihood of separate runs', async () => {
    const magnetic = 12;
    const total = 400;
    const set = await modeller.agent
      .post('/api/constraint-sets')
      .send({ name: 'Large grid (illustrative)', constraints: [{ kind: 'fraction', magnetic, total, label: 'Illustrative survey', citation: 'Invented for this test' }] })
      .expect(201);
    const scenarioId = await createScenario(modeller.agent, checkScenario({ systems: SYSTEMS, seed: SEED }));
    const parameters = [
      { path: 'companions.multiplier', min: 0.5, max: 3, points: 50 },
      { path: 'envelope.alpha', min: 0.05, max: 2, points: 50 },
    ];
    const created = await modeller.agent.post('/api/fits').send({ scenarioId, constraintSetId: set.body.id, parameters }).expect(201);
    const fit = await waitForFit(modeller.agent, created.body.id, 600_000);
    expect(fit.status).toBe('succeeded');
    expect(fit.pointCount).toBe(2500);
    const nodes = fitPoints(parameters.map((p) => fitParameterSchema.parse(p)));
    // Row-major: the last parameter varies fastest. Corners, edges and inner nodes.
    const sample = [0, 49, 2450, 2499, 1275, 612, 1888, 2024, 333, 1717];
    const fractions: number[] = [];
    for (const p of sample) {
      const own = separateRun(nodes[p]);
      const f = own.magnetic / own.whiteDwarfs;
      fractions.push(f);
      // ln Binomial(12 | 400, f) from jStat (an independent implementation); 1e-9 covers log-gamma rounding.
      expect(fit.posterior.logLikelihood[p], `node ${p}: ${JSON.stringify(nodes[p])}`).toBeCloseTo(Math.log(jStat.binomial.pdf(magnetic, total, f)), 9);
    }
    // The grid moves the prediction (so the comparison could fail).
    expect(new Set(fractions).size).toBeGreaterThan(3);
  }, 600_000);
});
