import { parseScenario, type Scenario } from '../../contracts/scenario.ts';
import { EngineError } from '../errors.ts';
import { engulfmentGridKey } from '../physics/engulfment-grid.ts';
import { engulfmentGridInputFor } from './engulfment.ts';
import { prepareScenario, type PreparedScenario } from './prepare.ts';
import { runChunk } from './run-chunk.ts';
import type { ChunkTally } from './tally.ts';

/**
 * Several parameter points of one scenario from the same draws (common random numbers).
 *
 * This is the plain form: every point is prepared as its own scenario and its chunks are run one
 * after the other, so point p's tally is by construction the tally of a separate run of the
 * scenario with point p's values and the same seed. It is correct and as slow as separate runs;
 * the one-pass kernel replaces it behind the same names.
 */

/** Parameters the kernel's random draws do not depend on (the points of one pass may differ in these). */
export const DRAW_FREE_PATHS: readonly string[] = [
  'companions.multiplier',
  'envelope.alpha',
  'envelope.lambda',
  'disruption.eta',
  'giant.reachAU',
  'field.thresholdMG',
  'field.emergenceDelayGyr',
];

export function isDrawFreePath(path: string): boolean {
  return DRAW_FREE_PATHS.includes(path) || (path.startsWith('field.') && !path.endsWith('.kind'));
}

/** A point: scenario paths and their values. */
export type PointValues = Readonly<Record<string, number>>;

export interface PreparedPoints {
  /** Each point as its own prepared scenario (sharing the engulfment grid where the point leaves it unchanged). */
  byPoint: PreparedScenario[];
}

/** The scenario with every path of the point set to its value, validated again. */
function scenarioAt(scenario: Scenario, values: PointValues): Scenario {
  const copy = structuredClone(scenario) as unknown as Record<string, unknown>;
  for (const [path, value] of Object.entries(values)) {
    const keys = path.split('.');
    let node = copy;
    for (const key of keys.slice(0, -1)) {
      const next = node[key];
      if (next === null || typeof next !== 'object') throw new EngineError(path, value, 'a numeric field of this scenario');
      node = next as Record<string, unknown>;
    }
    const last = keys[keys.length - 1];
    if (typeof node[last] !== 'number') throw new EngineError(path, value, 'a numeric field of this scenario');
    node[last] = value;
  }
  return parseScenario(copy);
}

export function preparePoints(scenario: Scenario, prepared: PreparedScenario, points: readonly PointValues[]): PreparedPoints {
  const byPoint = points.map((values) => {
    const at = scenarioAt(scenario, values);
    if (at.giant.kind === 'track' && prepared.giant.kind === 'track' && engulfmentGridKey(engulfmentGridInputFor(at)) === prepared.giant.gridKey) {
      return prepareScenario(at, { engulfmentGrid: prepared.giant.grid });
    }
    return prepareScenario(at);
  });
  return { byPoint };
}

/** One chunk at every point: tally p equals runChunk of the scenario with point p's values (same seed, same chunk). */
export function runChunkPoints(_prepared: PreparedScenario, points: PreparedPoints, chunkIndex: number): ChunkTally[] {
  return points.byPoint.map((p) => runChunk(p, chunkIndex));
}
