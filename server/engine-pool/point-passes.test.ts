import { describe, expect, it } from 'vitest';
import { parseScenario, type Scenario } from '../../shared/contracts/scenario.ts';
import { prepareScenario } from '../../shared/engine/kernel/prepare.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { splitPointValues } from '../../shared/engine/kernel/run-points.ts';
import runChunkBatch from './chunk-task.ts';
import { preparePointPasses } from './point-passes.ts';

/**
 * A multi-point job whose points also differ in a path that changes the draws (the age of a
 * constant-star-formation population): one kernel pass per age, and every point's tally
 * identical to a separate run of the document with that point's values written in and parsed
 * again (the sweeps' contract: a sweep point equals a single run with the same seed).
 */
const document = {
  seed: 'passes',
  systems: 8000,
  primaries: { imf: { law: 'salpeter1955' }, massRangeMsun: [1, 6], history: { kind: 'constant', ageGyr: 10 }, ifmr: { relation: 'kalirai2008' } },
  companions: {
    multiplier: 1,
    rows: [{ class: 'planet', massMJup: [0.3, 40], periodDays: [2, 20000], occurrence: 0.5, shape: { kind: 'powerlaw', massSlope: -0.31, periodSlope: 0.26 } }],
  },
  giant: { kind: 'fixedReach', reachAU: 3 },
  envelope: { alpha: 1, lambda: 0.5 },
};

function withValues(values: Record<string, number>): Scenario {
  const copy = structuredClone(document) as Record<string, unknown>;
  for (const [path, value] of Object.entries(values)) {
    const keys = path.split('.');
    let node = copy;
    for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
    node[keys[keys.length - 1]] = value;
  }
  return parseScenario(copy);
}

const points = [
  { 'primaries.history.ageGyr': 10, 'envelope.alpha': 1 },
  { 'primaries.history.ageGyr': 6, 'envelope.alpha': 1 },
  { 'primaries.history.ageGyr': 10, 'envelope.alpha': 0.2 },
  { 'primaries.history.ageGyr': 6, 'envelope.alpha': 0.2 },
];

describe('multi-point jobs over draw-changing paths', () => {
  it('groups points by their draw-changing values, in the order of first appearance', () => {
    const groups = splitPointValues(points);
    expect(groups.map((g) => g.shared)).toEqual([{ 'primaries.history.ageGyr': 10 }, { 'primaries.history.ageGyr': 6 }]);
    expect(groups.map((g) => g.indices)).toEqual([[0, 2], [1, 3]]);
    expect(groups[0].points).toEqual([{ 'envelope.alpha': 1 }, { 'envelope.alpha': 0.2 }]);
  });

  it('gives every point the tally of a separate run with its values and the same seed', async () => {
    const scenario = withValues(points[0]);
    const passes = await preparePointPasses(scenario, points, async (s) => prepareScenario(s));
    const tallies = runChunkBatch({ prepared: prepareScenario(scenario), chunks: [0], passes });
    expect(Array.isArray(tallies) && tallies.length).toBe(points.length);
    points.forEach((values, p) => expect((tallies as unknown[])[p]).toEqual(runChunk(prepareScenario(withValues(values)), 0)));
    // The age changes the outcome (so the test can fail if a pass used the wrong scenario).
    const [young, old] = [(tallies as { whiteDwarfs: number }[])[1], (tallies as { whiteDwarfs: number }[])[0]];
    expect(young.whiteDwarfs).toBeLessThan(old.whiteDwarfs);
  }, 60_000);
});
