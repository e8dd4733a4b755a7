import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { parseScenario, type Scenario } from '../../shared/contracts/scenario.ts';
import { emptyTally } from '../../shared/engine/kernel/empty-tally.ts';
import { prepareScenario } from '../../shared/engine/kernel/prepare.ts';
import { runChunk } from '../../shared/engine/kernel/run-chunk.ts';
import { addTally, type ChunkTally } from '../../shared/engine/kernel/tally.ts';
import { buildResult } from '../../shared/engine/result/build-result.ts';
import { createEnginePool } from './engine-pool.ts';
import { runScenario } from './run-scenario.ts';

const scenario = (overrides: Record<string, unknown> = {}): Scenario =>
  parseScenario({ ...JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8')), systems: 400_000, ...overrides });

const shared = createEnginePool({ workers: 2 });
afterAll(async () => {
  await shared.destroy();
});

describe('runScenario on a piscina pool', () => {
  it('gives bit-identical result JSON for 1, 2 and 3 workers, equal to an in-process run', async () => {
    const s = scenario();
    const prepared = prepareScenario(s);
    let tally = emptyTally(prepared);
    for (let i = 0; i < prepared.chunkCount; i++) tally = addTally(tally, runChunk(prepared, i));
    const reference = JSON.stringify(buildResult(s, tally));
    for (const workers of [1, 2, 3]) {
      const result = await runScenario(s, { workers, chunksPerTask: 1 + (workers % 2) });
      expect(JSON.stringify(result), `${workers} workers`).toBe(reference);
    }
    const other = await runScenario(scenario({ seed: 'another' }), { pool: shared });
    expect(other.counts.magnetic).not.toBe(JSON.parse(reference).counts.magnetic);
  }, 60_000);

  it('reports every chunk and resumes from stored chunk tallies to the same result', async () => {
    const s = scenario();
    const seen = new Map<number, ChunkTally>();
    const progress: number[] = [];
    const full = await runScenario(s, {
      pool: shared,
      chunksPerTask: 1,
      onBatch: ({ chunks, tally }) => seen.set(chunks[0], tally),
      onProgress: (p) => progress.push(p.chunksDone),
    });
    expect([...seen.keys()].sort((a, b) => a - b)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(progress[progress.length - 1]).toBe(7);
    const stored = JSON.parse(JSON.stringify([...seen].filter(([i]) => i % 2 === 0))) as [number, ChunkTally][];
    const initialTally = stored.reduce((a, [, t]) => addTally(a, t), emptyTally(prepareScenario(s)));
    const resumed = await runScenario(s, { pool: shared, skipChunks: stored.map(([i]) => i), initialTally });
    expect(resumed).toEqual(full);
  }, 60_000);

  it('fails the run with the error of a worker that throws, and the shared pool stays usable', async () => {
    const failing = createEnginePool({ workers: 2, filename: new URL('./failing-chunk-task.fixture.mjs', import.meta.url).href });
    try {
      await expect(runScenario(scenario(), { pool: failing, chunksPerTask: 1 })).rejects.toThrow(/deliberate failure in chunk 3/);
      // Three chunks (0–2) never touch the failing one.
      const small = await runScenario(scenario({ systems: 3 * 65536 }), { pool: failing });
      expect(small.counts.primaries).toBe(3 * 65536);
    } finally {
      await failing.destroy();
    }
  }, 60_000);

  it('cancels promptly with an AbortError and leaves the pool usable', async () => {
    const controller = new AbortController();
    let chunks = 0;
    const run = runScenario(scenario({ systems: 40 * 65536 }), {
      pool: shared,
      chunksPerTask: 1,
      signal: controller.signal,
      onBatch: () => {
        chunks++;
        if (chunks === 1) controller.abort();
      },
    });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
    expect(chunks).toBeLessThan(40);
    const after = await runScenario(scenario({ systems: 65536 }), { pool: shared });
    expect(after.complete).toBe(true);
    await expect(runScenario(scenario(), { pool: shared, signal: AbortSignal.abort() })).rejects.toMatchObject({ name: 'AbortError' });
  }, 60_000);
});
