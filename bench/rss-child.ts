import { readFileSync } from 'node:fs';
import { parseScenario } from '../shared/contracts/scenario.ts';
import { runScenario } from '../server/engine-pool/run-scenario.ts';

/**
 * Child process of the benchmark: runs the fixed-reach baseline with `systems` primaries on
 * `workers` threads and prints one JSON line with the wall time and the peak resident set size
 * of the whole process (worker threads included).
 */
const [systemsArg, workersArg] = process.argv.slice(2);
const scenario = parseScenario({
  ...JSON.parse(readFileSync(new URL('../shared/scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8')),
  systems: Number(systemsArg),
});
const started = performance.now();
const result = await runScenario(scenario, { workers: Number(workersArg) });
const seconds = (performance.now() - started) / 1000;
process.stdout.write(
  `${JSON.stringify({ systems: scenario.systems, seconds, maxRssMB: process.resourceUsage().maxRSS / 1024, magnetic: result.counts.magnetic })}\n`,
);
