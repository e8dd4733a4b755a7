import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { pino } from 'pino';
import { parseScenario, type Scenario } from '../shared/contracts/scenario.ts';
import { scenarioHash } from '../shared/engine/kernel/scenario-hash.ts';
import { addTallyInto, emptyTallyFor } from '../shared/engine/kernel/tally.ts';
import { planChunks } from '../shared/engine/kernel/chunks.ts';
import { CHUNK_SYSTEMS } from '../shared/engine/version.ts';
import { createEnginePool } from '../server/engine-pool/engine-pool.ts';
import { runScenario } from '../server/engine-pool/run-scenario.ts';
import { createRedisExecutor } from '../server/scale-out/redis-executor.ts';
import { findFreePort } from '../scripts/mariadb.ts';
import { ensureRedis, stopRedis } from '../scripts/redis.ts';

/**
 * `npm run bench:scale-out`: systems per second of one run through the embedded pool and through
 * one and two `npm run worker` processes on a private local Redis (same machine, same total
 * threads), and the coordinator's overhead: the app process's CPU time (Redis round trips and
 * merging) per batch and as a share of the run's wall time. It prints, it does not assert;
 * compare figures between runs on the same machine only.
 */
const THREADS = Number(process.env.BENCH_THREADS ?? 2);
const SYSTEMS = Number(process.env.BENCH_SYSTEMS ?? 512 * CHUNK_SYSTEMS);
const BATCH_CHUNKS = 8;
const WORKER_MAIN = fileURLToPath(new URL('../server/scale-out/worker-main.ts', import.meta.url));

const scenario: Scenario = parseScenario({
  ...JSON.parse(readFileSync(new URL('../shared/scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8')),
  systems: SYSTEMS,
  seed: 'scale-out-bench',
});
const line = (label: string, value: string) => process.stdout.write(`${label.padEnd(60)} ${value}\n`);
const fmt = (x: number, digits = 3) => x.toPrecision(digits);

async function embedded(): Promise<{ seconds: number; magnetic: number }> {
  const pool = createEnginePool({ workers: THREADS });
  try {
    await runScenario({ ...scenario, systems: THREADS * 4 * CHUNK_SYSTEMS }, { pool }); // start and warm every thread
    const t = performance.now();
    const result = await runScenario(scenario, { pool });
    return { seconds: (performance.now() - t) / 1000, magnetic: result.counts.magnetic };
  } finally {
    await pool.destroy();
  }
}

function startWorker(url: string, queue: string, threads: number): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', WORKER_MAIN], {
    env: { ...process.env, REDIS_URL: url, TIDEFIELD_QUEUE: queue, WORKER_THREADS: String(threads), LOG_LEVEL: 'warn' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

async function viaRedis(url: string, processes: number) {
  const queue = `bench-${randomBytes(4).toString('hex')}`;
  const executor = createRedisExecutor({ url, queue, batchChunks: BATCH_CHUNKS, jobsPerRun: 64, logger: pino({ level: 'warn' }) });
  const children = Array.from({ length: processes }, () => startWorker(url, queue, THREADS / processes));
  try {
    while ((await executor.workers!()).length < processes) await new Promise((r) => setTimeout(r, 200));
    const run = async (s: Scenario) => {
      const { chunkCount } = planChunks(s.systems);
      const total = emptyTallyFor(scenarioHash(s));
      let mergeMs = 0;
      let batches = 0;
      const pending = Array.from({ length: chunkCount }, (_, i) => i);
      for await (const done of executor.execute({ runId: randomBytes(8).toString('hex'), scenario: s, pending, signal: new AbortController().signal })) {
        const t = performance.now();
        addTallyInto(total, done.tally);
        mergeMs += performance.now() - t;
        batches++;
      }
      return { total, mergeMs, batches };
    };
    await run({ ...scenario, systems: THREADS * BATCH_CHUNKS * 2 * CHUNK_SYSTEMS, seed: 'warm-up' }); // workers start their threads
    const cpu = process.cpuUsage();
    const t = performance.now();
    const { total, mergeMs, batches } = await run(scenario);
    const seconds = (performance.now() - t) / 1000;
    const used = process.cpuUsage(cpu);
    const appCpuMs = (used.user + used.system) / 1000;
    return { seconds, magnetic: total.magnetic, batches, mergeMs, appCpuMs };
  } finally {
    await Promise.all(children.map((child) => new Promise((resolve) => (child.once('exit', resolve), child.kill('SIGTERM')))));
    await executor.close();
  }
}

const stateDir = mkdtempSync(path.join(os.tmpdir(), 'tidefield-bench-redis-'));
try {
  const url = await ensureRedis({ stateDir, port: await findFreePort(), log: () => {} });
  line('machine', `${os.cpus().length} cores, ${THREADS} engine threads in every mode, ${SYSTEMS.toExponential(2)} systems, ${BATCH_CHUNKS} chunks per job`);
  const base = await embedded();
  line('embedded pool: systems/s', fmt(SYSTEMS / base.seconds));
  for (const processes of [1, 2]) {
    if (THREADS % processes !== 0) continue;
    const r = await viaRedis(url, processes);
    line(`Redis, ${processes} worker process(es) × ${THREADS / processes} thread(s): systems/s`, `${fmt(SYSTEMS / r.seconds)} (${fmt((100 * base.seconds) / r.seconds)}% of embedded)`);
    line(`  coordinator CPU per batch (Redis + merge), ms`, fmt(r.appCpuMs / r.batches));
    line(`  of which merging, ms per batch`, fmt(r.mergeMs / r.batches));
    line(`  coordinator CPU as a share of the run's wall time`, `${fmt((100 * r.appCpuMs) / 1000 / r.seconds)}%`);
    line(`  same magnetic count as embedded`, String(r.magnetic === base.magnetic));
  }
} finally {
  await stopRedis(stateDir, () => {});
  rmSync(stateDir, { recursive: true, force: true });
}
