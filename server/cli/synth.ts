import { readFile, writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { occurrenceTableSchema } from '../../shared/contracts/occurrence-table.ts';
import { parseScenario, ScenarioValidationError } from '../../shared/contracts/scenario.ts';
import { EngineError } from '../../shared/engine/errors.ts';
import { runScenario } from '../engine-pool/run-scenario.ts';
import type { Constraint } from '../../shared/contracts/constraints.ts';
import { AppError } from '../lib/errors.ts';
import { checkConstraints, resolveConstraints } from '../modules/constraints/constraint-sets.service.ts';
import { evaluateConstraints } from '../modules/constraints/evaluate.ts';

const USAGE = 'usage: npm run synth -- <scenario.json> [--workers N] [--out result.json] [--constraints set.json]';
/** Stored occurrence tables the CLI resolves `companions.tableId` against. */
const TABLE_DIR = new URL('../../shared/scenarios/', import.meta.url);

export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

class CliError extends Error {
  constructor(message: string, readonly exitCode = 2) {
    super(message);
  }
}

interface CliArgs {
  scenarioPath: string;
  workers?: number;
  out?: string;
  constraints?: string;
}

function readArgs(argv: readonly string[]): CliArgs {
  let parsed: { values: { workers?: string; out?: string; constraints?: string; help?: boolean }; positionals: string[] };
  try {
    parsed = parseArgs({
      args: [...argv],
      allowPositionals: true,
      strict: true,
      options: { workers: { type: 'string' }, out: { type: 'string' }, constraints: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
    });
  } catch (error) {
    // parseArgs names the option in its message (unknown option, or an option missing its value).
    throw new CliError(`${(error as Error).message}\n${USAGE}`);
  }
  const { values, positionals } = parsed;
  if (values.help) throw new CliError(USAGE, 0);
  let workers: number | undefined;
  if (values.workers !== undefined) {
    workers = Number(values.workers);
    if (!Number.isInteger(workers) || workers < 1 || workers > 256) throw new CliError(`--workers must be an integer between 1 and 256 (got ${values.workers})\n${USAGE}`);
  }
  if (values.out === '') throw new CliError(`--out needs a file name\n${USAGE}`);
  if (values.constraints === '') throw new CliError(`--constraints needs a constraint-set file name\n${USAGE}`);
  if (positionals.length === 0) throw new CliError(`no scenario file given\n${USAGE}`);
  if (positionals.length > 1) throw new CliError(`only one scenario file may be given (got ${positionals.join(' and ')})\n${USAGE}`);
  return { scenarioPath: positionals[0], workers, out: values.out, constraints: values.constraints };
}

export async function readScenarioDocument(path: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    throw new CliError(`cannot read scenario file ${path}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  }
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new CliError(`scenario file ${path} is not valid JSON: ${(error as Error).message}`);
  }
}

/** Replaces `companions.tableId` by the rows of the stored table shared/scenarios/<tableId>.json. */
export async function resolveTable(document: unknown): Promise<unknown> {
  const companions = (document as { companions?: { tableId?: unknown; rows?: unknown } } | null)?.companions;
  if (!companions || typeof companions.tableId !== 'string' || companions.rows !== undefined) return document;
  const id = companions.tableId;
  if (!/^[a-z0-9][a-z0-9-]{0,99}$/.test(id)) throw new CliError(`companions.tableId must be a stored table name of lower-case letters, digits and dashes (got ${JSON.stringify(id)})`);
  let table: unknown;
  try {
    table = JSON.parse(await readFile(new URL(`${id}.json`, TABLE_DIR), 'utf8'));
  } catch {
    throw new CliError(`companions.tableId ${JSON.stringify(id)} is not a stored table (looked for shared/scenarios/${id}.json)`);
  }
  const parsed = occurrenceTableSchema.safeParse(table);
  if (!parsed.success) throw new CliError(`stored table ${id} is not a valid occurrence table: ${parsed.error.issues[0]?.message}`);
  const { tableId: _drop, ...rest } = companions;
  void _drop;
  return { ...(document as object), companions: { ...rest, rows: parsed.data.rows } };
}

/** A constraint set file: { "name"?, "constraints": [ … ] }, checked exactly as the API checks a set. */
async function readConstraintSet(path: string): Promise<{ name: string; constraints: Constraint[] }> {
  const document = (await readScenarioDocument(path).catch((error: Error) => {
    throw new CliError(error.message.replace('scenario file', 'constraint-set file'));
  })) as { name?: unknown; constraints?: unknown } | null;
  if (!document || !Array.isArray(document.constraints)) throw new CliError(`constraint-set file ${path} must hold { "constraints": [ … ] }`);
  try {
    return { name: typeof document.name === 'string' ? document.name : path, constraints: checkConstraints(document.constraints as Record<string, unknown>[]) };
  } catch (error) {
    if (error instanceof AppError) {
      const details = (error.details ?? []).map((d) => `\n  line ${d.line}${d.column ? `, column ${d.column}` : ''}: ${d.message}`).join('');
      throw new CliError(`constraint-set file ${path}: ${error.message}${details}`);
    }
    throw error;
  }
}

/** The CLI without process globals: returns the exit code. */
export async function main(argv: readonly string[], io: CliIo): Promise<number> {
  try {
    const args = readArgs(argv);
    const document = await resolveTable(await readScenarioDocument(args.scenarioPath));
    const scenario = parseScenario(document);
    const constraintSet = args.constraints ? await readConstraintSet(args.constraints) : undefined;
    const started = performance.now();
    let lastReport = 0;
    const result = await runScenario(scenario, {
      workers: args.workers,
      onProgress: (p) => {
        const now = performance.now();
        if (p.chunksDone < p.chunkCount && now - lastReport < 1000) return;
        lastReport = now;
        const percent = ((100 * p.systemsDone) / p.systems).toFixed(1);
        const fraction = p.fraction === null ? '—' : p.fraction.toFixed(5);
        io.stderr(`chunk ${p.chunksDone}/${p.chunkCount} (${percent}%), running magnetic fraction ${fraction}\n`);
      },
    });
    const seconds = (performance.now() - started) / 1000;
    io.stderr(`done: ${scenario.systems} systems in ${seconds.toFixed(2)} s; magnetic fraction ${result.fraction.value} ± ${result.fraction.se}\n`);
    const evaluation = constraintSet && evaluateConstraints(result, resolveConstraints(constraintSet.constraints), { id: args.constraints!, name: constraintSet.name, version: null });
    if (evaluation) io.stderr(`evaluation: ${evaluation.combined.verdict}\n`);
    const output = evaluation ? { ...result, evaluation } : result;
    const json = `${JSON.stringify(output, null, 2)}\n`;
    if (args.out) {
      await writeFile(args.out, json);
      io.stderr(`result written to ${args.out}\n`);
    } else {
      io.stdout(json);
    }
    return 0;
  } catch (error) {
    if (error instanceof ScenarioValidationError) {
      io.stderr(`invalid scenario (${error.issues.length} problem${error.issues.length === 1 ? '' : 's'}):\n`);
      for (const issue of error.issues) io.stderr(`  ${issue.message}\n`);
      return 2;
    }
    if (error instanceof CliError) {
      (error.exitCode === 0 ? io.stdout : io.stderr)(`${error.message}\n`);
      return error.exitCode;
    }
    if (error instanceof EngineError) {
      io.stderr(`engine error: ${error.message}\n`);
      return 2;
    }
    io.stderr(`run failed: ${(error as Error)?.stack ?? String(error)}\n`);
    return 1;
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const code = await main(process.argv.slice(2), {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
  });
  process.exitCode = code;
}
