import type { PreparedScenario } from './prepare.ts';
import { emptyTallyFor, type ChunkTally } from './tally.ts';

/** An all-zero tally for the prepared scenario (the start of a sum over chunks). */
export function emptyTally(prepared: Pick<PreparedScenario, 'scenarioHash'>): ChunkTally {
  return emptyTallyFor(prepared.scenarioHash);
}
