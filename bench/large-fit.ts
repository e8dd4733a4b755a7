import { readFileSync } from 'node:fs';
import { scenarioAtPoint } from '../shared/contracts/point-scenario.ts';
import { parseScenario } from '../shared/contracts/scenario.ts';
import { addPackedIntoAll, type PackedTallies } from '../shared/engine/kernel/packed-tally.ts';
import { prepareScenario } from '../shared/engine/kernel/prepare.ts';
import { preparedPoint } from '../shared/engine/kernel/run-chunk.ts';
import { preparePoints } from '../shared/engine/kernel/run-points.ts';
import { scenarioHash } from '../shared/engine/kernel/scenario-hash.ts';
import { addTallyInto, emptyTallyFor, type ChunkTally } from '../shared/engine/kernel/tally.ts';
import { buildResult } from '../shared/engine/result/build-result.ts';
import { createEnginePool } from '../server/engine-pool/engine-pool.ts';
import { checkConstraints, resolveConstraints } from '../server/modules/constraints/constraint-sets.service.ts';
import { CONSTRAINT_LIBRARY } from '../server/modules/constraints/library.ts';
import { analyseFit, fitPoints, nodeResult, type FitDefinition } from '../server/modules/fits/fit-analysis.ts';
import { encodePackedTallies } from '../server/scale-out/queue-names.ts';

/**
 * `npm run bench:large-fit`: the parts of a large fit that grow with the number of grid nodes,
 * the way they were done before (every point prepared in full; each point's tally a structured
 * clone between threads and JSON through Redis; every node's full result, with the comparison
 * against the scenario's own observed counts) and the way they are done now (points derived from
 * the shared draws; one packed buffer moved between threads and deflated for Redis; the node's
 * result as the fit scores it), in one process on a 2-thread pool. Figures are seconds per 1000
 * grid nodes (for the batch: per chunk of 65,536 systems with the default BENCH_SYSTEMS); the
 * kernel's own loop is the same in both. The old preparation also compared every point's draws in full (≈ 40% more than
 * its prepareScenario): not repeated here, so the "before" figure is a lower bound.
 *
 * Grid: companions.multiplier (0.1–4) × envelope.alpha (0.01–2), log-spaced, on the fixed-reach
 * baseline with the library constraints. BENCH_MULTIPLIERS × BENCH_ALPHAS nodes (default 40 × 50),
 * BENCH_SYSTEMS systems (default one chunk).
 */
