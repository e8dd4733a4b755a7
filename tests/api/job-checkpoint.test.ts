/**
 * Checkpoints of a 10^4-point fit (issue 14: one JSON document of every point's tally outgrew
 * MariaDB's max_allowed_packet above a few thousand points). The tallies are stored one row per
 * point, written and read in batches, and handed over whole when a failed job is resumed.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseScenario } from '../../shared/contracts/scenario.ts';
import { emptyTallyFor, type ChunkTally } from '../../shared/engine/kernel/tally.ts';
import { scenarioHash } from '../../shared/engine/kernel/scenario-hash.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { newId } from '../../server/db/columns.ts';
import type { Database } from '../../server/db/client.ts';
import { insertRun, loadCheckpoint, loadCheckpointTallies, moveCheckpoint, saveJobCheckpoint } from '../../server/modules/runs/runs.repository.ts';
import { createTestDatabase } from '../support/test-app.ts';
import { checkScenario } from '../support/runs.ts';

let database: Database;
let drop: () => Promise<void>;
beforeAll(async () => {
  ({ database, drop } = await createTestDatabase());
}, 60_000);
afterAll(() => drop());

const POINTS = 10_000;

async function aRun(): Promise<string> {
  const snapshot = parseScenario(checkScenario({ systems: 1000 }));
  const id = newId();
  await insertRun(database.db, {
    id, departmentId: newId(), ownerUserId: newId(), scenarioId: newId(), scenarioVersion: 1, scenarioName: 'Checkpoint test', snapshot,
    scenarioHash: scenarioHash(snapshot), seed: snapshot.seed, systems: 1000, engineVersion: ENGINE_VERSION, status: 'failed', chunkCount: 1, costCredits: 0, createdAt: new Date(),
  });
  return id;
}

/** A tally per point whose every count says which point it is (so a swapped or lost row shows). */
function pointTallies(): ChunkTally[] {
  return Array.from({ length: POINTS }, (_, p) => {
    const tally = emptyTallyFor(`point-${p}`);
    tally.systems = 1000;
    tally.whiteDwarfs = p;
    tally.fateMap = tally.fateMap.map((_, i) => (p * 7 + i) % 100_000);
    tally.wdMassMagnetic = tally.wdMassMagnetic.map((_, i) => p + i);
    return tally;
  });
}

describe('the checkpoint of a 10^4-point job', () => {
  it('is written in batches below max_allowed_packet, read back exactly, and handed over on resume', async () => {
    const tallies = pointTallies();
    // The reason for the per-point rows: the job as one document is larger than one packet may be.
    const [[{ packet }]] = (await database.pool.query('SELECT @@max_allowed_packet AS packet')) as unknown as [[{ packet: number }]];
    expect(JSON.stringify(tallies).length).toBeGreaterThan(Number(packet));

    const failed = await aRun();
    await saveJobCheckpoint(database.db, failed, tallies, [[0, 0]]);
    // Written twice (the second write updates the rows in place).
    tallies[42].whiteDwarfs += 1;
    await saveJobCheckpoint(database.db, failed, tallies, [[0, 1]]);

    const resumed = await aRun();
    expect(await moveCheckpoint(database.db, failed, resumed)).toBe(true);
    expect(await loadCheckpoint(database.db, failed)).toBeUndefined();
    // Read back (after the hand-over) exactly as last written.
    const moved = (await loadCheckpoint(database.db, resumed))!;
    expect(moved.doneChunks).toEqual([[0, 1]]);
    expect(await loadCheckpointTallies(database.db, moved, POINTS)).toEqual(tallies);
  }, 120_000);
});
