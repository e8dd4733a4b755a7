import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseScenario, type Scenario } from '../shared/contracts/scenario.ts';
import { engulfmentGridInputFor } from '../shared/engine/kernel/engulfment.ts';
import { prepareScenario, type PreparedScenario } from '../shared/engine/kernel/prepare.ts';
import { runChunk } from '../shared/engine/kernel/run-chunk.ts';
import { buildEngulfmentGrid, commonEnvelopeOnset } from '../shared/engine/physics/engulfment-grid.ts';
import { chunkUniform } from '../shared/engine/random.ts';
import { CHUNK_SYSTEMS } from '../shared/engine/version.ts';
import { createEnginePool } from '../server/engine-pool/engine-pool.ts';
import { floorSystemsPerSecond } from './kernel-floor.ts';
import { sweepCostRatio } from './points.ts';
import { runScenario } from '../server/engine-pool/run-scenario.ts';

/**
 * `npm run bench`: the engine's figures from one run on this machine. It prints, it does not
 * assert. Figures: raw generator draws per second; kernel systems per second per thread for
 * the baseline with fixedReach and with track; the track grid build time and the onset-state
 * lookup rate (engine 2's per-system cost of the common-envelope onset); the 2-worker versus
 * 1-worker speed-up on a warm pool; peak RSS at 1e6 and 1e8 systems (child processes); the cost
 * of a 20-point α_CE sweep on the multi-point kernel as a multiple of one run (bench/points.ts); and
 * the ratios the targets are stated in.
 */

const load = (name: string, overrides: Record<string, unknown> = {}): Scenario =>
  parseScenario({ ...JSON.parse(readFileSync(new URL(`../shared/scenarios/${name}.json`, import.meta.url), 'utf8')), ...overrides });

const line = (label: string, value: string) => process.stdout.write(`${label.padEnd(52)} ${value}\n`);
const fmt = (x: number, digits = 3) => x.toPrecision(digits);

function drawsPerSecond(): number {
  const u = chunkUniform('bench', 0);
  let sink = 0;
  for (let i = 0; i < 1e7; i++) sink += u(); // warm-up
  const n = 1e8;
  const t = performance.now();
  for (let i = 0; i < n; i++) sink += u();
  const seconds = (performance.now() - t) / 1000;
  if (sink < 0) throw new Error('unreachable');
  return n / seconds;
}

function kernelSystemsPerSecond(prepared: PreparedScenario, chunks: number): number {
  for (let i = 0; i < 3; i++) runChunk(prepared, i); // warm-up (JIT)
  const t = performance.now();
  for (let i = 3; i < 3 + chunks; i++) runChunk(prepared, i);
  return (chunks * CHUNK_SYSTEMS) / ((performance.now() - t) / 1000);
}

/** The onset-state lookup on its own: random (M1, M2, a0) inside the grid, all inside a_crit or not. */
function onsetLookupsPerSecond(grid: ReturnType<typeof buildEngulfmentGrid>): number {
  const u = chunkUniform('bench-onset', 0);
  const out = new Float64Array(4);
  const n = 2e6;
  const m1 = new Float64Array(n);
  const m2 = new Float64Array(n);
  const a0 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    m1[i] = 1 + 4 * u();
    m2[i] = 1e-3 * 500 ** u();
    a0[i] = 0.01 * 1000 ** u();
  }
  let hits = 0;
  for (let i = 0; i < n / 10; i++) if (commonEnvelopeOnset(grid, m1[i], m2[i], a0[i], out)) hits++; // warm-up
  const t = performance.now();
  for (let i = 0; i < n; i++) if (commonEnvelopeOnset(grid, m1[i], m2[i], a0[i], out)) hits++;
  const seconds = (performance.now() - t) / 1000;
  if (hits < 0) throw new Error('unreachable');
  return n / seconds;
}

async function poolSeconds(workers: number, systems: number): Promise<number> {
  const pool = createEnginePool({ workers });
  try {
    await runScenario(load('baseline-fixed-reach', { systems: workers * 4 * CHUNK_SYSTEMS }), { pool }); // start and warm every worker
    const t = performance.now();
    await runScenario(load('baseline-fixed-reach', { systems, seed: 'speed-up' }), { pool });
    return (performance.now() - t) / 1000;
  } finally {
    await pool.destroy();
  }
}

function childRun(systems: number, workers: number): { seconds: number; maxRssMB: number } {
  const script = fileURLToPath(new URL('./rss-child.ts', import.meta.url));
  const out = execFileSync(process.execPath, ['--import', 'tsx', script, String(systems), String(workers)], { encoding: 'utf8' });
  return JSON.parse(out.trim().split('\n').pop()!);
}

const draws = drawsPerSecond();
line('raw generator (seedrandom xor4096) draws / s', fmt(draws));

const fixed = prepareScenario(load('baseline-fixed-reach', { systems: 64 * CHUNK_SYSTEMS }));
const fixedRate = kernelSystemsPerSecond(fixed, 60);
line('kernel, baseline fixedReach, systems / s / thread', fmt(fixedRate));

