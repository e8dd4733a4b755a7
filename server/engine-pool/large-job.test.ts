import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { scenarioAtPoint } from '../../shared/contracts/point-scenario.ts';
import { parseScenario } from '../../shared/contracts/scenario.ts';
import { addPackedIntoAll } from '../../shared/engine/kernel/packed-tally.ts';
import { prepareScenario } from '../../shared/engine/kernel/prepare.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { scenarioHash } from '../../shared/engine/kernel/scenario-hash.ts';
import { emptyTallyFor } from '../../shared/engine/kernel/tally.ts';
import { fitPoints } from '../modules/fits/fit-analysis.ts';
import { createEnginePool } from './engine-pool.ts';
import { createPoolExecutor } from './pool-executor.ts';

/**
 * A fit of a few thousand grid nodes through the executor the server's scheduler uses (points
 * prepared from the shared draws, tallies packed on the worker, moved, added from the packed form):
 * every node's counts equal those of a separate single run of the document with the node's values
 * written in and parsed again, on the same seed (the contract of common random numbers). Checked
 * exactly for a spread of nodes, including the four corners of the grid.
 */
const document = JSON.parse(readFileSync(new URL('../../shared/scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8'));
const base = parseScenario({ ...document, systems: 2500, seed: 'large-job' });
const parameters = [
  { path: 'companions.multiplier', min: 0.1, max: 4, points: 60, scale: 'log' as const, prior: 'logUniform' as const },
  { path: 'envelope.alpha', min: 0.01, max: 2, points: 50, scale: 'log' as const, prior: 'logUniform' as const },
];
const pool = createEnginePool({ workers: 2 });
afterAll(() => pool.destroy());

/** A separate run: the document with the point's values written in, parsed and prepared in full. */
function separateRun(values: Record<string, number>) {
  const doc = structuredClone({ ...document, systems: base.systems, seed: base.seed });
  for (const [path, value] of Object.entries(values)) {
    const keys = path.split('.');
    const parent = keys.slice(0, -1).reduce((node, key) => node[key], doc);
    parent[keys[keys.length - 1]] = value;
  }
  return runChunk(prepareScenario(parseScenario(doc)), 0);
}

describe('a fit of thousands of grid nodes', () => {
  it('gives every sampled node the counts of a separate run, through the pool executor', async () => {
    const points = fitPoints(parameters);
    expect(points.length).toBe(3000);
    const scenario = scenarioAtPoint(base, points[0]);
    const totals = points.map((values) => emptyTallyFor(scenarioHash(scenarioAtPoint(base, values))));
    const executor = createPoolExecutor({ pool });
    for await (const batch of executor.execute({ runId: 'large', scenario, pending: [0], signal: new AbortController().signal, points })) {
      expect(batch.tally.scenarioHash).toBe(totals[0].scenarioHash);
      addPackedIntoAll(totals, batch.pointTallies!);
    }
    const sample = [0, 49, 2950, 2999, 1234, 1777, 2222, 333, 1500, 2601];
    for (const p of sample) expect(totals[p], `node ${p}: ${JSON.stringify(points[p])}`).toEqual(separateRun(points[p]));
    // The grid moves the counts (so the comparison could fail): the corners differ.
    expect(new Set(sample.slice(0, 4).map((p) => totals[p].magnetic)).size).toBeGreaterThan(1);
  }, 300_000);
});