const multipliers = Number(process.env.BENCH_MULTIPLIERS ?? 40);
const alphas = Number(process.env.BENCH_ALPHAS ?? 50);
const systems = Number(process.env.BENCH_SYSTEMS ?? 65_536);
const document = JSON.parse(readFileSync(new URL('../shared/scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8'));
const base = parseScenario({ ...document, systems, seed: 'bench-large-fit' });
const parameters = [
  { path: 'companions.multiplier', min: 0.1, max: 4, points: multipliers, scale: 'log' as const, prior: 'logUniform' as const },
  { path: 'envelope.alpha', min: 0.01, max: 2, points: alphas, scale: 'log' as const, prior: 'logUniform' as const },
];
const points = fitPoints(parameters);
const scenario = scenarioAtPoint(base, points[0]);
const scenarios = points.map((values) => scenarioAtPoint(base, values));
const perThousand = (ms: number) => (ms / 1000 / (points.length / 1000)).toFixed(2);
const freshTotals = () => scenarios.map((s) => emptyTallyFor(scenarioHash(s)));
const timed = async <T>(run: () => T | Promise<T>): Promise<[T, number]> => {
  const started = performance.now();
  const value = await run();
  return [value, performance.now() - started];
};

console.log(`Large fit: ${multipliers} × ${alphas} = ${points.length} grid nodes, one batch of ${systems.toLocaleString('en-US')} systems (chunk 0), 2 pool threads`);
console.log(`${'seconds per 1000 grid nodes'.padEnd(72)}  before    now   ratio`);
const line = (label: string, before: number, now: number) =>
  console.log(`${label.padEnd(72)} ${perThousand(before).padStart(7)} ${perThousand(now).padStart(6)} ${(before / now).toFixed(1).padStart(6)}×`);

// 1. Preparing the points (the server's main thread, before the first chunk).
const prepared = prepareScenario(scenario);
const [, fullMs] = await timed(() => scenarios.map((s) => preparedPoint(prepareScenario(s))));
const [pass, derivedMs] = await timed(() => preparePoints(scenario, prepared, points));
line('preparing the points (once per fit)', fullMs, derivedMs);

// 2. One chunk on the pool, the tallies back on the main thread, summed into the running totals.
const pool = createEnginePool({ workers: 2 });
const task = { prepared, chunks: [0], passes: [{ prepared, points: pass, indices: points.map((_, i) => i) }] };
try {
  // Both threads started and their modules loaded before anything is timed.
  await Promise.all([pool.run({ prepared, chunks: [0] }), pool.run({ prepared, chunks: [0] })]);
  const beforeTotals = freshTotals();
  const [tallies, cloneMs] = await timed(async () => (await pool.run(task)) as ChunkTally[]);
  // Summed twice and the second timed: every batch after the first (the first also turns the totals' integer arrays to doubles where a count lands).
  const addBefore = () => tallies.forEach((tally, p) => addTallyInto(beforeTotals[p], tally));
  addBefore();
  const [, addMs] = await timed(addBefore);
  const nowTotals = freshTotals();
  const [packed, movedMs] = await timed(async () => (await pool.run({ ...task, packed: true })) as PackedTallies);
  addPackedIntoAll(nowTotals, packed);
  const [, addPackedMs] = await timed(() => addPackedIntoAll(nowTotals, packed));
  line('one batch (one chunk by default): kernel, tallies back to the main thread', cloneMs, movedMs);
  // What crossing threads costs without the kernel (whose time follows the machine's load): a structured clone of the tallies against moving one buffer.
  const [, crossMs] = await timed(() => structuredClone(tallies));
  const copy = { ...packed, counts: packed.counts.slice() };
  const [, moveMs] = await timed(() => structuredClone(copy, { transfer: [copy.counts.buffer] }));
  line('  of which the tallies crossing threads (structured clone, no kernel)', crossMs, moveMs);
  line('  of which summing a batch into the running totals (main thread)', addMs, addPackedMs);
  if (JSON.stringify(beforeTotals) !== JSON.stringify(nowTotals)) throw new Error('the packed path gave other counts than the cloned one');

  // 3. A batch's tallies through Redis (the scale-out worker encodes, the app decodes).
  const [json, jsonMs] = await timed(() => JSON.parse(JSON.stringify(tallies)) as ChunkTally[]);
  const [wire, wireMs] = await timed(() => JSON.parse(JSON.stringify(encodePackedTallies(packed))) as { counts: string });
  line('  of which a batch through Redis (encode + JSON + decode, no network)', jsonMs, wireMs);
  console.log(`  (batch size in Redis: ${(JSON.stringify(json).length / 1e6).toFixed(1)} MB of JSON arrays before, ${(wire.counts.length / 1e6).toFixed(2)} MB of deflated base64 now)`);

  // 4. Scoring every node against the constraint set at the end of the fit.
  const constraints = resolveConstraints(checkConstraints(CONSTRAINT_LIBRARY.map((c) => ({ libraryId: c.id }))));
  const definition: FitDefinition = { scenario, parameters, constraints, constraintSet: { id: 'library', name: 'library', version: null } };
  const [fullPosterior, fullScoreMs] = await timed(() => analyseFit(definition, points.length, (i) => buildResult(scenarios[i], nowTotals[i])));
  const [posterior, scoreMs] = await timed(() => analyseFit(definition, points.length, (i) => nodeResult(scenarios[i], nowTotals[i])));
  line('scoring the nodes (results, constraints, posterior; once per fit)', fullScoreMs, scoreMs);
  if (JSON.stringify(fullPosterior) !== JSON.stringify(posterior)) throw new Error('the node results gave another posterior than the full results');
  console.log(`(every count of every node and the posterior were the same both ways; ${posterior.sentence})`);
} finally {
  await pool.destroy();
}
