import type { Scenario } from '../../../shared/contracts/scenario.ts';
import { EXPORT_FORMATS, type ExportListing, type ExportQuery } from '../../../shared/contracts/exports.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { scenarioHash } from '../../../shared/engine/kernel/scenario-hash.ts';
import { methodsUsed } from '../../../shared/engine/result/methods.ts';
import { AppError, badRequest } from '../../lib/errors.ts';
import { runsOfSweep } from '../runs/runs.repository.ts';
import type { RunsService } from '../runs/runs.service.ts';
import type { SweepsService } from '../sweeps/sweeps.service.ts';
import { bibEntries, distinctReferences, toBibtex } from './bibtex.ts';
import { toEcsv } from './ecsv.ts';
import type { ExportProvenance } from './export-table.ts';
import { runTables, type RunTableResult } from './run-tables.ts';
import { sweepTables, type SweepTableSource } from './sweep-tables.ts';
import type { TableRegistry } from './table-registry.ts';
import { toVotable } from './votable.ts';

export interface ExportFile {
  contentType: string;
  filename: string;
  body: string;
}

/** Either the listing (no format) or one rendered table. */
export type ExportAnswer = { listing: ExportListing } | { file: ExportFile };

const CONTENT_TYPE = { ecsv: 'text/x-ecsv', votable: 'application/x-votable+xml' } as const;
const EXTENSION = { ecsv: 'ecsv', votable: 'vot' } as const;

/** References that are publications (those with a year), each once. */
const publishedReferences = (references: string[]) => distinctReferences(references).filter((r) => /\b\d{4}\b/.test(r));

function render<S>(registry: TableRegistry<S>, source: S, provenance: ExportProvenance, query: ExportQuery): ExportAnswer {
  if (!query.format) return { listing: { formats: EXPORT_FORMATS, tables: registry.listing(source) } };
  if (!query.table) throw badRequest(`table is required with format=${query.format} (one of ${registry.listing(source).map((t) => t.name).join(', ')})`, 'table');
  const table = registry.build(query.table, source);
  if (!table) {
    throw new AppError({
      code: 'invalid_input', status: 400, field: 'table',
      message: `table must be one of ${registry.listing(source).map((t) => t.name).join(', ')} for this ${provenance.kind} (got "${query.table}")`,
    });
  }
  const body = query.format === 'ecsv' ? toEcsv(table, provenance) : toVotable(table, provenance);
  return { file: { contentType: CONTENT_TYPE[query.format], filename: `tidefield-${provenance.kind}-${provenance.id}-${table.name}.${EXTENSION[query.format]}`, body } };
}

/**
 * Table exports (ECSV, VOTable) and BibTeX of runs and sweeps. Every call names the department
 * that owns the object: the caller's for the signed-in routes, a share link's for public reads.
 */
export function createExportsService(deps: { db: Db; config: Config; runs: RunsService; sweeps: SweepsService }) {
  const { db, config, runs, sweeps } = deps;
  const base = publicBaseUrl(config);

  async function runSource(departmentId: string, id: string) {
    const { run, result } = await runs.finishedResult(departmentId, id);
    const provenance: ExportProvenance = {
      kind: 'run', id,
      engineVersion: result.engineVersion, scenarioHash: result.scenarioHash, seed: result.seed, systems: result.systems,
      scenario: run.snapshot,
      references: publishedReferences(result.methods.map((m) => m.reference)),
      url: `${base}/runs/${id}`,
    };
    return { result: result as unknown as RunTableResult, provenance, methods: result.methods };
  }

  async function sweepSource(departmentId: string, id: string) {
    const detail = await sweeps.detailIn(departmentId, id);
    const first = (await runsOfSweep(db, id)).find((r) => r.sweepPointIndex === 0);
    const scenario: Scenario | null = first ? first.snapshot : null;
    const provenance: ExportProvenance = {
      kind: 'sweep', id,
      engineVersion: first?.engineVersion ?? 'unknown',
      // The hash of grid point 0's scenario; every other point differs from it only in the swept values.
      scenarioHash: scenario ? scenarioHash(scenario) : '',
      seed: detail.seed, systems: detail.systems,
      scenario: { document: scenario, axes: detail.axes.map(({ path, values }) => ({ path, values })) },
      references: scenario ? publishedReferences(methodsUsed(scenario).map((m) => m.reference)) : [],
      url: `${base}/sweeps/${id}`,
    };
    return { detail: detail as SweepTableSource, provenance };
  }

  return {
    async runExport(departmentId: string, id: string, query: ExportQuery): Promise<ExportAnswer> {
      const { result, provenance } = await runSource(departmentId, id);
      return render(runTables, result, provenance, query);
    },

    async runReferences(departmentId: string, id: string): Promise<ExportFile> {
      const { methods, provenance } = await runSource(departmentId, id);
      const header = `References of Tidefield run ${id} (engine ${provenance.engineVersion}, scenario SHA-256 ${provenance.scenarioHash}, seed "${provenance.seed}").\nDOIs are given where known for certain; entries without one are journals or books without a DOI.`;
      return { contentType: 'application/x-bibtex', filename: `tidefield-run-${id}.bib`, body: toBibtex(bibEntries(methods.map((m) => m.reference)), header) };
    },

    async sweepExport(departmentId: string, id: string, query: ExportQuery): Promise<ExportAnswer> {
      const { detail, provenance } = await sweepSource(departmentId, id);
      return render(sweepTables, detail, provenance, query);
    },
  };
}

export type ExportsService = ReturnType<typeof createExportsService>;
