import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseScenario, type Scenario } from '../../shared/contracts/scenario.ts';
import { BatchFailedError, pendingBatches } from './chunk-executor.ts';
import { createEnginePool } from './engine-pool.ts';
import { createPoolExecutor } from './pool-executor.ts';
import { runScenario } from './run-scenario.ts';

const FIXTURE = new URL('./failing-chunk-task.fixture.mjs', import.meta.url).href;
const scenario = (overrides: Record<string, unknown> = {}): Scenario =>
  parseScenario({ ...JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8')), systems: 400_000, ...overrides });

describe('pendingBatches', () => {
  it('cuts pending chunks along the fixed partition, so a batch keeps its index across restarts', () => {
    expect(pendingBatches([0, 1, 2, 3, 4, 5, 6], 3)).toEqual([
      { batch: 0, chunks: [0, 1, 2] },
      { batch: 1, chunks: [3, 4, 5] },
      { batch: 2, chunks: [6] },
    ]);
    // Chunks 0–2 and 4 done: batch 0 disappears, batch 1 keeps its index with what is left.
    expect(pendingBatches([6, 3, 5], 3)).toEqual([
      { batch: 1, chunks: [3, 5] },
      { batch: 2, chunks: [6] },
    ]);
  });
});

describe('a failing worker thread (issue: a crash fails the whole run)', () => {
  it('retries a failing batch twice, then fails with the chunks and the cause, having delivered the other batches', async () => {
    const pool = createEnginePool({ workers: 2, filename: FIXTURE });
    const retries: number[] = [];
    const executor = createPoolExecutor({ pool, chunksPerTask: 1, onRetry: ({ chunks, attempt }) => chunks.includes(3) && retries.push(attempt) });
    const delivered: number[] = [];
    try {
      const run = (async () => {
        for await (const done of executor.execute({ runId: 'r', scenario: scenario(), pending: [0, 1, 2, 3, 4, 5, 6], signal: new AbortController().signal })) {
          delivered.push(...done.chunks);
        }
      })();
      const error = await run.then(() => null, (e: unknown) => e);
      expect(error).toBeInstanceOf(BatchFailedError);
      expect((error as BatchFailedError).chunks).toEqual([3]);
      expect((error as BatchFailedError).attempts).toBe(3);
      expect((error as Error).message).toMatch(/deliberate failure in chunk 3/);
      expect(retries).toEqual([1, 2]);
      expect(delivered).not.toContain(3);
    } finally {
      await pool.destroy();
    }
  }, 60_000);

  it('a thread that crashes once is replaced and the retried batch gives the uninterrupted result', async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'tidefield-crash-'));
    const marker = path.join(dir, 'crashed');
    process.env.TIDEFIELD_FIXTURE_CRASH_ONCE = marker;
    const pool = createEnginePool({ workers: 2, filename: FIXTURE });
    try {
      const reference = await runScenario(scenario(), { workers: 2 });
      const retried = await runScenario(scenario(), { pool, chunksPerTask: 1 });
      expect(readFileSync(marker, 'utf8')).toBe('crashed\n');
      expect(JSON.stringify(retried)).toBe(JSON.stringify(reference));
    } finally {
      delete process.env.TIDEFIELD_FIXTURE_CRASH_ONCE;
      await pool.destroy();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
