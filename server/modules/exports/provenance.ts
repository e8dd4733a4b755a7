import type { ExportProvenance } from './export-table.ts';

/** The provenance block both writers carry (ECSV meta, VOTable INFO elements). */
export function provenanceMeta(p: ExportProvenance) {
  return {
    producer: 'Tidefield',
    object: p.kind,
    id: p.id,
    ...(p.url ? { url: p.url } : {}),
    engine_version: p.engineVersion,
    scenario_hash: p.scenarioHash,
    seed: p.seed,
    systems: p.systems,
    scenario: p.scenario,
    references: p.references,
  };
}
