import { fileURLToPath } from 'node:url';
import { fitFileSchema, type FitDetail } from '../../shared/contracts/fits.ts';
import { scenarioAtPoint } from '../../shared/contracts/point-scenario.ts';
import { parseScenario, ScenarioValidationError, withParameter } from '../../shared/contracts/scenario.ts';
import { planChunks } from '../../shared/engine/kernel/chunks.ts';
import { scenarioHash } from '../../shared/engine/kernel/scenario-hash.ts';
import { addPackedIntoAll } from '../../shared/engine/kernel/packed-tally.ts';
import { emptyTallyFor } from '../../shared/engine/kernel/tally.ts';
import { EngineError } from '../../shared/engine/errors.ts';
import { ENGINE_VERSION } from '../../shared/engine/version.ts';
import { createEnginePool, defaultWorkerCount } from '../engine-pool/engine-pool.ts';
import { createPoolExecutor } from '../engine-pool/pool-executor.ts';
import { AppError } from '../lib/errors.ts';
import { checkConstraints, resolveConstraints } from '../modules/constraints/constraint-sets.service.ts';
import { analyseFit, bestNodeIndex, fitMethodsParagraph, fitPoints, nodeResult, parameterWords, type FitDefinition } from '../modules/fits/fit-analysis.ts';
import { readScenarioDocument, resolveTable, type CliIo } from './synth.ts';

const USAGE = 'usage: npm run fit -- <fit.json>   (fit.json: { "scenario": {…}, "constraints": […], "parameters": […], "systems"?, "seed"?, "workers"? })';

class FitCliError extends Error {}

/**
 * `npm run fit -- fit.json`: the fit the API runs (POST /api/fits), computed on this machine's
 * threads in one pass over the same draws, printed as GET /api/fits/:id prints it (progress on stderr).
 */
export async function main(argv: readonly string[], io: CliIo): Promise<number> {
  try {
    if (argv.length !== 1 || argv[0] === '--help' || argv[0] === '-h') throw new FitCliError(USAGE);
    const raw = await readScenarioDocument(argv[0]);
    const parsed = fitFileSchema.safeParse(raw);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      throw new FitCliError(`${argv[0]}: ${issue.path.map(String).join('.') || '(file)'}: ${issue.message}`);
    }
    const file = parsed.data;
    const document = (await resolveTable(file.scenario)) as Record<string, unknown>;
    const base = parseScenario({ ...document, ...(file.systems !== undefined ? { systems: file.systems } : {}), ...(file.seed !== undefined ? { seed: file.seed } : {}) });
    file.parameters.forEach((p, i) => {
      for (const end of ['min', 'max'] as const) {
        try {
          withParameter(base, p.path, p[end]);
        } catch (error) {
          if (error instanceof ScenarioValidationError) throw new FitCliError(`parameters[${i}].${end} = ${p[end]}: ${error.issues[0]?.message ?? 'invalid'}`);
          throw error;
        }
      }
    });
    let constraints;
    try {
      constraints = resolveConstraints(checkConstraints(file.constraints as Record<string, unknown>[]));
    } catch (error) {
      if (error instanceof AppError) throw new FitCliError(`${argv[0]}: ${error.message}`);
      throw error;
    }
    const points = fitPoints(file.parameters);
    const scenarios = points.map((values) => scenarioAtPoint(base, values));
    const { chunkCount } = planChunks(base.systems);
    const totals = scenarios.map((s) => emptyTallyFor(scenarioHash(s)));
    const pool = createEnginePool({ workers: file.workers ?? defaultWorkerCount() });
    const started = performance.now();
    try {
      const executor = createPoolExecutor({ pool });
      const pending = Array.from({ length: chunkCount }, (_, i) => i);
      let done = 0;
      let lastReport = 0;
      for await (const batch of executor.execute({ runId: 'local', scenario: scenarios[0], pending, signal: new AbortController().signal, points })) {
        addPackedIntoAll(totals, batch.pointTallies!);
        done += batch.chunks.length;
        const now = performance.now();
        if (done === chunkCount || now - lastReport > 1000) {
          lastReport = now;
          io.stderr(`chunk ${done}/${chunkCount} of ${points.length} grid points (${((100 * done) / chunkCount).toFixed(1)}%)\n`);
        }
      }
    } finally {
      await pool.destroy();
    }
    const definition: FitDefinition = { scenario: scenarios[0], parameters: file.parameters, constraints, constraintSet: { id: 'file', name: argv[0], version: null } };
    const posterior = analyseFit(definition, points.length, (i) => nodeResult(scenarios[i], totals[i]));
    const best = bestNodeIndex(file.parameters, posterior);
    const bestModel = best >= 0 ? { scenario: scenarios[best], result: nodeResult(scenarios[best], totals[best]) } : undefined;
    const methods = fitMethodsParagraph(definition, posterior, { engineVersion: ENGINE_VERSION, fitId: null, scenarioName: argv[0], best: bestModel });
    io.stderr(`done: ${points.length} grid points × ${base.systems} systems in ${((performance.now() - started) / 1000).toFixed(2)} s\n${posterior.sentence}\n`);
    const now = new Date().toISOString();
    const output: FitDetail = {
      id: 'local',
      name: `${argv[0]}: ${file.parameters.map((p) => parameterWords(p.path).label).join(' × ')}`,
      status: 'succeeded',
      progress: 1,
      chunksDone: chunkCount,
      chunkCount,
      etaSeconds: null,
      createdAt: now,
      scenarioName: argv[0],
      constraintSetName: argv[0],
      parameters: file.parameters.map((p) => p.path),
      ownerUserId: null,
      implied: null,
      scenarioId: null,
      scenarioVersion: null,
      constraintSetId: null,
      constraintSetVersion: null,
      grid: file.parameters.map((p) => ({ ...p, ...parameterWords(p.path) })),
      pointCount: points.length,
      systems: base.systems,
      seed: base.seed,
      engineVersion: ENGINE_VERSION,
      costCredits: null,
      runId: null,
      error: null,
      finishedAt: now,
      posterior,
      methods,
    };
    io.stdout(`${JSON.stringify(output, null, 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof ScenarioValidationError) {
      io.stderr(`invalid scenario: ${error.issues.map((i) => i.message).join('; ')}\n`);
      return 2;
    }
    if (error instanceof FitCliError || error instanceof EngineError) {
      io.stderr(`${error.message}\n`);
      return 2;
    }
    io.stderr(`fit failed: ${(error as Error)?.stack ?? String(error)}\n`);
    return 1;
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  process.exitCode = await main(process.argv.slice(2), { stdout: (t) => process.stdout.write(t), stderr: (t) => process.stderr.write(t) });
}
