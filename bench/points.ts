import type { Scenario } from '../shared/contracts/scenario.ts';
import type { PreparedScenario } from '../shared/engine/kernel/prepare.ts';
import { runChunk } from '../shared/engine/kernel/run-chunk.ts';
import { preparePoints, runChunkPoints } from '../shared/engine/kernel/run-points.ts';

/** α_CE values of the benchmark sweep: 20 points log-spaced over 0.1–3. */
export const SWEEP_ALPHAS = Array.from({ length: 20 }, (_, i) => 0.1 * 30 ** (i / 19));

/**
 * Cost of a 20-point α_CE sweep on the multi-point kernel as a multiple of one single run of the
 * same chunks, measured in this process: `repeats` rounds, each timing `chunks` chunks of the
 * single run and then of the sweep (fresh chunks each round, after a warm-up of both), and the
 * median of the rounds' ratios (the machine is shared and noisy).
 */
export function sweepCostRatio(scenario: Scenario, prepared: PreparedScenario, chunks = 4, repeats = 5): number {
  const points = preparePoints(scenario, prepared, SWEEP_ALPHAS.map((alpha) => ({ 'envelope.alpha': alpha })));
  const time = (run: (chunk: number) => unknown, from: number) => {
    const t = performance.now();
    for (let i = from; i < from + chunks; i++) run(i);
    return performance.now() - t;
  };
  const single = (i: number) => runChunk(prepared, i % prepared.chunkCount);
  const sweep = (i: number) => runChunkPoints(prepared, points, i % prepared.chunkCount);
  time(single, 0);
  time(sweep, 0);
  const ratios: number[] = [];
  for (let r = 1; r <= repeats; r++) ratios.push(time(sweep, r * chunks) / time(single, r * chunks));
  ratios.sort((a, b) => a - b);
  return ratios[Math.floor(repeats / 2)];
}