const trackScenario = load('baseline-track', { systems: 64 * CHUNK_SYSTEMS });
const gridStart = performance.now();
const grid = buildEngulfmentGrid(engulfmentGridInputFor(trackScenario));
const gridSeconds = (performance.now() - gridStart) / 1000;
line('track grid (24 × 16, 64 onset samples each) build time, s', fmt(gridSeconds));
const onsetRate = onsetLookupsPerSecond(grid);
line('common-envelope onset lookups / s (engine 2 table)', fmt(onsetRate));
const trackRate = kernelSystemsPerSecond(prepareScenario(trackScenario, { engulfmentGrid: grid }), 60);
line('kernel, baseline track, systems / s / thread', fmt(trackRate));

// ---- multi-point kernel (issue 14): a 20-point α_CE sweep in one pass, as a multiple of one run ----
const fixedSweepRatio = sweepCostRatio(load('baseline-fixed-reach', { systems: 64 * CHUNK_SYSTEMS }), fixed);
const trackSweepRatio = sweepCostRatio(trackScenario, prepareScenario(trackScenario, { engulfmentGrid: grid }));
line('20-point α_CE sweep / one run, fixedReach (×)', fmt(fixedSweepRatio));
line('20-point α_CE sweep / one run, track (×)', fmt(trackSweepRatio));
// ---- end of the multi-point kernel block ----

const speedSystems = 150 * CHUNK_SYSTEMS;
const one = await poolSeconds(1, speedSystems);
const two = await poolSeconds(2, speedSystems);
line(`pool, ${fmt(speedSystems)} systems, 1 worker, s`, fmt(one));
line(`pool, ${fmt(speedSystems)} systems, 2 workers, s`, fmt(two));

const small = childRun(1e6, 2);
const big = childRun(1e8, 2);
line('peak RSS at 1e6 systems (2 workers), MB', fmt(small.maxRssMB));
line('peak RSS at 1e8 systems (2 workers), MB', fmt(big.maxRssMB));
line('1e8 baseline systems on 2 workers, s', fmt(big.seconds));

process.stdout.write('\nratios\n');
const drawsPerSystem = draws / fixedRate;
const speedUp = one / two;
const rssGrowth = big.maxRssMB - small.maxRssMB;
line('generator draws per kernel system (fixedReach)', fmt(drawsPerSystem));
line('generator draws per kernel system (track)', fmt(draws / trackRate));
line('track / fixedReach kernel speed (engine 1: 0.73)', fmt(trackRate / fixedRate));
line('onset lookups per track kernel system', fmt(onsetRate / trackRate));
line('grid build time in fixedReach kernel systems', fmt(gridSeconds * fixedRate));
line('2-worker speed-up', fmt(speedUp));
line('RSS growth 1e6 → 1e8 systems, MB', fmt(rssGrowth));

process.stdout.write('\ntargets\n');
const target = (label: string, met: boolean, detail: string) => line(label, `${met ? 'met' : 'NOT met'} (${detail})`);
target('≤ 10 generator draws per kernel system', drawsPerSystem <= 10, `${fmt(drawsPerSystem)} draws' worth of time per system`);
target('2-worker speed-up ≥ 1.8', speedUp >= 1.8, fmt(speedUp));
target('RSS growth 1e6 → 1e8 < 20 MB', rssGrowth < 20, `${fmt(rssGrowth)} MB`);
target('1e8 baseline systems < 60 s on 2 cores', big.seconds < 60, `${fmt(big.seconds)} s`);
// multi-point kernel (issue 14)
target('20-point α_CE sweep ≤ 3 runs (fixedReach)', fixedSweepRatio <= 3, `${fmt(fixedSweepRatio)} × one run`);
target('20-point α_CE sweep ≤ 3 runs (track)', trackSweepRatio <= 3, `${fmt(trackSweepRatio)} × one run`);

// ---- single-run kernel cost in generator draws (issue 14 item 2, single-run half) ----------------
// Per-system kernel time over the time of one raw generator draw, both measured above in this
// process (the raw draws first, before any kernel run warms other closures: the conservative
// figure). Target ≤ 40 for fixedReach.
{
  const fixedDraws = draws / fixedRate;
  const trackDraws = draws / trackRate;
  process.stdout.write('\nsingle-run kernel\n');
  line("draws' time per system (fixedReach)", fmt(fixedDraws));
  line("draws' time per system (track)", fmt(trackDraws));
  // What the draws, table reads and counts cost with no physics at all (bench/kernel-floor.ts):
  // the part of the figure above that no change to the fates can remove.
  const floorDraws = draws / floorSystemsPerSecond(fixed, 60);
  line("floor: draws and counts only, no fates (fixedReach)", fmt(floorDraws));
  line('kernel / floor (fixedReach)', fmt(fixedDraws / floorDraws));
  target("≤ 40 draws' time per system (fixedReach)", fixedDraws <= 40, `${fmt(fixedDraws)}`);
}
// ---- end of the single-run kernel block ------------------------------------------------------------
