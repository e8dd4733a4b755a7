import type { Scenario } from '../../shared/contracts/scenario.ts';
import { scenarioAtPoint } from '../../shared/contracts/point-scenario.ts';
import type { PreparedScenario } from '../../shared/engine/kernel/prepare.ts';
import { preparePoints, splitPointValues, type PointValues, type PreparedPoints } from '../../shared/engine/kernel/run-points.ts';

/** One kernel pass of a multi-point job: its scenario prepared, its draw-free points, their places in the job's list. */
export interface PointPass {
  prepared: PreparedScenario;
  points: PreparedPoints;
  indices: number[];
}

/**
 * Prepares the passes of a multi-point job: points that differ only in draw-free values share
 * one pass of the kernel; each distinct value of the other paths (age, giant.reimersEta, …)
 * gets its own pass on the same seed. `prepare` is the caller's cached prepareScenario (it
 * resolves the track grid of each pass's scenario).
 */
export async function preparePointPasses(scenario: Scenario, points: readonly PointValues[], prepare: (scenario: Scenario) => Promise<PreparedScenario>): Promise<PointPass[]> {
  return Promise.all(
    splitPointValues(points).map(async (group) => {
      const passScenario = scenarioAtPoint(scenario, group.shared);
      const prepared = await prepare(passScenario);
      return { prepared, points: preparePoints(passScenario, prepared, group.points), indices: group.indices };
    }),
  );
}
